import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { renderToString } from 'react-dom/server';
import { createStaticHandler, createStaticRouter, StaticRouterProvider, type RouteObject } from 'react-router';
import { describe, expect, it } from 'vitest';
import { editorEpisodeOptions } from '../features/episode-editor/api/get-episode';
import { makeEpisode } from '../features/episode-editor/testing/fake-api';
import { createApiClient } from '../lib/api-client';
import { ApiProvider } from '../lib/api-context';

// The editor as a lazy route module rendered on the server (Node, no DOM), as the app's static
// handler does: the module loads, and Tiptap touches nothing of the DOM while rendering.

const routes: RouteObject[] = [{ path: '/workbench/episodes/:episodeId/edit', lazy: () => import('./episode-editor') }];

async function renderOnServer(url: string, prime?: (queryClient: QueryClient) => void): Promise<string> {
  const queryClient = new QueryClient({ defaultOptions: { queries: { retry: false } } });
  const api = createApiClient({ fetch: () => new Promise<Response>(() => undefined) });
  prime?.(queryClient);
  const handler = createStaticHandler(routes);
  const context = await handler.query(new Request(`http://rivet.test${url}`));
  if (context instanceof Response) throw new Error(`unexpected response ${context.status}`);
  const router = createStaticRouter(handler.dataRoutes, context);
  return renderToString(
    <QueryClientProvider client={queryClient}>
      <ApiProvider client={api}>
        <StaticRouterProvider router={router} context={context} hydrate={false} />
      </ApiProvider>
    </QueryClientProvider>,
  );
}

describe('episode editor route module', () => {
  it('exports the lazy route’s Component and HydrateFallback', async () => {
    const mod = await import('./episode-editor');
    expect(typeof mod.Component).toBe('function');
    expect(typeof mod.HydrateFallback).toBe('function');
  });

  it('renders its loading state on the server when the episode is not in the cache', async () => {
    const html = await renderOnServer('/workbench/episodes/41/edit');
    expect(html).toContain('Opening the episode editor…');
  });

  it('renders the editor around a not-yet-started write-up editor when the episode is cached', async () => {
    const episode = makeEpisode();
    const html = await renderOnServer('/workbench/episodes/41/edit', (qc) =>
      qc.setQueryData(editorEpisodeOptions(createApiClient(), episode.id).queryKey, episode),
    );
    expect(html).toContain('A seized caliper');
    expect(html).toContain('Loading the write-up editor…');
    expect(html).toContain('Saved');
  });

  it('answers an id that is not a number with the not-found page', async () => {
    const html = await renderOnServer('/workbench/episodes/draft/edit');
    expect(html).toContain('Nothing on this bench');
  });
});
