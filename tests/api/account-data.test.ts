import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { account as accountSchema, sessionResponse, signInLinkRedeemResponse } from '../../src/shared/schemas/accounts';
import { addBuildMember, createOwnedBuild, linkFromMail, resetRateLimits, signedInClient } from '../helpers/accounts';
import { createBuild, createUser } from '../helpers/factories';
import { TestClient } from '../helpers/http-client';
import { startTestApp, type TestApp } from '../helpers/test-app';

let app: TestApp;
beforeAll(async () => {
  app = await startTestApp();
});
afterAll(async () => {
  await app?.stop();
});
beforeEach(async () => {
  await resetRateLimits(app.deps.db);
  app.smtp.clear();
});

describe('account settings', () => {
  it('changes the display name and notice e-mail address', async () => {
    const user = await createUser(app.deps.db, { email: 'settings@example.test', display_name: 'Old Name' });
    const client = await signedInClient(app, 'settings@example.test');
    const res = await client.patch('/api/account', { displayName: '  New Name ', noticeEmail: 'Notices@Example.test' });
    expect(res.status).toBe(200);
    const account = accountSchema.parse(res.body.account);
    expect(account).toMatchObject({
      id: user.id,
      displayName: 'New Name',
      noticeEmail: 'notices@example.test',
      email: 'settings@example.test',
    });
    const row = await app.deps.db
      .selectFrom('users')
      .select(['display_name', 'notice_email'])
      .where('id', '=', user.id)
      .executeTakeFirstOrThrow();
    expect(row).toEqual({ display_name: 'New Name', notice_email: 'notices@example.test' });

    const cleared = await client.patch('/api/account', { noticeEmail: null });
    expect(cleared.status).toBe(200);
    expect(cleared.body.account.noticeEmail).toBeNull();
    expect(cleared.body.account.displayName).toBe('New Name');
  });

  it('refuses a bad notice e-mail address with 400 naming noticeEmail, and an empty change', async () => {
    await createUser(app.deps.db, { email: 'bad-notice@example.test', display_name: 'Kept' });
    const client = await signedInClient(app, 'bad-notice@example.test');
    const res = await client.patch('/api/account', { noticeEmail: 'not an address' });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_request');
    expect(Object.keys(res.body.error.fields)).toEqual(['noticeEmail']);
    const blank = await client.patch('/api/account', { displayName: '   ' });
    expect(blank.status).toBe(400);
    expect(Object.keys(blank.body.error.fields)).toEqual(['displayName']);
    const nothing = await client.patch('/api/account', {});
    expect(nothing.status).toBe(400);
    expect(nothing.body.error.code).toBe('invalid_request');
    expect(sessionResponse.parse((await client.get('/api/session')).body).account?.displayName).toBe('Kept');
  });

  it('asks a visitor to sign in (401 unauthenticated)', async () => {
    const res = await new TestClient(app.baseUrl).get('/api/account/export');
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe('unauthenticated');
  });
});

describe('download my data', () => {
  it('is an attachment with the account, its sign-in methods, memberships and invitations sent', async () => {
    const { owner, build: owned } = await createOwnedBuild(app.deps.db, {
      owner: { handle: 'exporter', display_name: 'Ex Porter', email: 'exporter@example.test' },
      build: { title: 'My own build' },
    });
    const other = await createBuild(app.deps.db, { title: 'Someone else’s build' });
    await addBuildMember(app.deps.db, other.id, owner.id, 'editor');
    const client = await signedInClient(app, 'exporter@example.test');
    expect((await client.post(`/api/builds/${owned.id}/invitations`, { email: 'invitee@example.test' })).status).toBe(201);

    const res = await client.get('/api/account/export');
    expect(res.status).toBe(200);
    expect(res.headers.get('content-disposition')).toMatch(/^attachment; filename=".+\.json"$/);
    expect(res.headers.get('content-type')).toMatch(/application\/json/);
    const data = res.body as {
      account: {
        id: number;
        handle: string;
        display_name: string;
        email: string;
        signInMethods: Array<{ provider: string; provider_uid: string }>;
      };
      memberships: {
        builds: Array<{ buildId: number; buildTitle: string; role: string }>;
        invitationsSent: Array<{ email: string; build_id: number }>;
      };
    };
    expect(data.account).toMatchObject({ id: owner.id, handle: 'exporter', display_name: 'Ex Porter', email: 'exporter@example.test' });
    expect(data.account.signInMethods).toEqual([expect.objectContaining({ provider: 'email', provider_uid: 'exporter@example.test' })]);
    expect(data.memberships.builds.map((b) => [b.buildId, b.buildTitle, b.role]).sort()).toEqual(
      [
        [owned.id, 'My own build', 'owner'],
        [other.id, 'Someone else’s build', 'editor'],
      ].sort(),
    );
    expect(data.memberships.invitationsSent).toEqual([expect.objectContaining({ email: 'invitee@example.test', build_id: owned.id })]);
    // Nothing of anybody else, and no secrets.
    expect(JSON.stringify(data)).not.toMatch(/token_hash|Test Person/);
  });
});

describe('delete my account', () => {
  it('is refused with 409 owns_builds while the account owns a build', async () => {
    const { owner } = await createOwnedBuild(app.deps.db, { owner: { email: 'still-owns@example.test' } });
    const client = await signedInClient(app, 'still-owns@example.test');
    const res = await client.delete('/api/account');
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('owns_builds');
    const row = await app.deps.db.selectFrom('users').select(['deleted_at', 'email']).where('id', '=', owner.id).executeTakeFirstOrThrow();
    expect(row).toEqual({ deleted_at: null, email: 'still-owns@example.test' });
    expect(sessionResponse.parse((await client.get('/api/session')).body).account?.id).toBe(owner.id);
  });

  it('anonymises an editor, drops memberships and sessions, and frees the handle', async () => {
    const { build } = await createOwnedBuild(app.deps.db);
    const editor = await createUser(app.deps.db, {
      handle: 'jo-leaver',
      display_name: 'Jo Leaver',
      email: 'jo-leaver@example.test',
      notice_email: 'jo@elsewhere.test',
    });
    await addBuildMember(app.deps.db, build.id, editor.id, 'editor');
    const client = await signedInClient(app, 'jo-leaver@example.test');
    const secondDevice = await signedInClient(app, 'jo-leaver@example.test');
    const cookie = client.cookie;

    const res = await client.delete('/api/account');
    expect(res.status).toBe(204);
    const row = await app.deps.db.selectFrom('users').selectAll().where('id', '=', editor.id).executeTakeFirstOrThrow();
    expect(row.display_name).toBe('Former member');
    expect(row.email).toBeNull();
    expect(row.notice_email).toBeNull();
    expect(row.deleted_at).toBeInstanceOf(Date);
    expect(row.handle).not.toBe('jo-leaver');
    expect(await app.deps.db.selectFrom('build_members').select('id').where('user_id', '=', editor.id).execute()).toEqual([]);
    expect(await app.deps.db.selectFrom('identities').select('id').where('user_id', '=', editor.id).execute()).toEqual([]);

    expect((await client.get('/api/session')).body).toEqual({ account: null });
    expect((await secondDevice.get('/api/session')).body).toEqual({ account: null });
    const replay = new TestClient(app.baseUrl);
    replay.cookie = cookie;
    expect((await replay.get('/api/session')).body).toEqual({ account: null });

    // The handle is free again: a new person whose address starts with it gets it.
    const newcomer = new TestClient(app.baseUrl);
    expect((await newcomer.post('/api/sign-in-links', { email: 'jo-leaver@newplace.test' })).status).toBe(202);
    await app.runJobs();
    const { token } = linkFromMail(app.smtp, 'jo-leaver@newplace.test', '/sign-in/link');
    const redeemed = await newcomer.post('/api/sign-in-links/redeem', { token });
    expect(redeemed.status).toBe(200);
    const fresh = signInLinkRedeemResponse.parse(redeemed.body).account;
    expect(fresh.handle).toBe('jo-leaver');
    expect(fresh.id).not.toBe(editor.id);
    expect(fresh.builds).toEqual([]);

    // The old address no longer reaches the deleted account either.
    const oldAddress = await signedInClient(app, 'jo-leaver@example.test');
    const reborn = sessionResponse.parse((await oldAddress.get('/api/session')).body).account;
    expect(reborn?.id).not.toBe(editor.id);
  });
});
