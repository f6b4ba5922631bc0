import { describe, expect, it } from 'vitest';
import { redactTokens } from '../../server/app';

describe('redactTokens', () => {
  it('hides link tokens in logged URLs, plain or percent-encoded', () => {
    expect(redactTokens('/sign-in?returnTo=%2Finvitations%2Faccept%23token%3DabcDEF_123-x&x=1')).toBe(
      '/sign-in?returnTo=%2Finvitations%2Faccept%23token%3D[redacted]&x=1',
    );
    expect(redactTokens('/auth/github?returnTo=/invitations/accept#token=abc')).toBe(
      '/auth/github?returnTo=/invitations/accept#token=[redacted]',
    );
    expect(redactTokens('/api/episodes?page=2')).toBe('/api/episodes?page=2');
    expect(redactTokens(undefined)).toBeUndefined();
  });
});
