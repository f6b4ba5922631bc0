// @vitest-environment happy-dom
import { cleanup, fireEvent, screen, waitFor, within } from '@testing-library/react';
import { afterEach, describe, expect, it } from 'vitest';
import type { Workbench } from '../shared/schemas/episodes';
import { creator, json, makeBuild, renderApp } from './workbench-test-app';

const members = {
  items: [
    { userId: 3, handle: 'moss-garage', displayName: 'Moss Garage', avatarUrl: null, role: 'owner' },
    { userId: 5, handle: 'iron-ida', displayName: 'Ida Ironside', avatarUrl: null, role: 'editor' },
  ],
};

const afterDelete: Workbench = {
  builds: [],
  drafts: [],
  scheduled: [],
  deleted: [
    {
      kind: 'build',
      id: 7,
      title: 'Kestrel hatchback, rust and all',
      buildTitle: null,
      deletedAt: '2026-12-01T10:00:00.000Z',
      purgeAfter: '2026-12-31T10:00:00.000Z',
    },
  ],
  pendingTransfers: [],
  onOrder: [],
  unansweredPosts: [],
  openPostCount: 0,
};

afterEach(() => {
  cleanup();
});

describe('Build settings', () => {
  it('asks before deleting, naming the build and its episodes, then shows Undo on the Workbench', async () => {
    const { calls, router } = renderApp('/workbench/builds/7/settings', creator, (method, url) => {
      if (url === '/api/builds/7' && method === 'GET') return json(200, makeBuild());
      if (url === '/api/builds/7/members') return json(200, members);
      if (url === '/api/builds/7' && method === 'DELETE') return new Response(null, { status: 204 });
      if (url === '/api/workbench') return json(200, afterDelete);
      return undefined;
    });

    fireEvent.click(await screen.findByRole('button', { name: 'Delete this build' }));
    const dialog = screen.getByRole('dialog', { name: 'Delete “Kestrel hatchback, rust and all” and its 3 episodes?' });
    expect(within(dialog).getByText(/All 3 of its episodes go with it/)).toBeTruthy();
    expect(calls.some((c) => c.method === 'DELETE')).toBe(false);

    fireEvent.click(within(dialog).getByRole('button', { name: 'Delete build' }));
    await waitFor(() => expect(router.state.location.pathname).toBe('/workbench'));
    expect(calls.some((c) => c.method === 'DELETE' && c.url === '/api/builds/7')).toBe(true);
    const deleted = await screen.findByRole('region', { name: 'Recently deleted' });
    expect(within(deleted).getByRole('button', { name: 'Undo deleting the build Kestrel hatchback, rust and all' })).toBeTruthy();
    // The notice arrives in navigation state and is read in an effect, a render after the list: wait for it.
    expect(await screen.findByText(/is deleted. Undo it under “Recently deleted”/)).toBeTruthy();
  });

  it('keeps the build when the confirmation is cancelled', async () => {
    const { calls } = renderApp('/workbench/builds/7/settings', creator, (method, url) => {
      if (url === '/api/builds/7') return json(200, makeBuild({ episodeCount: 1 }));
      if (url === '/api/builds/7/members') return json(200, members);
      return undefined;
    });
    fireEvent.click(await screen.findByRole('button', { name: 'Delete this build' }));
    const dialog = screen.getByRole('dialog', { name: 'Delete “Kestrel hatchback, rust and all” and its episode?' });
    fireEvent.click(within(dialog).getByRole('button', { name: 'Keep the build' }));
    expect(screen.queryByRole('dialog')).toBeNull();
    expect(calls.some((c) => c.method === 'DELETE')).toBe(false);
  });

  it('sends only the changed fields, with the budget in minor units', async () => {
    const { calls } = renderApp('/workbench/builds/7/settings', creator, (method, url, body) => {
      if (url === '/api/builds/7' && method === 'GET') return json(200, makeBuild());
      if (url === '/api/builds/7/members') return json(200, members);
      if (url === '/api/builds/7' && method === 'PATCH')
        return json(200, makeBuild({ ...(body as object), updatedAt: '2026-12-01T10:00:00.000Z' }));
      return undefined;
    });
    const budget = (await screen.findByLabelText('Budget')) as HTMLInputElement;
    expect(budget.value).toBe('4500.00');
    fireEvent.change(budget, { target: { value: '5000.75' } });
    fireEvent.click(screen.getByRole('radio', { name: 'Unlisted' }));
    fireEvent.click(screen.getByRole('button', { name: 'Save settings' }));

    expect(await screen.findByText('The settings are saved.')).toBeTruthy();
    expect(calls.find((c) => c.method === 'PATCH')?.body).toEqual({ budgetMinor: 500075, visibility: 'unlisted' });
  });

  it('asks before saving without a vehicle system, naming it', async () => {
    const { calls } = renderApp('/workbench/builds/7/settings', creator, (method, url) => {
      if (url === '/api/builds/7' && method === 'GET') return json(200, makeBuild());
      if (url === '/api/builds/7/members') return json(200, members);
      if (url === '/api/builds/7' && method === 'PATCH') return json(200, makeBuild());
      return undefined;
    });
    fireEvent.click(await screen.findByRole('button', { name: 'Remove Interior' }));
    fireEvent.click(screen.getByRole('button', { name: 'Save settings' }));
    const dialog = await screen.findByRole('dialog', { name: 'Remove the Interior system from Kestrel hatchback, rust and all?' });
    expect(calls.some((c) => c.method === 'PATCH')).toBe(false);
    fireEvent.click(within(dialog).getByRole('button', { name: 'Remove system and save' }));
    await waitFor(() => expect(calls.some((c) => c.method === 'PATCH')).toBe(true));
    const sent = calls.find((c) => c.method === 'PATCH')!.body as { systems: Array<{ key: string }> };
    expect(Object.keys(sent)).toEqual(['systems']);
    expect(sent.systems.some((s) => s.key === 'interior')).toBe(false);
  });

  it('offers the build to an editor after a confirmation, and can withdraw it', async () => {
    let pending = false;
    const { calls } = renderApp('/workbench/builds/7/settings', creator, (method, url, body) => {
      if (url === '/api/builds/7')
        return json(200, makeBuild({ pendingTransferTo: pending ? { userId: 5, displayName: 'Ida Ironside' } : null }));
      if (url === '/api/builds/7/members') return json(200, members);
      if (url === '/api/builds/7/transfer' && method === 'POST') {
        expect(body).toEqual({ toUserId: 5 });
        pending = true;
        return json(200, makeBuild({ pendingTransferTo: { userId: 5, displayName: 'Ida Ironside' } }));
      }
      if (url === '/api/builds/7/transfer' && method === 'DELETE') {
        pending = false;
        return new Response(null, { status: 204 });
      }
      return undefined;
    });
    const select = (await screen.findByRole('combobox', { name: 'Editor to hand the build to' })) as HTMLSelectElement;
    expect(
      within(select)
        .getAllByRole('option')
        .map((o) => o.textContent),
    ).toEqual(['Ida Ironside (@iron-ida)']);
    fireEvent.click(screen.getByRole('button', { name: 'Offer the build' }));
    fireEvent.click(
      within(screen.getByRole('dialog', { name: 'Offer Kestrel hatchback, rust and all to Ida Ironside?' })).getByRole('button', {
        name: 'Send the offer',
      }),
    );
    expect(await screen.findByText(/You offered this build to/)).toBeTruthy();

    fireEvent.click(screen.getByRole('button', { name: 'Withdraw the offer' }));
    expect(await screen.findByRole('button', { name: 'Offer the build' })).toBeTruthy();
    expect(calls.some((c) => c.method === 'DELETE' && c.url === '/api/builds/7/transfer')).toBe(true);
  });

  it('shows an editor the settings read-only', async () => {
    const editor = { ...creator, builds: [{ ...creator.builds[0]!, role: 'editor' as const }] };
    const { calls } = renderApp('/workbench/builds/7/settings', editor, (_m, url) =>
      url === '/api/builds/7' ? json(200, makeBuild({ role: 'editor' })) : undefined,
    );
    expect(await screen.findByText(/Only the build’s owner, Moss Garage, can change these settings/)).toBeTruthy();
    expect(screen.getByText('4,500.00 EUR')).toBeTruthy();
    expect(screen.queryByRole('button', { name: 'Save settings' })).toBeNull();
    expect(screen.queryByRole('button', { name: 'Delete this build' })).toBeNull();
    expect(calls.some((c) => c.url.endsWith('/members'))).toBe(false);
  });
});
