import { hydrate } from '@tanstack/react-query';
import { StrictMode } from 'react';
import { createRoot, hydrateRoot } from 'react-dom/client';
import { createBrowserRouter, matchRoutes, RouterProvider, type RouteObject } from 'react-router';
import { HYDRATION_SCRIPT_ID, type HydrationPayload } from './app/hydration-data';
import { Providers } from './app/providers';
import { createRoutes } from './app/routes';
import { createApiClient } from './lib/api-client';
import { createQueryClient } from './lib/query-client';
import './styles.css';

/**
 * Lazy route modules (every page but the front page) that match the first URL are loaded before hydrating:
 * otherwise the router renders its loading fallback over the server's HTML and hydration fails.
 */
async function loadLazyMatches(routes: RouteObject[]): Promise<void> {
  const matches = matchRoutes(routes, window.location) ?? [];
  await Promise.all(
    matches
      .filter((m) => typeof m.route.lazy === 'function')
      .map(async (m) => {
        const mod = await (m.route.lazy as () => Promise<Partial<RouteObject>>)();
        Object.assign(m.route, mod, { lazy: undefined });
      }),
  );
}

declare global {
  interface Window {
    __staticRouterHydrationData?: HydrationPayload['router'];
  }
}

const queryClient = createQueryClient();
const api = createApiClient();
const payloadText = document.getElementById(HYDRATION_SCRIPT_ID)?.textContent;
const payload = payloadText ? (JSON.parse(payloadText) as HydrationPayload) : null;
if (payload) {
  hydrate(queryClient, payload.query);
  // React Router reads this (and revives route errors) when the browser router is created.
  window.__staticRouterHydrationData = payload.router;
}

const routes = createRoutes({ queryClient, api });
await loadLazyMatches(routes);
const router = createBrowserRouter(routes);
const container = document.getElementById('root');
if (!container) throw new Error('#root is missing from index.html');

const app = (
  <StrictMode>
    <Providers queryClient={queryClient} api={api} site={payload?.site ?? { publicUrl: window.location.origin }}>
      <RouterProvider router={router} />
    </Providers>
  </StrictMode>
);

if (payload) hydrateRoot(container, app);
else createRoot(container).render(app);
