/** The request header carrying the session's CSRF token on every mutation. */
export const CSRF_HEADER = 'x-csrf-token';
