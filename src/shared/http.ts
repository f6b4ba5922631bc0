/** The request header carrying the session's CSRF token on every mutation. */
export const CSRF_HEADER = 'x-csrf-token';

/** The session cookie's name. Without it a request is anonymous, and pages rendered for it need not ask who is signed in. */
export const SESSION_COOKIE = 'rr_sid';

/** Whether a Cookie header carries the session cookie (else the request is anonymous). */
export function hasSessionCookie(cookie: string | undefined): boolean {
  return (cookie ?? '').split(';').some((c) => c.trim().startsWith(`${SESSION_COOKIE}=`));
}
