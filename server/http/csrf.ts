import { csrfSync } from 'csrf-sync';
import type { Request } from 'express';
import { CSRF_HEADER } from '../../src/shared/http';

/**
 * Mutations without the session's CSRF token are refused. The exemptions, and why:
 * - GET /auth/github/callback — not a mutation by method; listed for clarity: the OAuth provider
 *   redirects the browser here and the `state` parameter guards it instead.
 * (Later: the signed one-click unsubscribe POST, which must work without a session.)
 */
export const CSRF_EXEMPT: ReadonlyArray<{ method: string; path: string; reason: string }> = [
  { method: 'GET', path: '/auth/github/callback', reason: 'OAuth redirect; guarded by the state parameter' },
];

const exempt = (req: Request) => CSRF_EXEMPT.some((e) => e.method === req.method && e.path === req.originalUrl.split('?')[0]);

export const csrf = csrfSync({
  getTokenFromRequest: (req) => req.get(CSRF_HEADER) ?? undefined,
  errorConfig: { statusCode: 403, message: 'Missing or invalid CSRF token; reload the page and try again', code: 'csrf_invalid' },
  skipCsrfProtection: exempt,
});
