// Test helpers for the Workbench screens: the whole route tree over a fake fetch. Used by tests only.
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { render } from '@testing-library/react';
import { createMemoryRouter, RouterProvider } from 'react-router';
import { createRoutes } from '../app/routes';
import { createApiClient } from '../lib/api-client';
import { ApiProvider } from '../lib/api-context';
import type { Account } from '../shared/schemas/accounts';
import { DEFAULT_SYSTEMS, type Build } from '../shared/schemas/builds';
import type { Episode } from '../shared/schemas/episodes';

export const creator: Account = {
  id: 3,
  handle: 'moss-garage',
  displayName: 'Moss Garage',
  avatarUrl: null,
  email: 'moss@example.test',
  noticeEmail: null,
  isAdmin: false,
  signInMethods: ['github'],
  builds: [{ buildId: 7, buildTitle: 'Kestrel hatchback, rust and all', buildSlug: 'kestrel-hatchback', role: 'owner' }],
  sponsors: [],
};

export function makeBuild(overrides: Partial<Build> = {}): Build {
  return {
    id: 7,
    slug: 'kestrel-hatchback',
    owner: { id: 3, handle: 'moss-garage', displayName: 'Moss Garage' },
    title: 'Kestrel hatchback, rust and all',
    vehicleKind: 'car',
    vehicleMake: 'Kestrel',
    vehicleModel: 'Hatch 1100',
    vehicleYear: '1976',
    summary: null,
    currency: 'EUR',
    budgetMinor: 450000,
    visibility: 'public',
    videoLinkPattern: 't={seconds}',
    systems: DEFAULT_SYSTEMS.map((s) => ({ ...s })),
    role: 'owner',
    hoursWorked: 31.5,
    episodeCount: 3,
    pendingTransferTo: null,
    deletedAt: null,
    createdAt: '2026-10-01T09:00:00.000Z',
    updatedAt: '2026-11-20T09:00:00.000Z',
    ...overrides,
  };
}

export function makeEpisode(overrides: Partial<Episode> = {}): Episode {
  return {
    id: 41,
    buildId: 7,
    slug: 'rear-subframe',
    title: 'Cutting out the rear subframe',
    number: 4,
    summary: null,
    writeUp: { type: 'doc', content: [{ type: 'paragraph' }] },
    writeUpHtml: '<p></p>',
    videoUrl: null,
    durationSeconds: null,
    hoursWorked: null,
    raisedVehicle: false,
    videoDisclosureConfirmed: false,
    chapters: [],
    status: 'draft',
    publishAt: null,
    publishedAt: null,
    publishError: null,
    version: 1,
    needsCaution: false,
    deletedAt: null,
    createdAt: '2026-11-30T18:00:00.000Z',
    updatedAt: '2026-11-30T18:00:00.000Z',
    ...overrides,
  };
}

export function json(status: number, body: unknown): Response {
  return new Response(JSON.stringify(body), { status, headers: { 'content-type': 'application/json' } });
}

export type Answer = (method: string, url: string, body: unknown) => Response | undefined;

export interface Call {
  method: string;
  url: string;
  body: unknown;
}

/** Renders the app at `url` for `signedIn`; `answer` decides the API's replies, the rest is 404. */
export function renderApp(url: string, signedIn: Account | null, answer: Answer = () => undefined) {
  const calls: Call[] = [];
  const fakeFetch: typeof fetch = async (input, init) => {
    const method = init?.method ?? 'GET';
    const path = String(input);
    const body: unknown = typeof init?.body === 'string' ? JSON.parse(init.body) : undefined;
    calls.push({ method, url: path, body });
    const custom = answer(method, path, body);
    if (custom) return custom;
    if (path === '/api/session') return json(200, { account: signedIn });
    if (path === '/api/csrf-token') return json(200, { token: 'csrf-token-value' });
    return json(404, { error: { code: 'not_found', message: 'Not found' } });
  };
  const queryClient = new QueryClient({ defaultOptions: { queries: { retry: false } } });
  const api = createApiClient({ fetch: fakeFetch });
  const router = createMemoryRouter(createRoutes({ queryClient, api }), { initialEntries: [url] });
  render(
    <QueryClientProvider client={queryClient}>
      <ApiProvider client={api}>
        <RouterProvider router={router} />
      </ApiProvider>
    </QueryClientProvider>,
  );
  return { calls, router, queryClient };
}
