// @vitest-environment happy-dom
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { cleanup, render, screen, within } from '@testing-library/react';
import { createMemoryRouter, RouterProvider } from 'react-router';
import { afterEach, describe, expect, it } from 'vitest';
import { createApiClient } from '../lib/api-client';
import { ApiProvider } from '../lib/api-context';
import { latestEpisodesQuery, type EpisodeListItem, type LatestEpisodesResponse } from '../shared/schemas/episodes';
import { FRONT_PAGE_SIZE, FrontPage, frontPageQuery } from './front-page';

function episode(overrides: Partial<EpisodeListItem> = {}): EpisodeListItem {
  return {
    id: 1,
    number: 4,
    slug: 'front-brake',
    title: 'A seized caliper piston',
    summary: 'Freeing the piston and refitting the caliper.',
    publishedAt: '2026-11-28T10:00:00.000Z',
    coverUrl: null,
    build: { id: 7, slug: 'alderton-175', title: '1968 Alderton 175 Trail', vehicle: '1968 Alderton 175' },
    creator: { handle: 'moss-garage', displayName: 'Moss Garage' },
    ...overrides,
  };
}

function json(status: number, body: unknown): Response {
  return new Response(JSON.stringify(body), { status, headers: { 'content-type': 'application/json' } });
}

function renderFrontPage(answer: () => Response, url = '/') {
  const calls: string[] = [];
  const fakeFetch: typeof fetch = async (input) => {
    calls.push(String(input));
    return answer();
  };
  const queryClient = new QueryClient({ defaultOptions: { queries: { retry: false } } });
  const router = createMemoryRouter([{ path: '/', element: <FrontPage /> }], { initialEntries: [url] });
  render(
    <QueryClientProvider client={queryClient}>
      <ApiProvider client={createApiClient({ fetch: fakeFetch })}>
        <RouterProvider router={router} />
      </ApiProvider>
    </QueryClientProvider>,
  );
  return { calls };
}

const list = (items: EpisodeListItem[], page = 1, total = items.length): LatestEpisodesResponse => ({
  items,
  page,
  perPage: FRONT_PAGE_SIZE,
  total,
});

// tests/setup/console-guard.ts fails any test that logs console.error (a React warning, say).
afterEach(() => {
  cleanup();
});

describe('FrontPage', () => {
  it('lists the latest episodes with links to the episode and its creator', async () => {
    const second = episode({
      id: 2,
      number: 9,
      slug: 'carb-strip',
      title: 'Stripping the carburettor',
      coverUrl: '/media/carb.webp',
      build: { id: 8, slug: 'pellham-two-stroke', title: '1974 Pellham 125', vehicle: '1974 Pellham 125' },
      creator: { handle: 'iron-ida', displayName: 'Ida Ironside' },
    });
    const { calls } = renderFrontPage(() => json(200, list([episode(), second], 1, 30)), '/?page=1');

    const first = await screen.findByRole('link', { name: 'A seized caliper piston' });
    expect(first.getAttribute('href')).toBe('/builds/moss-garage/alderton-175/episodes/front-brake');
    expect(screen.getByRole('link', { name: 'Stripping the carburettor' }).getAttribute('href')).toBe(
      '/builds/iron-ida/pellham-two-stroke/episodes/carb-strip',
    );
    expect(screen.getByRole('link', { name: 'Ida Ironside' }).getAttribute('href')).toBe('/creators/iron-ida');
    expect(screen.getAllByText('28 Nov 2026')).toHaveLength(2);
    expect(screen.getByRole('img', { name: /1974 Pellham 125, episode 9/ })).toBeTruthy();
    expect(calls).toEqual([`/api/episodes?page=1&perPage=${FRONT_PAGE_SIZE}`]);

    const pages = screen.getByRole('navigation', { name: /pages/i });
    expect(within(pages).getByText(/page/i, { selector: 'p' }).textContent).toBe('Page 1 of 3');
    expect(
      within(pages)
        .getByRole('link', { name: /next page/i })
        .getAttribute('href'),
    ).toBe('/?page=2');
    expect(within(pages).queryByRole('link', { name: /previous page/i })).toBeNull();
  });

  it('shows the empty state when nothing has been published', async () => {
    renderFrontPage(() => json(200, list([])));
    expect(await screen.findByText('No episodes have been published yet.')).toBeTruthy();
    expect(screen.queryByRole('navigation', { name: /pages/i })).toBeNull();
  });

  it('shows the error message from the API with a retry button', async () => {
    renderFrontPage(() => json(500, { error: { code: 'internal', message: 'Boom' } }));
    const alert = await screen.findByRole('alert');
    expect(within(alert).getByText('Boom')).toBeTruthy();
    expect(within(alert).getByRole('button', { name: 'Try again' })).toBeTruthy();
  });
});

describe('frontPageQuery', () => {
  it('reads the page and falls back to page 1 on bad input', () => {
    expect(frontPageQuery(new URLSearchParams('page=3'))).toEqual({ page: 3, perPage: 12 });
    expect(frontPageQuery(new URLSearchParams('page=10000'))).toEqual({ page: 10_000, perPage: 12 });
    for (const bad of ['page=0', 'page=-2', 'page=abc', 'page=2.5', 'page=', '', 'page=10001', 'page=Infinity', 'page=NaN']) {
      expect(frontPageQuery(new URLSearchParams(bad))).toEqual({ page: 1, perPage: 12 });
    }
  });

  it("agrees with the API's page query", () => {
    const pages = ['1', '3', ' 4 ', '07', '1e3', '0x10', '10000', '10001', '0', '-1', '2.5', '', 'abc', 'Infinity', '1_000'];
    for (const page of pages) {
      const parsed = latestEpisodesQuery.safeParse({ page, perPage: FRONT_PAGE_SIZE });
      const expected = parsed.success ? parsed.data : { page: 1, perPage: FRONT_PAGE_SIZE };
      expect(frontPageQuery(new URLSearchParams({ page })), page).toEqual(expected);
    }
  });
});
