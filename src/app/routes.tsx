import type { QueryClient } from '@tanstack/react-query';
import type { RouteObject } from 'react-router';
import { latestEpisodesOptions } from '../features/episodes/api/get-latest-episodes';
import type { ApiClient } from '../lib/api-client';
import { FrontPage, frontPageQuery } from '../routes/front-page';
import { NotFound } from '../routes/not-found';
import { RouteErrorBoundary } from './error-boundary';
import { Shell } from './shell';

/** The catch-all route; the server answers 404 when it matches. */
export const NOT_FOUND_ROUTE_ID = 'not-found';

export interface RouteDeps {
  queryClient: QueryClient;
  api: ApiClient;
}

/**
 * The one route tree, used by the browser router and by the server's static handler.
 * Loaders only prime the query cache; components read it with the same query options.
 */
export function createRoutes({ queryClient, api }: RouteDeps): RouteObject[] {
  return [
    {
      id: 'root',
      path: '/',
      Component: Shell,
      ErrorBoundary: RouteErrorBoundary,
      children: [
        {
          index: true,
          id: 'front-page',
          loader: async ({ request }) => {
            const q = frontPageQuery(new URL(request.url).searchParams);
            await queryClient.ensureQueryData(latestEpisodesOptions(api, q));
            return null;
          },
          Component: FrontPage,
        },
        { path: '*', id: NOT_FOUND_ROUTE_ID, Component: NotFound },
      ],
    },
  ];
}
