import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { startGithubOAuthFake, type GithubOAuthFake } from '../../fakes/github-oauth';
import { sessionResponse } from '../../src/shared/schemas/accounts';
import { githubFakeEnv, githubSignIn, resetRateLimits } from '../helpers/accounts';
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
beforeEach(() => resetRateLimits(app.deps.db));

const usersNamed = (handle: string) =>
  app.deps.db.selectFrom('users').select(['id', 'display_name', 'email']).where('handle', '=', handle).execute();

describe('GitHub sign-in against the fake', () => {
  it('runs the OAuth dance: authorize redirect with state → callback → new session → /api/session', async () => {
    const client = new TestClient(app.baseUrl);
    const start = await client.get('/auth/github?returnTo=/account');
    expect(start.status).toBe(302);
    const authorizeUrl = new URL(start.headers.get('location') ?? '');
    expect(`${authorizeUrl.origin}${authorizeUrl.pathname}`).toBe(`${fake.url}/login/oauth/authorize`);
    const state = authorizeUrl.searchParams.get('state');
    expect(state).toBeTruthy();
    expect(authorizeUrl.searchParams.get('redirect_uri')).toBe(`${app.baseUrl}/auth/github/callback`);
    const sidBefore = client.cookie;
    expect(sidBefore).toMatch(/^rr_sid=/);

    const authorize = await fetch(`${authorizeUrl.href}&login=marta-kettleby`, { redirect: 'manual' });
    expect(authorize.status).toBe(302);
    const callbackUrl = new URL(authorize.headers.get('location') ?? '');
    expect(callbackUrl.pathname).toBe('/auth/github/callback');
    expect(callbackUrl.searchParams.get('code')).toBeTruthy();
    expect(callbackUrl.searchParams.get('state')).toBe(state);

    const callback = await client.get(`${callbackUrl.pathname}${callbackUrl.search}`);
    expect(callback.status).toBe(303);
    expect(callback.headers.get('location')).toBe('/account');
    const setCookie = callback.headers.getSetCookie().find((c) => c.startsWith('rr_sid='));
    expect(setCookie).toBeDefined();
    expect(setCookie).toMatch(/;\s*HttpOnly/i);
    expect(setCookie).toMatch(/;\s*SameSite=Lax/i);
    expect(setCookie).not.toMatch(/;\s*Secure/i); // served over plain HTTP here
    expect(client.cookie).toBeDefined();
    expect(client.cookie).not.toBe(sidBefore);

    const session = await client.get('/api/session');
    expect(session.status).toBe(200);
    const { account } = sessionResponse.parse(session.body);
    expect(account?.handle).toBe('marta-kettleby');
    expect(account?.displayName).toBe('Marta Kettleby');
    expect(account?.email).toBe('marta@demo.rivet-reel.test');
    expect(account?.signInMethods).toEqual(['github']);

    // The pre-sign-in session id is no longer signed in.
    const planted = new TestClient(app.baseUrl);
    planted.cookie = sidBefore;
    expect((await planted.get('/api/session')).body).toEqual({ account: null });
  });

  it('creates the account on first sign-in and updates its display fields on the next, without a second user', async () => {
    const first = await githubSignIn(new TestClient(app.baseUrl), fake, 'ossie-brandt');
    expect(first.callback.status).toBe(303);
    const created = await usersNamed('ossie-brandt');
    expect(created).toHaveLength(1);
    expect(created[0]?.display_name).toBe('Ossie Brandt');
    const usersBefore = await app.deps.db.selectFrom('users').select('id').execute();

    await app.deps.db.updateTable('users').set({ display_name: 'Someone Else' }).where('id', '=', created[0]!.id).execute();
    const client = new TestClient(app.baseUrl);
    const second = await githubSignIn(client, fake, 'ossie-brandt');
    expect(second.callback.status).toBe(303);
    expect(second.callback.headers.get('location')).toBe('/');

    const after = await usersNamed('ossie-brandt');
    expect(after).toEqual([{ id: created[0]!.id, display_name: 'Ossie Brandt', email: 'ossie@demo.rivet-reel.test' }]);
    expect(await app.deps.db.selectFrom('users').select('id').execute()).toHaveLength(usersBefore.length);
    const identities = await app.deps.db
      .selectFrom('identities')
      .select(['provider', 'provider_uid'])
      .where('user_id', '=', created[0]!.id)
      .execute();
    expect(identities).toEqual([{ provider: 'github', provider_uid: '910002' }]);
    expect(sessionResponse.parse((await client.get('/api/session')).body).account?.id).toBe(created[0]!.id);
  });

  it('refuses a callback whose state does not match: 303 to /sign-in?error=github, not signed in', async () => {
    const client = new TestClient(app.baseUrl);
    const dance = await githubSignIn(client, fake, 'jun-halloway', { tamper: (u) => u.searchParams.set('state', 'not-the-state') });
    expect(dance.callback.status).toBe(303);
    expect(dance.callback.headers.get('location')).toBe('/sign-in?error=github');
    expect((await client.get('/api/session')).body).toEqual({ account: null });
    expect(await usersNamed('jun-halloway')).toHaveLength(0);
  });

  it('refuses a callback without any OAuth state in the session', async () => {
    const client = new TestClient(app.baseUrl);
    const res = await client.get('/auth/github/callback?code=abc&state=xyz');
    expect(res.status).toBe(303);
    expect(res.headers.get('location')).toBe('/sign-in?error=github');
  });

  it('ignores a returnTo that leaves the site', async () => {
    const dance = await githubSignIn(new TestClient(app.baseUrl), fake, 'pria-castellane', { returnTo: '//evil.example/x' });
    expect(dance.callback.status).toBe(303);
    expect(dance.callback.headers.get('location')).toBe('/');
  });
});
