/** A same-site path to return to after signing in (the open-redirect rule lives in src/shared/return-to.ts). */
export { safeReturnTo } from '../../shared/return-to';

/** Encodes a path for a query value; slashes stay readable, `#` and `=` do not (the fragment must survive). */
function encodePath(path: string): string {
  return encodeURIComponent(path).replace(/%2F/gi, '/');
}

/** URL paths of the account screens. (They belong in src/shared/paths.ts once that file takes them.) */
export const accountPaths = {
  signIn: (returnTo?: string) => (returnTo && returnTo !== '/' ? `/sign-in?returnTo=${encodePath(returnTo)}` : '/sign-in'),
  /** The GitHub sign-in is a server route (an OAuth redirect), so it is a plain link, never fetched. */
  github: (returnTo: string) => `/auth/github?returnTo=${encodePath(returnTo)}`,
  signInLink: () => '/sign-in/link',
  invitationAccept: (token?: string) => (token ? `/invitations/accept#token=${encodeURIComponent(token)}` : '/invitations/accept'),
  settings: () => '/account',
  builds: () => '/account/builds',
  team: (buildId: number) => `/account/builds/${buildId}/team`,
  export: () => '/api/account/export',
};
