import type { QueryClient } from '@tanstack/react-query';
import { data, redirect } from 'react-router';
import { sessionOptions } from '../features/accounts/api/get-session';
import { accountPaths } from '../features/accounts/paths';
import { ApiError, type ApiClient } from '../lib/api-client';
import type { Account } from '../shared/schemas/accounts';

/** What every loader gets: the render's query cache and API client. */
export interface LoaderDeps {
  queryClient: QueryClient;
  api: ApiClient;
}

/**
 * Primes the session for the header. A failing session endpoint must not take every page down, so
 * the failed entry is dropped: server and client then both render the header's pending state, and
 * the browser asks again.
 */
export async function primeSession({ queryClient, api }: LoaderDeps): Promise<void> {
  const options = sessionOptions(api);
  try {
    await queryClient.ensureQueryData(options);
  } catch {
    queryClient.removeQueries({ queryKey: options.queryKey, exact: true });
  }
}

/** The signed-in account, or a redirect to the sign-in page that comes back to this URL. */
export async function requireAccount({ queryClient, api }: LoaderDeps, request: Request): Promise<Account> {
  const { account } = await queryClient.ensureQueryData({ ...sessionOptions(api), revalidateIfStale: true }).catch(rethrowAsRouteError);
  if (account) return account;
  const url = new URL(request.url);
  throw redirect(accountPaths.signIn(`${url.pathname}${url.search}`));
}

/** Sends the reader to the error page with a real HTTP status (the server renders it too). */
export function routeError(status: 401 | 403 | 404): never {
  throw data(null, { status });
}

/** Turns "not signed in", "not yours" and "not there" from the API into those error pages; rethrows the rest. */
export function rethrowAsRouteError(err: unknown): never {
  if (err instanceof ApiError && (err.status === 401 || err.status === 403 || err.status === 404)) routeError(err.status);
  throw err;
}
