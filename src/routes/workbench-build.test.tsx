// @vitest-environment happy-dom
import { cleanup, fireEvent, screen, waitFor, within } from '@testing-library/react';
import { afterEach, describe, expect, it } from 'vitest';
import type { EpisodeSummary } from '../shared/schemas/episodes';
import { creator, json, makeBuild, makeEpisode, renderApp } from './workbench-test-app';

function summary(overrides: Partial<EpisodeSummary>): EpisodeSummary {
  return {
    id: 1,
    buildId: 7,
    number: 1,
    slug: 'e',
    title: 'Episode',
    status: 'published',
    publishAt: null,
    publishedAt: '2026-10-10T10:00:00.000Z',
    hoursWorked: 4,
    updatedAt: '2026-10-10T10:00:00.000Z',
    ...overrides,
  };
}

const episodes = {
  items: [
    summary({ id: 3, number: 3, title: 'Rear subframe', status: 'draft', publishedAt: null, hoursWorked: null }),
    summary({ id: 1, number: 1, title: 'Dragging it out of the barn' }),
    summary({ id: 2, number: 2, title: 'Brake lines', status: 'scheduled', publishedAt: null, publishAt: '2026-12-05T17:30:00.000Z' }),
  ],
};

afterEach(() => {
  cleanup();
});

describe('Build team page of a build', () => {
  it('lists the episodes in number order with their status, and starts a new one in the editor', async () => {
    const { calls, router } = renderApp('/workbench/builds/7', creator, (method, url, body) => {
      if (url === '/api/builds/7') return json(200, makeBuild());
      if (url === '/api/builds/7/episodes' && method === 'GET') return json(200, episodes);
      if (url === '/api/builds/7/episodes' && method === 'POST') return json(201, makeEpisode({ id: 44, ...(body as object) }));
      return undefined;
    });
    const region = await screen.findByRole('region', { name: 'Episodes' });
    await within(region).findByText('Dragging it out of the barn');
    const titles = within(region)
      .getAllByRole('link')
      .map((a) => a.textContent);
    expect(titles).toEqual(['Episode 1: Dragging it out of the barn', 'Episode 2: Brake lines', 'Episode 3: Rear subframe']);
    expect(within(region).getByRole('link', { name: 'Episode 2: Brake lines' }).getAttribute('href')).toBe('/workbench/episodes/2/edit');
    expect(within(region).getByText('scheduled')).toBeTruthy();
    expect(within(region).getByText('draft')).toBeTruthy();
    expect(screen.getByRole('link', { name: 'Build settings' }).getAttribute('href')).toBe('/workbench/builds/7/settings');
    expect(screen.getByRole('link', { name: 'Build team' }).getAttribute('href')).toBe('/account/builds/7/team');

    const form = screen.getByRole('region', { name: 'New episode' });
    fireEvent.change(within(form).getByLabelText('Title'), { target: { value: 'Welding in the new floor' } });
    fireEvent.click(within(form).getByRole('button', { name: 'Start the episode' }));
    // The editor is a lazy route: its first import (Tiptap, the panels) can take over a second on a busy machine.
    await waitFor(() => expect(router.state.location.pathname).toBe('/workbench/episodes/44/edit'), { timeout: 5000 });
    expect(calls.find((c) => c.method === 'POST')?.body).toEqual({ title: 'Welding in the new floor' });
  });

  it('asks before deleting an episode, naming it', async () => {
    const { calls } = renderApp('/workbench/builds/7', creator, (method, url) => {
      if (url === '/api/builds/7') return json(200, makeBuild());
      if (url === '/api/builds/7/episodes') return json(200, episodes);
      if (url === '/api/episodes/3' && method === 'DELETE') return new Response(null, { status: 204 });
      return undefined;
    });
    fireEvent.click(await screen.findByRole('button', { name: 'Delete episode 3, Rear subframe' }));
    const dialog = screen.getByRole('dialog', { name: 'Delete episode 3, “Rear subframe”?' });
    fireEvent.click(within(dialog).getByRole('button', { name: 'Delete episode' }));
    await waitFor(() => expect(calls.some((c) => c.method === 'DELETE' && c.url === '/api/episodes/3')).toBe(true));
  });

  it('answers a build that is not visible with the 404 page', async () => {
    renderApp('/workbench/builds/99', creator);
    expect(await screen.findByRole('heading', { name: 'Nothing on this bench' })).toBeTruthy();
  });

  it('answers a public build of someone else with the 404 page too', async () => {
    renderApp('/workbench/builds/7', creator, (_m, url) => (url === '/api/builds/7' ? json(200, makeBuild({ role: null })) : undefined));
    expect(await screen.findByRole('heading', { name: 'Nothing on this bench' })).toBeTruthy();
  });
});
