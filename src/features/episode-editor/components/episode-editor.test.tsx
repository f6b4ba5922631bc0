// @vitest-environment happy-dom
import { cleanup, fireEvent, render, screen } from '@testing-library/react';
import { createMemoryRouter, RouterProvider } from 'react-router';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { DEFAULT_SYSTEMS, type Build } from '../../../shared/schemas/builds';
import { createFakeServer, makeEpisode, makeWrapper } from '../testing/fake-api';
import { EpisodeEditor } from './episode-editor';

// Renders the whole editor, Tiptap included. Tiptap needs a fair amount of DOM; if happy-dom
// ever falls short, the hook and panel tests still cover the behaviour around it.

afterEach(() => {
  cleanup();
  localStorage.clear();
  vi.restoreAllMocks();
});

const build: Build = {
  id: 7,
  slug: 'alderton-175-trail',
  owner: { id: 1, handle: 'moss_garage', displayName: 'Moss Garage' },
  title: 'Alderton 175 Trail',
  vehicleKind: 'motorcycle',
  vehicleMake: 'Alderton',
  vehicleModel: '175 Trail',
  vehicleYear: '1968',
  summary: null,
  currency: 'GBP',
  budgetMinor: null,
  visibility: 'public',
  videoLinkPattern: 't={seconds}',
  systems: [...DEFAULT_SYSTEMS],
  role: 'owner',
  hoursWorked: 0,
  episodeCount: 4,
  pendingTransferTo: null,
  deletedAt: null,
  createdAt: '2026-11-01T10:00:00.000Z',
  updatedAt: '2026-11-01T10:00:00.000Z',
};

function renderWithBuildPage() {
  const episode = makeEpisode();
  const server = createFakeServer(episode);
  const Wrapper = makeWrapper(server.fetch);
  const router = createMemoryRouter(
    [
      { path: '/edit', element: <EpisodeEditor episode={episode} build={build} /> },
      { path: '/builds/:handle/:slug', element: <p>Build page</p> },
    ],
    { initialEntries: ['/edit'] },
  );
  render(
    <Wrapper>
      <RouterProvider router={router} />
    </Wrapper>,
  );
  return { server };
}

describe('EpisodeEditor', () => {
  it('renders the fields, the write-up and the panels, and says it is saved', async () => {
    const episode = makeEpisode({ raisedVehicle: true });
    const server = createFakeServer(episode);
    const Wrapper = makeWrapper(server.fetch);
    const router = createMemoryRouter([{ path: '/', element: <EpisodeEditor episode={episode} build={undefined} /> }]);
    render(
      <Wrapper>
        <RouterProvider router={router} />
      </Wrapper>,
    );
    expect(screen.getByRole('heading', { level: 1 }).textContent).toBe('A seized caliper');
    expect(screen.getByText('Saved')).toBeTruthy();
    expect((screen.getByLabelText('Title') as HTMLInputElement).value).toBe('A seized caliper');
    expect(screen.getByText(/work under a raised vehicle: support it on stands/)).toBeTruthy();
    expect(await screen.findByRole('toolbar', { name: 'Write-up formatting' })).toBeTruthy();
    expect(screen.getByRole('textbox', { name: 'Write-up' }).textContent).toContain('Thirty years in a hedge.');

    fireEvent.change(screen.getByLabelText('Title'), { target: { value: '' } });
    expect(screen.getByText('Needs a title')).toBeTruthy();
    expect(screen.getByText(/Not saved yet — finish the marked fields/)).toBeTruthy();
  });

  it('saves before following a link away, then goes', async () => {
    const { server } = renderWithBuildPage();
    fireEvent.change(screen.getByLabelText('Title'), { target: { value: 'Caliper back on' } });
    fireEvent.click(screen.getByRole('link', { name: 'Alderton 175 Trail' }));
    expect(await screen.findByText('Build page')).toBeTruthy();
    expect(server.patches()[0]?.body).toEqual({ version: 1, title: 'Caliper back on' });
  });

  it('asks before leaving when the last save cannot happen', async () => {
    let online = false;
    vi.spyOn(navigator, 'onLine', 'get').mockImplementation(() => online);
    const { server } = renderWithBuildPage();
    fireEvent.change(screen.getByLabelText('Title'), { target: { value: 'Typed offline' } });
    fireEvent.click(screen.getByRole('link', { name: 'Alderton 175 Trail' }));
    expect(await screen.findByText('Leave with changes not yet saved?')).toBeTruthy();
    expect(server.patches()).toHaveLength(0);
    fireEvent.click(screen.getByRole('button', { name: 'Stay here' }));
    expect(screen.queryByText('Build page')).toBeNull();
    online = true;
  });
});
