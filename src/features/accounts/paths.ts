import { returnTo as returnToSchema } from '../../shared/schemas/accounts';

/** Encodes a path for a query value; slashes stay readable, `#` and `=` do not (the fragment must survive). */
function encodePath(path: string): string {
  return encodeURIComponent(path).replace(/%2F/gi, '/');
}

/** A same-site path to return to, or the front page when the value is missing or points elsewhere. */
export function safeReturnTo(value: string | null | undefined): string {
  const parsed = returnToSchema.safeParse(value ?? '');
  return parsed.success ? parsed.data : '/';
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
