// The read path's cost and the server's behaviour under load: SQL round trips of the episode read
// (counted by the bench-mode hook), HTTP validators, and load shedding beyond the pool's queue bound.
import http from 'node:http';
import { sql } from 'kysely';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createBuild, createEpisode } from '../helpers/factories';
import { startTestApp, type TestApp } from '../helpers/test-app';

describe('episode read in bench mode', () => {
  let app: TestApp;
  const ids = { small: 0, large: 0 };

  beforeAll(async () => {
    app = await startTestApp({ env: { BENCH_QUERY_COUNT: 'true' } });
    const db = app.deps.db;
    const build = await createBuild(db);
    await db
      .insertInto('build_systems')
      .values([
        { build_id: build.id, key: 'brakes', name: 'Brakes', safety_critical: true, position: 0 },
        { build_id: build.id, key: 'body', name: 'Body', safety_critical: false, position: 1 },
      ])
      .execute();
    const small = await createEpisode(db, { build_id: build.id, duration_seconds: 600 });
    const large = await createEpisode(db, { build_id: build.id, duration_seconds: 4000 });
    await createEpisode(db, { build_id: build.id });
    ids.small = small.id;
    ids.large = large.id;
    await db.insertInto('chapters').values({ episode_id: small.id, position: 0, start_seconds: 0, title: 'Only chapter' }).execute();
    // The large one: 40 chapters, 150 part lines, open items opened here (one closed by the next episode).
    await sql`insert into chapters (episode_id, position, start_seconds, title, system_key)
      select ${large.id}, g, g * 90, 'Chapter ' || g, case when g % 2 = 0 then 'body' else null end from generate_series(0, 39) g`.execute(
      db,
    );
    await sql`insert into part_lines (build_id, episode_id, position, kind, description, source, status, quantity, unit_price_minor, currency, system_key)
      select ${build.id}, ${large.id}, g, 'part', 'Part ' || g, 'new', 'fitted', 1, 1000 + g, 'GBP', case when g = 7 then 'brakes' else null end
      from generate_series(0, 149) g`.execute(db);
    await sql`insert into open_items (build_id, title, opened_in_episode_id) select ${build.id}, 'Item ' || g, ${large.id} from generate_series(1, 12) g`.execute(
      db,
    );
  });
  afterAll(async () => {
    await app?.stop();
  });

  const queries = async () => ((await (await fetch(`${app.baseUrl}/__bench/queries`)).json()) as { queries: number }).queries;

  async function roundTrips(episodeId: number): Promise<{ trips: number; body: Record<string, unknown> }> {
    const before = await queries();
    const res = await fetch(`${app.baseUrl}/api/episodes/${episodeId}/reading`);
    expect(res.status).toBe(200);
    const body = (await res.json()) as Record<string, unknown>;
    return { trips: (await queries()) - before, body };
  }

  it('reads a small and a large episode in the same number of SQL round trips, at most 3', async () => {
    const small = await roundTrips(ids.small);
    const large = await roundTrips(ids.large);
    expect(large.trips).toBeLessThanOrEqual(3);
    expect(large.trips).toBe(small.trips);
    expect(large.body.chapters).toHaveLength(40);
    // A part line on the safety-critical brakes brings the caution, as the per-table reads did.
    expect((large.body.caution as string[]).some((c) => c.includes('Brakes'))).toBe(true);
    expect((large.body.openItems as { opened: unknown[] }).opened).toHaveLength(12);
    expect(large.body.previous).toMatchObject({ id: ids.small });
    expect(large.body.next).not.toBeNull();
  });

  // fetch() adds `Cache-Control: no-cache` to a conditional request (the Fetch standard), which
  // tells the server to ignore the validator; a browser revalidating a page sends no such header.
  function conditionalGet(url: string, etag: string): Promise<{ status: number; body: string }> {
    return new Promise((resolve, reject) => {
      http
        .get(url, { headers: { 'if-none-match': etag } }, (res) => {
          let body = '';
          res.on('data', (c: Buffer) => (body += c.toString()));
          res.on('end', () => resolve({ status: res.statusCode ?? 0, body }));
        })
        .on('error', reject);
    });
  }

  it('answers 304 to a reader who sends back the ETag, with no body', async () => {
    const first = await fetch(`${app.baseUrl}/api/episodes/${ids.large}/reading`);
    const etag = first.headers.get('etag');
    expect(etag).toBeTruthy();
    const again = await conditionalGet(`${app.baseUrl}/api/episodes/${ids.large}/reading`, etag!);
    expect(again).toEqual({ status: 304, body: '' });
    // A change to the episode changes the tag.
    await app.deps.db
      .updateTable('chapters')
      .set({ title: 'Renamed' })
      .where('episode_id', '=', ids.large)
      .where('position', '=', 0)
      .execute();
    const changed = await conditionalGet(`${app.baseUrl}/api/episodes/${ids.large}/reading`, etag!);
    expect(changed.status).toBe(200);
    expect(JSON.parse(changed.body)).toMatchObject({ chapters: expect.arrayContaining([expect.objectContaining({ title: 'Renamed' })]) });
  });

  it('answers the episode page in one response, each part as its own endpoint answers it', async () => {
    const e = await app.deps.db.selectFrom('episodes').select(['build_id', 'slug']).where('id', '=', ids.large).executeTakeFirstOrThrow();
    const res = await fetch(`${app.baseUrl}/api/builds/${e.build_id}/episode-page/${e.slug}`);
    expect(res.status).toBe(200);
    const page = (await res.json()) as Record<string, unknown>;
    const get = async (path: string) => (await fetch(`${app.baseUrl}${path}`)).json();
    expect(page.episodeId).toBe(ids.large);
    expect(page.movedFrom).toBeNull();
    expect(page.reading).toEqual(await get(`/api/episodes/${ids.large}/reading`));
    expect(page.parts).toEqual(await get(`/api/episodes/${ids.large}/part-lines`));
    expect(page.totals).toEqual(await get(`/api/builds/${e.build_id}/totals`));
    expect(page.figures).toEqual(await get(`/api/episodes/${ids.large}/figures`));
    expect(page.posts).toEqual(await get(`/api/episodes/${ids.large}/posts`));
    expect((page.parts as { items: unknown[] }).items).toHaveLength(150);
    // A former slug answers 301 to the current one's page.
    await app.deps.db.insertInto('episode_slugs').values({ episode_id: ids.large, build_id: e.build_id, slug: 'old-name' }).execute();
    const moved = await fetch(`${app.baseUrl}/api/builds/${e.build_id}/episode-page/old-name`, { redirect: 'manual' });
    expect(moved.status).toBe(301);
    expect(moved.headers.get('location')).toBe(`/api/builds/${e.build_id}/episode-page/${e.slug}`);
    expect((await fetch(`${app.baseUrl}/api/builds/${e.build_id}/episode-page/no-such-episode`)).status).toBe(404);
  });

  it('creates no session for an anonymous reader', async () => {
    const res = await fetch(`${app.baseUrl}/api/episodes/${ids.large}/reading`);
    expect(res.headers.get('set-cookie')).toBeNull();
    const { n } = await app.deps.db
      .selectFrom('sessions')
      .select((eb) => eb.fn.countAll<number>().as('n'))
      .executeTakeFirstOrThrow();
    expect(n).toBe(0);
  });
});

describe('load shedding', () => {
  let app: TestApp;

  beforeAll(async () => {
    app = await startTestApp({ env: { DATABASE_POOL_MAX: '1', DATABASE_QUEUE_MAX: '2' } });
  });
  afterAll(async () => {
    await app?.stop();
  });

  it('answers 503 with Retry-After beyond the pool queue bound, and serves the queued requests once a connection is free', async () => {
    // Hold the only pooled connection, so requests queue behind it.
    const held = await app.deps.pool.connect();
    let released = false;
    try {
      // The directory runs four queries side by side, but a request waits for the pool with one query
      // at a time (server/db/request-gate.ts): one request is one place in the queue.
      const queued = [fetch(`${app.baseUrl}/api/builds`)];
      const waitFor = async (n: number) => {
        const deadline = Date.now() + 10_000;
        while (app.deps.pool.waitingCount < n && Date.now() < deadline) await new Promise((r) => setTimeout(r, 20));
      };
      await waitFor(1);
      await new Promise((r) => setTimeout(r, 200));
      expect(app.deps.pool.waitingCount).toBe(1);
      queued.push(fetch(`${app.baseUrl}/api/builds?page=2`));
      await waitFor(2);
      expect(app.deps.pool.waitingCount).toBe(2);

      const shed = await fetch(`${app.baseUrl}/api/episodes`);
      expect(shed.status).toBe(503);
      expect(Number(shed.headers.get('retry-after'))).toBeGreaterThan(0);
      expect(await shed.json()).toEqual({ error: { code: 'overloaded', message: expect.any(String) } });
      // The health check is never shed: it answers with its own report (the database probe times out here).
      expect(await (await fetch(`${app.baseUrl}/api/health`)).json()).toMatchObject({ services: { database: 'down' } });

      held.release();
      released = true;
      for (const res of await Promise.all(queued)) expect(res.status).toBe(200);
      expect((await fetch(`${app.baseUrl}/api/episodes`)).status).toBe(200);
    } finally {
      if (!released) held.release();
    }
  });
});
