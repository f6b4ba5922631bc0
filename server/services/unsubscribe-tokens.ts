import { createHmac, timingSafeEqual } from 'node:crypto';
import type { UnsubscribeScope } from '../../src/shared/schemas/following';

// Per-recipient one-click unsubscribe tokens (RFC 8058): an HMAC over the account id and the kind
// of notice, keyed by the session secret under its own label. Changing either part breaks it, so a
// token from one person's mail cannot be used for another person.
const LABEL = 'rivet-reel/unsubscribe/v1';

/** The token for one person and one kind of notice. */
export function unsubscribeToken(secret: string, userId: number, scope: UnsubscribeScope): string {
  return createHmac('sha256', secret).update(`${LABEL}:${userId}:${scope}`).digest('base64url');
}

/** True when the token was made by this server for exactly this person and kind. */
export function verifyUnsubscribeToken(secret: string, userId: number, scope: UnsubscribeScope, token: string): boolean {
  const expected = Buffer.from(unsubscribeToken(secret, userId, scope));
  const given = Buffer.from(token);
  return given.length === expected.length && timingSafeEqual(given, expected);
}
