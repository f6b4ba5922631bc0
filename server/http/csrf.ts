import { csrfSync } from 'csrf-sync';
import type { Request } from 'express';
import { CSRF_HEADER } from '../../src/shared/http';

/**
 * Mutations without the session's CSRF token are refused. The exemptions, and why:
 * - GET /auth/github/callback — not a mutation by method; listed for clarity: the OAuth provider
 *   redirects the browser here and the `state` parameter guards it instead.
 * - POST /api/unsubscribe — RFC 8058 one-click unsubscribe: mail clients POST it without a
 *   session; a per-recipient HMAC token in the query guards it instead.
 */
export const CSRF_EXEMPT: ReadonlyArray<{ method: string; path: string; reason: string }> = [
  { method: 'GET', path: '/auth/github/callback', reason: 'OAuth redirect; guarded by the state parameter' },
  { method: 'POST', path: '/api/unsubscribe', reason: 'RFC 8058 one-click unsubscribe; guarded by a signed per-recipient token' },
];

const exempt = (req: Request) => CSRF_EXEMPT.some((e) => e.method === req.method && e.path === req.originalUrl.split('?')[0]);

export const csrf = csrfSync({
  getTokenFromRequest: (req) => req.get(CSRF_HEADER) ?? undefined,
  errorConfig: { statusCode: 403, message: 'Missing or invalid CSRF token; reload the page and try again', code: 'csrf_invalid' },
  skipCsrfProtection: exempt,
});
