import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { sessionResponse } from '../../src/shared/schemas/accounts';
import { resetRateLimits, sessionCount, signedInClient } from '../helpers/accounts';
import { createBuild, createEpisode, createUser } from '../helpers/factories';
import { TestClient } from '../helpers/http-client';
import { spawnServerProcess } from '../helpers/server-process';
import { startTestApp, type TestApp } from '../helpers/test-app';

let app: TestApp;
beforeAll(async () => {
  app = await startTestApp();
});
afterAll(async () => {
  await app?.stop();
});
beforeEach(() => resetRateLimits(app.deps.db));

/** A client holding only someone else's cookie. */
function withCookie(baseUrl: string, cookie: string | undefined): TestClient {
  const c = new TestClient(baseUrl);
  c.cookie = cookie;
  return c;
}

describe('sign-out', () => {
  it('ends the session: /api/session is null and the old cookie no longer signs in', async () => {
    const user = await createUser(app.deps.db, { email: 'leaving@example.test' });
    const client = await signedInClient(app, 'leaving@example.test');
    const cookie = client.cookie;
    expect(sessionResponse.parse((await client.get('/api/session')).body).account?.id).toBe(user.id);
    const rowsBefore = await sessionCount(app.deps.db);

    const out = await client.post('/api/session/sign-out', {});
    expect(out.status).toBe(204);
    expect(out.headers.getSetCookie().some((c) => c.startsWith('rr_sid=;'))).toBe(true);
    expect((await client.get('/api/session')).body).toEqual({ account: null });
    expect(await sessionCount(app.deps.db)).toBe(rowsBefore - 1);

    const replay = withCookie(app.baseUrl, cookie);
    expect((await replay.get('/api/session')).body).toEqual({ account: null });
  });

  it('answers sign-out without a session with 401 unauthenticated', async () => {
    const res = await new TestClient(app.baseUrl).post('/api/session/sign-out', {});
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe('unauthenticated');
  });
});

describe('anonymous visitors', () => {
  it('get no session row (and no cookie) from public pages and public API reads', async () => {
    const build = await createBuild(app.deps.db);
    await createEpisode(app.deps.db, { build_id: build.id });
    const before = await sessionCount(app.deps.db);
    for (const page of ['/', '/sign-in', '/sign-in/link', '/no-such-page']) {
      const res = await fetch(`${app.baseUrl}${page}`, { headers: { accept: 'text/html' } });
      await res.arrayBuffer();
      expect(res.status, page).toBeLessThan(500);
      expect(res.headers.getSetCookie(), page).toEqual([]);
    }
    for (const api of ['/api/episodes', '/api/session', '/api/health']) {
      const res = await fetch(`${app.baseUrl}${api}`);
      await res.arrayBuffer();
      expect(res.status, api).toBe(200);
      expect(res.headers.getSetCookie(), api).toEqual([]);
    }
    expect(await sessionCount(app.deps.db)).toBe(before);
  });
});

describe('CSRF', () => {
  it('refuses a mutation without the token with 403 csrf_invalid and changes nothing', async () => {
    const user = await createUser(app.deps.db, { email: 'csrf@example.test', display_name: 'Before' });
    const client = await signedInClient(app, 'csrf@example.test');
    const res = await client.patch('/api/account', { displayName: 'After' }, { csrf: false });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('csrf_invalid');
    const row = await app.deps.db.selectFrom('users').select('display_name').where('id', '=', user.id).executeTakeFirstOrThrow();
    expect(row.display_name).toBe('Before');

    const out = await client.post('/api/session/sign-out', {}, { csrf: false });
    expect(out.status).toBe(403);
    expect(out.body.error.code).toBe('csrf_invalid');
    expect(sessionResponse.parse((await client.get('/api/session')).body).account?.id).toBe(user.id);
  });

  it("refuses another session's token with 403 csrf_invalid", async () => {
    const user = await createUser(app.deps.db, { email: 'csrf-victim@example.test', display_name: 'Victim' });
    const victim = await signedInClient(app, 'csrf-victim@example.test');
    const attacker = new TestClient(app.baseUrl);
    const foreignToken = await attacker.csrfToken();
    expect(foreignToken).not.toBe(await victim.csrfToken());

    const res = await victim.request(
      'PATCH',
      '/api/account',
      { displayName: 'Pwned' },
      { csrf: false, headers: { 'x-csrf-token': foreignToken } },
    );
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('csrf_invalid');
    const row = await app.deps.db.selectFrom('users').select('display_name').where('id', '=', user.id).executeTakeFirstOrThrow();
    expect(row.display_name).toBe('Victim');

    // With its own token the same request goes through.
    const ok = await victim.patch('/api/account', { displayName: 'Still me' });
    expect(ok.status).toBe(200);
  });

  it('refuses an anonymous mutation without the token', async () => {
    const res = await new TestClient(app.baseUrl).post('/api/sign-in-links', { email: 'x@example.test' }, { csrf: false });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('csrf_invalid');
  });
});

describe('sessions across restarts and processes', () => {
  // A spawned server compiles with tsx on start: slow on a loaded machine (see server-process.ts).
  it(
    'keep working after the in-process app restarts on the same database, and on a second server process',
    { timeout: 60_000 },
    async () => {
      const first = await startTestApp({ keepDatabase: true, inProcessOnly: true });
      let second: TestApp | undefined;
      try {
        const user = await createUser(first.deps.db, { email: 'durable@example.test' });
        const client = await signedInClient(first, 'durable@example.test');
        const cookie = client.cookie;
        expect(cookie).toBeDefined();
        await first.stop();

        second = await startTestApp({ databaseUrl: first.database.url, inProcessOnly: true });
        const again = withCookie(second.baseUrl, cookie);
        const res = await again.get('/api/session');
        expect(res.status).toBe(200);
        expect(sessionResponse.parse(res.body).account?.id).toBe(user.id);

        const proc = await spawnServerProcess(second);
        try {
          const there = withCookie(proc.baseUrl, cookie);
          const remote = await there.get('/api/session');
          expect(remote.status).toBe(200);
          expect(sessionResponse.parse(remote.body).account?.id).toBe(user.id);
          // Both servers still serve it, from the one table.
          expect(sessionResponse.parse((await again.get('/api/session')).body).account?.id).toBe(user.id);
        } finally {
          const code = await proc.terminate();
          expect(code, proc.stderr()).toBe(0);
        }
      } finally {
        if (second) await second.stop();
        else await first.database.drop();
      }
    },
  );
});
