// Where to send someone after signing in, without zod: the sign-in links are built on every public
// page. The `returnTo` schema in src/shared/schemas/accounts.ts applies the same rule.

/** The longest `returnTo` path accepted. */
export const RETURN_TO_MAX = 500;

/** A path on this site: starts with one `/`, and not `//` or `/\` (both would leave for another host). */
export function isSameSitePath(path: string): boolean {
  return path.startsWith('/') && !path.startsWith('//') && !path.startsWith('/\\');
}

/** A same-site path to return to, or the front page when the value is missing, too long or points elsewhere. */
export function safeReturnTo(value: string | null | undefined): string {
  const path = value ?? '';
  return path.length <= RETURN_TO_MAX && isSameSitePath(path) ? path : '/';
}
