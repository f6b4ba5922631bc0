import { data, redirect } from 'react-router';
import { buildAddressOptions } from '../features/reading/api/get-addresses';
import { ApiError } from '../lib/api-client';
import { routeError, type LoaderDeps } from './route-guards';

/** A public page's data: 404/401/403 become those pages; anything else is the error page (500). */
async function need<T>(pending: Promise<T>): Promise<T> {
  try {
    return await pending;
  } catch (err) {
    if (err instanceof ApiError && (err.status === 401 || err.status === 403 || err.status === 404)) routeError(err.status);
    if (err instanceof ApiError && err.status === 400) routeError(404);
    // The API is overloaded or a service is down: the page answers 503 too (with Retry-After), not 500.
    if (err instanceof ApiError && err.status === 503) throw data(null, { status: 503 });
    throw err;
  }
}

/** Sends a former address on to the current one with 301, keeping the query and fragment-free. */
export function canonicalOr301(request: Request, canonical: string): void {
  const url = new URL(request.url);
  if (decodeURIComponent(url.pathname) !== decodeURIComponent(canonical)) throw redirect(`${canonical}${url.search}`, 301);
}

/** The build behind `/builds/:handle/:buildSlug`, its canonical path checked. */
export async function resolveBuild(deps: LoaderDeps, request: Request, params: { handle?: string; buildSlug?: string }) {
  const address = await need(deps.queryClient.fetchQuery(buildAddressOptions(deps.api, params.handle ?? '', params.buildSlug ?? '')));
  return { buildId: address.buildId, path: address.path };
}

export async function resolveBuildPage(deps: LoaderDeps, request: Request, params: { handle?: string; buildSlug?: string }) {
  const b = await resolveBuild(deps, request, params);
  canonicalOr301(request, b.path);
  return b;
}

/** Waits for a page's main data the same way. */
export const needData = need;
