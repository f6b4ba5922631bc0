import { randomBytes } from 'node:crypto';
import { sql } from 'kysely';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { startGithubOAuthFake, type GithubOAuthFake } from '../../fakes/github-oauth';
import { hashToken } from '../../server/services/tokens';
import { adminAccount, adminAccountList, sessionResponse } from '../../src/shared/schemas/accounts';
import { githubFakeEnv, githubSignIn, resetRateLimits, signedInClient } from '../helpers/accounts';
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
beforeEach(() => resetRateLimits(app.deps.db));

/** A valid sign-in link token for the address, stored as the app would store it. */
async function linkToken(email: string): Promise<string> {
  const token = randomBytes(32).toString('base64url');
  await app.deps.db
    .insertInto('sign_in_tokens')
    .values({ token_hash: hashToken(token), email, expires_at: sql<Date>`now() + interval '10 minutes'` })
    .execute();
  return token;
}

async function act(admin: TestClient, userId: number, action: string) {
  return admin.post(`/api/admin/accounts/${userId}/actions`, { action });
}

describe('admin: accounts', () => {
  it('searches accounts by handle, name or e-mail', async () => {
    await createUser(app.deps.db, { handle: 'search-admin', email: 'search-admin@example.test', is_admin: true });
    await createUser(app.deps.db, { handle: 'wren-oakley', display_name: 'Wren Oakley', email: 'wren@garage.test' });
    await createUser(app.deps.db, { handle: 'cato-ferris', display_name: 'Cato Ferris', email: 'cato@elsewhere.test' });
    const admin = await signedInClient(app, 'search-admin@example.test');

    const byName = await admin.get('/api/admin/accounts?q=oakley');
    expect(byName.status).toBe(200);
    expect(adminAccountList.parse(byName.body).items.map((a) => a.handle)).toEqual(['wren-oakley']);
    expect(byName.body.total).toBe(1);
    expect(adminAccountList.parse((await admin.get('/api/admin/accounts?q=ELSEWHERE')).body).items.map((a) => a.handle)).toEqual([
      'cato-ferris',
    ]);
    expect(adminAccountList.parse((await admin.get('/api/admin/accounts?q=cato-f')).body).items.map((a) => a.handle)).toEqual([
      'cato-ferris',
    ]);
    // LIKE wildcards are matched literally.
    expect((await admin.get('/api/admin/accounts?q=%25')).body.items).toEqual([]);
    const all = adminAccountList.parse((await admin.get('/api/admin/accounts?perPage=100')).body);
    expect(all.items.map((a) => a.handle)).toEqual(expect.arrayContaining(['search-admin', 'wren-oakley', 'cato-ferris']));

    const notAdmin = await signedInClient(app, 'wren@garage.test');
    const refused = await notAdmin.get('/api/admin/accounts');
    expect(refused.status).toBe(403);
    expect(refused.body.error.code).toBe('forbidden');
  });

  it('suspends (sessions end, both sign-in ways refused), restores, grants and revokes admin — each audited', async () => {
    const adminUser = await createUser(app.deps.db, { handle: 'duty-admin', email: 'duty-admin@example.test', is_admin: true });
    const admin = await signedInClient(app, 'duty-admin@example.test');

    // The subject: a demo account signed in through GitHub.
    const pria = new TestClient(app.baseUrl);
    expect((await githubSignIn(pria, fake, 'pria-castellane')).callback.status).toBe(303);
    const priaAccount = sessionResponse.parse((await pria.get('/api/session')).body).account;
    expect(priaAccount?.handle).toBe('pria-castellane');
    const priaId = priaAccount!.id;
    const priaByMail = await signedInClient(app, 'pria@demo.rivet-reel.test');
    expect(sessionResponse.parse((await priaByMail.get('/api/session')).body).account?.id).toBe(priaId);

    const suspended = await act(admin, priaId, 'suspend');
    expect(suspended.status).toBe(200);
    expect(adminAccount.parse(suspended.body).suspendedAt).not.toBeNull();
    // Every existing session of the account ends.
    expect((await pria.get('/api/session')).body).toEqual({ account: null });
    expect((await priaByMail.get('/api/session')).body).toEqual({ account: null });
    expect(
      await app.deps.db
        .selectFrom('sessions')
        .select('sid')
        .where(sql<string>`sess->>'userId'`, '=', String(priaId))
        .execute(),
    ).toEqual([]);

    const token = await linkToken('pria@demo.rivet-reel.test');
    const byLink = await new TestClient(app.baseUrl).post('/api/sign-in-links/redeem', { token });
    expect(byLink.status).toBe(403);
    expect(byLink.body.error.code).toBe('account_suspended');
    const byGithub = await githubSignIn(new TestClient(app.baseUrl), fake, 'pria-castellane');
    expect(byGithub.callback.status).toBe(303);
    expect(byGithub.callback.headers.get('location')).toBe('/sign-in?error=suspended');
    expect(adminAccountList.parse((await admin.get('/api/admin/accounts?q=pria')).body).items[0]?.suspendedAt).not.toBeNull();

    const restored = await act(admin, priaId, 'restore');
    expect(restored.status).toBe(200);
    expect(adminAccount.parse(restored.body).suspendedAt).toBeNull();
    const back = new TestClient(app.baseUrl);
    const dance = await githubSignIn(back, fake, 'pria-castellane');
    expect(dance.callback.headers.get('location')).toBe('/');
    expect(sessionResponse.parse((await back.get('/api/session')).body).account?.id).toBe(priaId);
    // The link refused while suspended was not used up by the refusal.
    const later = await new TestClient(app.baseUrl).post('/api/sign-in-links/redeem', { token });
    expect(later.status).toBe(200);

    const granted = await act(admin, priaId, 'grant-admin');
    expect(granted.status).toBe(200);
    expect(adminAccount.parse(granted.body).isAdmin).toBe(true);
    back.forgetCsrf();
    expect((await back.get('/api/admin/accounts')).status).toBe(200);
    const revoked = await act(admin, priaId, 'revoke-admin');
    expect(revoked.status).toBe(200);
    expect(adminAccount.parse(revoked.body).isAdmin).toBe(false);
    const noLonger = await back.get('/api/admin/accounts');
    expect(noLonger.status).toBe(403);
    expect(noLonger.body.error.code).toBe('forbidden');

    const audit = await app.deps.db
      .selectFrom('audit_events')
      .select(['actor_id', 'action', 'subject_user_id', 'created_at'])
      .where('subject_user_id', '=', priaId)
      .orderBy('id')
      .execute();
    expect(audit.map((a) => [a.actor_id, a.action, a.subject_user_id])).toEqual([
      [adminUser.id, 'account.suspended', priaId],
      [adminUser.id, 'account.restored', priaId],
      [adminUser.id, 'admin.granted', priaId],
      [adminUser.id, 'admin.revoked', priaId],
    ]);
    for (const a of audit) expect(a.created_at).toBeInstanceOf(Date);
  });

  it('ends the session of an account suspended outside the admin screen on its next request (no 500)', async () => {
    const user = await createUser(app.deps.db, { email: 'quietly-suspended@example.test' });
    const client = await signedInClient(app, 'quietly-suspended@example.test');
    const token = await client.csrfToken();
    const sessionsOf = () =>
      app.deps.db
        .selectFrom('sessions')
        .select('sid')
        .where(sql<string>`sess->>'userId'`, '=', String(user.id))
        .execute();
    expect(await sessionsOf()).toHaveLength(1);
    // As an operator's SQL would: the session rows stay behind.
    await app.deps.db.updateTable('users').set({ suspended_at: new Date() }).where('id', '=', user.id).execute();

    const res = await client.request(
      'PATCH',
      '/api/account',
      { displayName: 'Sneaky' },
      { csrf: false, headers: { 'x-csrf-token': token } },
    );
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('csrf_invalid');
    expect(await sessionsOf()).toEqual([]);
    expect((await client.get('/api/session')).body).toEqual({ account: null });
    const again = await client.patch('/api/account', { displayName: 'Sneaky' });
    expect(again.status).toBe(401);
    expect(again.body.error.code).toBe('unauthenticated');
    const row = await app.deps.db.selectFrom('users').select('display_name').where('id', '=', user.id).executeTakeFirstOrThrow();
    expect(row.display_name).not.toBe('Sneaky');
  });

  it('refuses to let an admin suspend themselves or revoke their own admin (409 cannot_change_self)', async () => {
    const me = await createUser(app.deps.db, { handle: 'solo-admin', email: 'solo-admin@example.test', is_admin: true });
    const admin = await signedInClient(app, 'solo-admin@example.test');
    for (const action of ['suspend', 'revoke-admin']) {
      const res = await act(admin, me.id, action);
      expect(res.status, action).toBe(409);
      expect(res.body.error.code, action).toBe('cannot_change_self');
    }
    const row = await app.deps.db
      .selectFrom('users')
      .select(['suspended_at', 'is_admin'])
      .where('id', '=', me.id)
      .executeTakeFirstOrThrow();
    expect(row).toEqual({ suspended_at: null, is_admin: true });
    expect(await app.deps.db.selectFrom('audit_events').select('id').where('subject_user_id', '=', me.id).execute()).toEqual([]);
    expect(sessionResponse.parse((await admin.get('/api/session')).body).account?.id).toBe(me.id);
  });

  it('answers an unknown account with 404 and an unknown action with 400 naming the field', async () => {
    await createUser(app.deps.db, { handle: 'other-admin', email: 'other-admin@example.test', is_admin: true });
    const admin = await signedInClient(app, 'other-admin@example.test');
    const missing = await act(admin, 999_999, 'suspend');
    expect(missing.status).toBe(404);
    expect(missing.body.error.code).toBe('not_found');
    const target = await createUser(app.deps.db);
    const bad = await act(admin, target.id, 'delete-everything');
    expect(bad.status).toBe(400);
    expect(bad.body.error.code).toBe('invalid_request');
    expect(Object.keys(bad.body.error.fields)).toEqual(['action']);
  });
});
