import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { startGithubOAuthFake, type GithubOAuthFake } from '../../fakes/github-oauth';
import { hashToken } from '../../server/services/tokens';
import { sessionResponse, signInLinkRedeemResponse } from '../../src/shared/schemas/accounts';
import { githubFakeEnv, githubSignIn, linkFromMail, resetRateLimits } from '../helpers/accounts';
import { createUser } from '../helpers/factories';
import { TestClient } from '../helpers/http-client';
import { startTestApp, type TestApp } from '../helpers/test-app';

let fake: GithubOAuthFake;
let app: TestApp;
beforeAll(async () => {
  fake = await startGithubOAuthFake({ port: 0 });
  app = await startTestApp({ env: githubFakeEnv(fake) });
});
afterAll(async () => {
  await app?.stop();
  await fake?.stop();
});
beforeEach(async () => {
  await resetRateLimits(app.deps.db);
  app.smtp.clear();
});

/** Requests a link for the address, delivers the outbox and returns the e-mailed link. */
async function requestLink(client: TestClient, email: string, returnTo?: string) {
  const res = await client.post('/api/sign-in-links', returnTo ? { email, returnTo } : { email });
  expect(res.status).toBe(202);
  await app.runJobs();
  return { res, ...linkFromMail(app.smtp, email, '/sign-in/link') };
}

describe('sign-in by e-mailed link', () => {
  it('answers a known and an unknown address the same way, and e-mails a link to each', async () => {
    await createUser(app.deps.db, { handle: 'known-person', email: 'known@example.test' });
    const client = new TestClient(app.baseUrl);
    const known = await client.post('/api/sign-in-links', { email: 'Known@Example.test' });
    const unknown = await client.post('/api/sign-in-links', { email: 'nobody-yet@example.test' });
    expect(known.status).toBe(202);
    expect(unknown.status).toBe(202);
    expect(known.body).toEqual({ ok: true });
    expect(unknown.body).toEqual(known.body);

    expect(await app.runJobs()).toBeGreaterThan(0);
    const a = linkFromMail(app.smtp, 'known@example.test', '/sign-in/link');
    const b = linkFromMail(app.smtp, 'nobody-yet@example.test', '/sign-in/link');
    expect(a.url).toBe(`${app.baseUrl}/sign-in/link`);
    expect(b.url).toBe(`${app.baseUrl}/sign-in/link`);
    expect(a.token).not.toBe(b.token);
    // Only the hash is stored.
    const stored = await app.deps.db.selectFrom('sign_in_tokens').select('token_hash').execute();
    expect(stored.map((r) => r.token_hash)).toContain(hashToken(a.token));
    expect(stored.map((r) => r.token_hash)).not.toContain(a.token);
  });

  it('does not sign in on a GET of the link (as a mail scanner would fetch it), and the token still works after', async () => {
    const client = new TestClient(app.baseUrl);
    const { url, token } = await requestLink(client, 'scanned@example.test', '/account');

    const scanned = await fetch(url, { headers: { accept: 'text/html', cookie: client.cookie ?? '' }, redirect: 'manual' });
    await scanned.arrayBuffer();
    expect(scanned.status).toBeLessThan(500);
    expect((await client.get('/api/session')).body).toEqual({ account: null });
    const row = await app.deps.db
      .selectFrom('sign_in_tokens')
      .select('used_at')
      .where('token_hash', '=', hashToken(token))
      .executeTakeFirstOrThrow();
    expect(row.used_at).toBeNull();

    const redeemed = await client.post('/api/sign-in-links/redeem', { token });
    expect(redeemed.status).toBe(200);
    const body = signInLinkRedeemResponse.parse(redeemed.body);
    expect(body.returnTo).toBe('/account');
    expect(body.account.email).toBe('scanned@example.test');
    expect(body.account.signInMethods).toEqual(['email']);
    client.forgetCsrf();
    expect(sessionResponse.parse((await client.get('/api/session')).body).account?.id).toBe(body.account.id);
  });

  it('rejects a link used a second time with 400 link_invalid', async () => {
    const client = new TestClient(app.baseUrl);
    const { token } = await requestLink(client, 'twice@example.test');
    const first = await client.post('/api/sign-in-links/redeem', { token });
    expect(first.status).toBe(200);
    expect(first.body.returnTo).toBe('/');
    client.forgetCsrf();

    const again = await new TestClient(app.baseUrl).post('/api/sign-in-links/redeem', { token });
    expect(again.status).toBe(400);
    expect(again.body.error.code).toBe('link_invalid');
  });

  it('rejects an expired link with 400 link_invalid and does not sign in', async () => {
    const client = new TestClient(app.baseUrl);
    const { token } = await requestLink(client, 'late@example.test');
    await app.deps.db
      .updateTable('sign_in_tokens')
      .set({ expires_at: new Date(Date.now() - 60_000) })
      .where('token_hash', '=', hashToken(token))
      .execute();
    const res = await client.post('/api/sign-in-links/redeem', { token });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('link_invalid');
    expect((await client.get('/api/session')).body).toEqual({ account: null });
  });

  it('rejects a made-up token with 400 link_invalid', async () => {
    const res = await new TestClient(app.baseUrl).post('/api/sign-in-links/redeem', { token: 'x'.repeat(43) });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('link_invalid');
  });

  it('names the field of a malformed address', async () => {
    const res = await new TestClient(app.baseUrl).post('/api/sign-in-links', { email: 'not-an-address' });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_request');
    expect(Object.keys(res.body.error.fields)).toEqual(['email']);
  });

  it('links both ways to one account: GitHub first, then the e-mail link to the same address', async () => {
    const gh = new TestClient(app.baseUrl);
    expect((await githubSignIn(gh, fake, 'dov-achterberg')).callback.status).toBe(303);
    const viaGithub = sessionResponse.parse((await gh.get('/api/session')).body).account;
    expect(viaGithub?.signInMethods).toEqual(['github']);

    const mail = new TestClient(app.baseUrl);
    const { token } = await requestLink(mail, 'dov@demo.rivet-reel.test');
    const res = await mail.post('/api/sign-in-links/redeem', { token });
    expect(res.status).toBe(200);
    const { account } = signInLinkRedeemResponse.parse(res.body);
    expect(account.id).toBe(viaGithub?.id);
    expect(account.handle).toBe('dov-achterberg');
    expect(account.signInMethods).toEqual(['email', 'github']);
    const users = await app.deps.db.selectFrom('users').select('id').where('email', '=', 'dov@demo.rivet-reel.test').execute();
    expect(users).toHaveLength(1);
  });

  it('creates an account on the first redemption for a new address', async () => {
    const client = new TestClient(app.baseUrl);
    const { token } = await requestLink(client, 'brand.new@example.test');
    const res = await client.post('/api/sign-in-links/redeem', { token });
    expect(res.status).toBe(200);
    const { account } = signInLinkRedeemResponse.parse(res.body);
    expect(account.handle).toBe('brand-new');
    expect(account.email).toBe('brand.new@example.test');
    expect(account.builds).toEqual([]);
  });
});

describe('sign-in link rate limit', () => {
  it('answers the 6th request for one address within the hour with 429 rate_limited and Retry-After', async () => {
    const client = new TestClient(app.baseUrl);
    for (let i = 1; i <= 5; i += 1) {
      const ok = await client.post('/api/sign-in-links', { email: 'hammered@example.test' });
      expect(ok.status, `request ${i}`).toBe(202);
    }
    const sixth = await client.post('/api/sign-in-links', { email: 'HAMMERED@example.test' });
    expect(sixth.status).toBe(429);
    expect(sixth.body.error.code).toBe('rate_limited');
    const retryAfter = Number(sixth.headers.get('retry-after'));
    expect(retryAfter).toBeGreaterThan(0);
    expect(retryAfter).toBeLessThanOrEqual(3600);
    // Another address from the same place is still served (the per-IP limit is higher).
    expect((await client.post('/api/sign-in-links', { email: 'other@example.test' })).status).toBe(202);
    await app.runJobs();
    expect(app.smtp.messages().filter((m) => m.to.includes('hammered@example.test'))).toHaveLength(5);
  });
});
