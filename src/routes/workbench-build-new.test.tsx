// @vitest-environment happy-dom
import { cleanup, fireEvent, screen, waitFor, within } from '@testing-library/react';
import { afterEach, describe, expect, it } from 'vitest';
import type { BuildCreate } from '../shared/schemas/builds';
import { creator, json, makeBuild, renderApp, type Call } from './workbench-test-app';

afterEach(() => {
  cleanup();
});

function posted(calls: Call[]): BuildCreate | undefined {
  return calls.find((c) => c.method === 'POST' && c.url === '/api/builds')?.body as BuildCreate | undefined;
}

async function fillAndSubmit(fields: { title: string; currency: string; budget: string }) {
  fireEvent.change(await screen.findByLabelText('Title'), { target: { value: fields.title } });
  fireEvent.change(screen.getByRole('combobox', { name: 'Currency' }), { target: { value: fields.currency } });
  fireEvent.change(screen.getByLabelText('Budget'), { target: { value: fields.budget } });
  fireEvent.click(screen.getByRole('button', { name: 'Start the build' }));
}

const created =
  (id = 12) =>
  (method: string, url: string) =>
    method === 'POST' && url === '/api/builds' ? json(201, makeBuild({ id, title: 'Kestrel hatchback, rust and all' })) : undefined;

describe('Start a build', () => {
  it('converts a budget of 1234.5 EUR to 123450 minor units and opens the new build', async () => {
    const { calls, router } = renderApp('/workbench/builds/new', creator, (method, url) => {
      if (url === '/api/builds/12') return json(200, makeBuild({ id: 12 }));
      if (url === '/api/builds/12/episodes') return json(200, { items: [] });
      return created()(method, url);
    });
    await fillAndSubmit({ title: 'Kestrel hatchback, rust and all', currency: 'eur', budget: '1234.5' });

    await waitFor(() => expect(router.state.location.pathname).toBe('/workbench/builds/12'));
    const body = posted(calls)!;
    expect(body.currency).toBe('EUR');
    expect(body.budgetMinor).toBe(123450);
    expect(body.visibility).toBe('private');
    expect(body.videoLinkPattern).toBe('t={seconds}');
    expect(body.vehicleMake).toBeNull();
    // The default systems (DESIGN.md), brakes safety-critical, engine not.
    expect(body.systems?.find((s) => s.key === 'brakes')?.safetyCritical).toBe(true);
    expect(body.systems?.find((s) => s.key === 'engine')?.safetyCritical).toBe(false);
    expect(await screen.findByText(/You started Kestrel hatchback, rust and all/)).toBeTruthy();
  });

  it('converts 1234 JPY to 1234 (yen has no minor unit) and refuses 1234.5 JPY', async () => {
    const { calls } = renderApp('/workbench/builds/new', creator, created());
    await fillAndSubmit({ title: 'Kestrel hatchback', currency: 'JPY', budget: '1234.5' });
    expect(await screen.findByText('JPY has no minor unit: a whole amount')).toBeTruthy();
    expect(posted(calls)).toBeUndefined();

    fireEvent.change(screen.getByLabelText('Budget'), { target: { value: '1234' } });
    fireEvent.click(screen.getByRole('button', { name: 'Start the build' }));
    await waitFor(() => expect(posted(calls)?.budgetMinor).toBe(1234));
  });

  it('shows the link a chapter at 1:05 would get, live', async () => {
    renderApp('/workbench/builds/new', creator);
    const pattern = await screen.findByLabelText('Start-time link pattern');
    const output = document.getElementById(pattern.getAttribute('aria-controls')!)!;
    expect(output.textContent).toBe('https://video.example/watch?v=k7Rq2bHatch&t=65');

    fireEvent.change(pattern, { target: { value: '#t={seconds}' } });
    expect(output.textContent).toBe('https://video.example/watch?v=k7Rq2bHatch#t=65');

    fireEvent.change(pattern, { target: { value: 'start=65' } });
    expect(output.textContent).toBe('Fix the pattern above to see the link.');
  });

  it('edits the vehicle systems: add, rename, flag, remove', async () => {
    const { calls } = renderApp('/workbench/builds/new', creator, created());
    fireEvent.change(await screen.findByLabelText('Add your own system'), { target: { value: 'Cooling' } });
    fireEvent.click(screen.getByRole('button', { name: 'Add system' }));
    const added = screen.getByLabelText('Name of system 11') as HTMLInputElement;
    expect(added.value).toBe('Cooling');
    fireEvent.change(added, { target: { value: 'Sidecar' } });
    fireEvent.click(screen.getByRole('checkbox', { name: 'Safety-critical: Sidecar' }));
    fireEvent.click(screen.getByRole('button', { name: 'Remove Interior' }));
    fireEvent.change(screen.getByLabelText('Name of system 1'), { target: { value: 'Cooling and heater' } });

    await fillAndSubmit({ title: 'Kestrel hatchback', currency: 'EUR', budget: '' });
    await waitFor(() => expect(posted(calls)).toBeDefined());
    const systems = posted(calls)!.systems!;
    expect(systems.find((s) => s.key === 'cooling')?.name).toBe('Cooling and heater');
    expect(systems.find((s) => s.key === 'sidecar')).toEqual({ key: 'sidecar', name: 'Sidecar', safetyCritical: true });
    expect(systems.some((s) => s.key === 'interior')).toBe(false);
    expect(posted(calls)!.budgetMinor).toBeNull();
  });

  it('shows the server’s field errors on the fields', async () => {
    renderApp('/workbench/builds/new', creator, (method, url) =>
      method === 'POST' && url === '/api/builds'
        ? json(400, {
            error: {
              code: 'invalid',
              message: 'Some fields need attention',
              fields: { title: ['a build of yours already has this title'], budgetMinor: ['too large for this currency'] },
            },
          })
        : undefined,
    );
    await fillAndSubmit({ title: 'Kestrel hatchback', currency: 'EUR', budget: '10' });
    expect(await screen.findByText('A build of yours already has this title')).toBeTruthy();
    expect(screen.getByText('Too large for this currency')).toBeTruthy();
    expect(screen.getByLabelText('Title').getAttribute('aria-invalid')).toBe('true');
    expect(screen.getByLabelText('Budget').getAttribute('aria-invalid')).toBe('true');
  });

  it('explains the three visibilities', async () => {
    renderApp('/workbench/builds/new', creator);
    const group = await screen.findByRole('group', { name: 'Who can read it' });
    expect((within(group).getByRole('radio', { name: 'Private' }) as HTMLInputElement).checked).toBe(true);
    expect(within(group).getByText(/left off the front page, the site feed and search/)).toBeTruthy();
  });
});
