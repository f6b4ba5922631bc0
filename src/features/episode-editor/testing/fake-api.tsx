import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import type { ReactNode } from 'react';
import { createApiClient } from '../../../lib/api-client';
import { ApiProvider } from '../../../lib/api-context';
import type { Episode } from '../../../shared/schemas/episodes';

// Test helpers for the editor: an invented episode and a fake API that keeps one episode with
// its version, as the server does (409 with `current` on a stale version).

export function makeEpisode(overrides: Partial<Episode> = {}): Episode {
  return {
    id: 41,
    buildId: 7,
    slug: 'a-seized-caliper',
    title: 'A seized caliper',
    number: 4,
    summary: null,
    writeUp: { type: 'doc', content: [{ type: 'paragraph', content: [{ type: 'text', text: 'Thirty years in a hedge.' }] }] },
    writeUpHtml: '<p>Thirty years in a hedge.</p>',
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
    createdAt: '2026-11-28T10:00:00.000Z',
    updatedAt: '2026-11-28T10:00:00.000Z',
    ...overrides,
  };
}

export interface Call {
  method: string;
  url: string;
  body: Record<string, unknown> | null;
}

export type PatchMode = 'ok' | 'network-error' | 'server-error';

function json(status: number, body: unknown): Response {
  return new Response(JSON.stringify(body), { status, headers: { 'content-type': 'application/json' } });
}

/** A fake server for one episode: PATCH checks the version, applies the fields and bumps it. */
export function createFakeServer(initial: Episode) {
  const state = { episode: initial, mode: 'ok' as PatchMode, calls: [] as Call[] };
  const fetch: typeof globalThis.fetch = async (input, init) => {
    const call: Call = {
      method: init?.method ?? 'GET',
      url: String(input),
      body: typeof init?.body === 'string' ? JSON.parse(init.body) : null,
    };
    state.calls.push(call);
    if (call.url === '/api/csrf-token') return json(200, { token: 'csrf-token-value' });
    if (call.url === `/api/episodes/${initial.id}` && call.method === 'GET') return json(200, state.episode);
    if (call.url === `/api/episodes/${initial.id}/figures` && call.method === 'GET') return json(200, { items: [] });
    if (call.url === `/api/episodes/${initial.id}` && call.method === 'PATCH') {
      if (state.mode === 'network-error') throw new TypeError('Failed to fetch');
      if (state.mode === 'server-error') return json(503, { error: { code: 'unavailable', message: 'Try again' } });
      const { version, chapters, ...fields } = call.body ?? {};
      if (version !== state.episode.version) {
        return json(409, { error: { code: 'version_conflict', message: 'Saved elsewhere' }, current: state.episode });
      }
      state.episode = {
        ...state.episode,
        ...(fields as Partial<Episode>),
        ...(Array.isArray(chapters)
          ? { chapters: chapters.map((c: object, i: number) => ({ ...c, id: 100 + i, endSeconds: null })) as Episode['chapters'] }
          : {}),
        version: state.episode.version + 1,
        updatedAt: new Date().toISOString(),
      };
      return json(200, state.episode);
    }
    return json(404, { error: { code: 'not_found', message: 'Not found' } });
  };
  const patches = () => state.calls.filter((c) => c.method === 'PATCH');
  return { state, fetch, patches };
}

export function makeWrapper(fetch: typeof globalThis.fetch) {
  const queryClient = new QueryClient({ defaultOptions: { queries: { retry: false } } });
  const api = createApiClient({ fetch });
  return function Wrapper({ children }: { children: ReactNode }) {
    return (
      <QueryClientProvider client={queryClient}>
        <ApiProvider client={api}>{children}</ApiProvider>
      </QueryClientProvider>
    );
  };
}
