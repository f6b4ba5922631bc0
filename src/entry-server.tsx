import { dehydrate } from '@tanstack/react-query';
import { StrictMode } from 'react';
import { renderToString } from 'react-dom/server';
import { createStaticHandler, createStaticRouter, StaticRouterProvider } from 'react-router';
import { serializeHydration, serializeRouteErrors, type HydrationPayload } from './app/hydration-data';
import { Providers } from './app/providers';
import { createRoutes, NOT_FOUND_ROUTE_ID } from './app/routes';
import { sessionOptions } from './features/accounts/api/get-session';
import { createApiClient } from './lib/api-client';
import { hasSessionCookie } from './shared/http';
import { createQueryClient } from './lib/query-client';

export interface RenderInput {
  request: Request;
  /** Where the server can reach its own API (loopback), for loaders run during rendering. */
  apiBaseUrl: string;
  /** The visitor's cookie header, forwarded so loaders see what the visitor may see. */
  cookie?: string;
  /** The site's public address (PUBLIC_URL), for canonical and share links. */
  publicUrl: string;
  /** The fetch the loaders' API client uses (the server's page cache records what a page read). */
  fetch?: typeof fetch;
}

export type RenderResult =
  { type: 'response'; response: Response } | { type: 'page'; status: number; head: string; html: string; data: string };

/** Renders one public page on the server: run loaders, render, and collect hydration data. */
export async function render({ request, apiBaseUrl, cookie, publicUrl, fetch }: RenderInput): Promise<RenderResult> {
  const queryClient = createQueryClient();
  const api = createApiClient({ baseUrl: apiBaseUrl, headers: cookie ? { cookie } : {}, fetch });
  // No session cookie: an anonymous reader. The header's "who is signed in" is known without asking the API.
  if (!hasSessionCookie(cookie)) queryClient.setQueryData(sessionOptions(api).queryKey, { account: null });
  const handler = createStaticHandler(createRoutes({ queryClient, api }));
  const context = await handler.query(request);
  if (context instanceof Response) return { type: 'response', response: context };

  const router = createStaticRouter(handler.dataRoutes, context);
  const site = { publicUrl: publicUrl.replace(/\/$/, '') };
  const markup = renderToString(
    <StrictMode>
      <Providers queryClient={queryClient} api={api} site={site}>
        <StaticRouterProvider router={router} context={context} hydrate={false} />
      </Providers>
    </StrictMode>,
  );
  const { head, body } = splitHoisted(markup);
  const payload: HydrationPayload = {
    router: {
      loaderData: context.loaderData,
      actionData: context.actionData,
      errors: serializeRouteErrors(context.errors),
    },
    query: dehydrate(queryClient),
    site,
  };
  const notFound = context.matches.some((m) => m.route.id === NOT_FOUND_ROUTE_ID);
  queryClient.clear();
  return {
    type: 'page',
    status: notFound ? 404 : context.statusCode,
    head,
    html: body,
    data: serializeHydration(payload),
  };
}

const HOISTED = /^(?:<title>[^<]*<\/title>|<meta\b[^>]*\/?>|<link\b[^>]*\/?>)/;

/** React 19 emits <title>, <meta> and <link> first; they belong in the document head. */
function splitHoisted(markup: string): { head: string; body: string } {
  let rest = markup;
  let head = '';
  for (let m = HOISTED.exec(rest); m; m = HOISTED.exec(rest)) {
    head += m[0];
    rest = rest.slice(m[0].length);
  }
  return { head, body: rest };
}
