// @vitest-environment happy-dom
import { cleanup, fireEvent, screen, waitFor, within } from '@testing-library/react';
import { afterEach, describe, expect, it } from 'vitest';
import { formatUtcDateTime } from '../components/ui/local-time';
import type { Workbench } from '../shared/schemas/episodes';
import { creator, json, makeBuild, makeEpisode, renderApp } from './workbench-test-app';

const emptyWorkbench: Workbench = {
  builds: [],
  drafts: [],
  scheduled: [],
  deleted: [],
  pendingTransfers: [],
  onOrder: [],
  unansweredPosts: [],
  openPostCount: 0,
};

const fullWorkbench: Workbench = {
  builds: [
    {
      id: 7,
      slug: 'kestrel-hatchback',
      title: 'Kestrel hatchback, rust and all',
      visibility: 'public',
      role: 'owner',
      episodeCount: 4,
      publishedCount: 3,
      lastPublishedAt: '2026-11-28T10:00:00.000Z',
      hoursWorked: 31.5,
    },
    {
      id: 8,
      slug: 'pellham-125',
      title: 'Pellham 125 two-stroke',
      visibility: 'private',
      role: 'editor',
      episodeCount: 0,
      publishedCount: 0,
      lastPublishedAt: null,
      hoursWorked: 0,
    },
  ],
  drafts: [
    {
      id: 41,
      buildId: 7,
      number: 4,
      slug: 'rear-subframe',
      title: 'Cutting out the rear subframe',
      status: 'draft',
      publishAt: null,
      publishedAt: null,
      hoursWorked: null,
      updatedAt: '2026-11-30T18:00:00.000Z',
      buildTitle: 'Kestrel hatchback, rust and all',
    },
  ],
  scheduled: [
    {
      id: 42,
      buildId: 8,
      number: 1,
      slug: 'first-kick',
      title: 'First kick in twenty years',
      status: 'scheduled',
      publishAt: '2026-12-05T17:30:00.000Z',
      publishedAt: null,
      hoursWorked: 2,
      updatedAt: '2026-11-30T18:00:00.000Z',
      buildTitle: 'Pellham 125 two-stroke',
    },
  ],
  deleted: [
    {
      kind: 'episode',
      id: 39,
      title: 'A false start',
      buildTitle: 'Pellham 125 two-stroke',
      deletedAt: '2026-11-25T10:00:00.000Z',
      purgeAfter: '2026-12-25T10:00:00.000Z',
    },
  ],
  pendingTransfers: [{ buildId: 9, buildTitle: 'Furrow 35 tractor', fromDisplayName: 'Ida Ironside' }],
  onOrder: [
    {
      id: 3,
      description: 'Front flexible hoses (pair)',
      grossMinor: 3850,
      currency: 'EUR',
      buildId: 7,
      buildTitle: 'Kestrel hatchback, rust and all',
      episodeId: 41,
      episodeNumber: 4,
      openItemTitle: 'Bleed the brakes',
    },
  ],
  unansweredPosts: [],
  openPostCount: 0,
};

afterEach(() => {
  cleanup();
});

describe('Workbench', () => {
  it('lists builds, drafts, scheduled episodes, offered and deleted ones', async () => {
    const { calls } = renderApp('/workbench', creator, (method, url) => {
      if (url === '/api/workbench') return json(200, fullWorkbench);
      if (method === 'POST' && url === '/api/builds/9/transfer/accept') return json(200, makeBuild({ id: 9, title: 'Furrow 35 tractor' }));
      return undefined;
    });

    const builds = await screen.findByRole('region', { name: 'Builds' });
    expect(within(builds).getByRole('link', { name: 'Kestrel hatchback, rust and all' }).getAttribute('href')).toBe('/workbench/builds/7');
    expect(within(builds).getByText('31.5 h')).toBeTruthy();
    expect(within(builds).getByText('28 Nov 2026')).toBeTruthy();
    expect(within(builds).getByText('Not yet')).toBeTruthy();
    expect(within(builds).getByText('editor')).toBeTruthy();

    const drafts = screen.getByRole('region', { name: 'Drafts' });
    expect(within(drafts).getByRole('link', { name: 'Cutting out the rear subframe' }).getAttribute('href')).toBe(
      '/workbench/episodes/41/edit',
    );

    const scheduled = screen.getByRole('region', { name: 'Scheduled' });
    const time = within(scheduled).getByRole('link', { name: 'First kick in twenty years' }).parentElement!.querySelector('time')!;
    expect(time.getAttribute('dateTime')).toBe('2026-12-05T17:30:00.000Z');
    // After mount the time is formatted in the reader's own locale and zone, no longer the server's UTC fallback.
    await waitFor(() => expect(time.textContent).not.toBe(formatUtcDateTime('2026-12-05T17:30:00.000Z')));
    expect(formatUtcDateTime('2026-12-05T17:30:00.000Z')).toBe('5 Dec 2026, 17:30 UTC');

    expect(within(screen.getByRole('region', { name: 'Unanswered posts' })).getByText('No unanswered posts.')).toBeTruthy();
    const onOrder = screen.getByRole('region', { name: 'Parts on order' });
    expect(within(onOrder).getByRole('link', { name: 'Front flexible hoses (pair)' }).getAttribute('href')).toBe(
      '/workbench/episodes/41/edit',
    );
    expect(within(onOrder).getByText('€38.50')).toBeTruthy();
    expect(within(onOrder).getByText(/holds up “Bleed the brakes”/)).toBeTruthy();

    const deleted = screen.getByRole('region', { name: 'Recently deleted' });
    expect(within(deleted).getByText('A false start')).toBeTruthy();
    expect(within(deleted).getByText('in Pellham 125 two-stroke')).toBeTruthy();
    expect(within(deleted).getByRole('button', { name: 'Undo deleting the episode A false start' })).toBeTruthy();

    const offered = screen.getByRole('region', { name: 'Builds offered to you' });
    fireEvent.click(within(offered).getByRole('button', { name: 'Accept the build Furrow 35 tractor' }));
    await waitFor(() => expect(calls.some((c) => c.method === 'POST' && c.url === '/api/builds/9/transfer/accept')).toBe(true));
  });

  it('restores a deleted episode with Undo', async () => {
    let restored = false;
    const { calls } = renderApp('/workbench', creator, (method, url) => {
      if (url === '/api/workbench') return json(200, restored ? { ...fullWorkbench, deleted: [] } : fullWorkbench);
      if (method === 'POST' && url === '/api/episodes/39/restore') {
        restored = true;
        return json(200, makeEpisode({ id: 39, title: 'A false start' }));
      }
      return undefined;
    });
    fireEvent.click(await screen.findByRole('button', { name: 'Undo deleting the episode A false start' }));
    await waitFor(() => expect(screen.queryByRole('region', { name: 'Recently deleted' })).toBeNull());
    expect(calls.find((c) => c.url === '/api/episodes/39/restore')?.body).toEqual({});
  });

  it('shows the empty state with "Start a build" when there are no builds', async () => {
    renderApp('/workbench', { ...creator, builds: [] }, (_m, url) => (url === '/api/workbench' ? json(200, emptyWorkbench) : undefined));
    const builds = await screen.findByRole('region', { name: 'Builds' });
    expect(within(builds).getByText('You have no builds yet.')).toBeTruthy();
    expect(within(builds).getByRole('link', { name: 'Start a build' }).getAttribute('href')).toBe('/workbench/builds/new');
    expect(screen.getByText('No drafts.')).toBeTruthy();
    expect(screen.getByText('Nothing scheduled.')).toBeTruthy();
    expect(screen.queryByRole('region', { name: 'Recently deleted' })).toBeNull();
    expect(screen.queryByRole('region', { name: 'Builds offered to you' })).toBeNull();
  });

  it('shows an error with a retry when the Workbench cannot be loaded', async () => {
    renderApp('/workbench', creator, (_m, url) =>
      url === '/api/workbench' ? json(500, { error: { code: 'internal', message: 'Boom' } }) : undefined,
    );
    const alert = await screen.findByRole('alert');
    expect(within(alert).getByText('Your workbench could not be loaded.')).toBeTruthy();
    expect(within(alert).getByRole('button', { name: 'Try again' })).toBeTruthy();
  });

  it('sends a visitor to sign in, coming back to the Workbench', async () => {
    const { router, calls } = renderApp('/workbench', null);
    expect(await screen.findByRole('heading', { level: 1, name: 'Sign in' })).toBeTruthy();
    expect(router.state.location.pathname + router.state.location.search).toBe('/sign-in?returnTo=/workbench');
    expect(calls.some((c) => c.url === '/api/workbench')).toBe(false);
  });

  it('puts Workbench first in the account menu of every signed-in person', async () => {
    renderApp('/workbench', { ...creator, builds: [] }, (_m, url) => (url === '/api/workbench' ? json(200, emptyWorkbench) : undefined));
    fireEvent.click(await screen.findByRole('button', { name: /Moss Garage/ }));
    const links = screen.getByText(/Signed in as/).parentElement!.querySelectorAll('a');
    expect(links[0]?.textContent).toBe('Workbench');
    expect(links[0]?.getAttribute('href')).toBe('/workbench');
  });
});
