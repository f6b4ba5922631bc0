// The episode read is cached per build content revision: every kind of change a reader would see
// bumps the revision (triggers of migration 2026-12-03_1130), so the next read shows it; an unchanged
// episode is answered from the cache, with ETag/304 and gzip.
import { request } from 'node:http';
import { gunzipSync } from 'node:zlib';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createOwnedBuild } from '../helpers/accounts';
import { createEpisode } from '../helpers/factories';
import { TestClient } from '../helpers/http-client';
import { createPartLine, createSponsor } from '../helpers/sponsors';
import { startTestApp, type TestApp } from '../helpers/test-app';

let app: TestApp;
let visitor: TestClient;
let buildId = 0;
let ownerId = 0;
let episodeId = 0;

interface Reading {
  title: string;
  chapters: { title: string }[];
  systems: { name: string }[];
  build: { title: string; owner: { displayName: string } };
  openItems: { opened: { title: string }[] };
  disclosure: { text: string } | null;
}

const read = async (): Promise<Reading> => {
  const res = await visitor.get(`/api/episodes/${episodeId}/reading`);
  expect(res.status).toBe(200);
  return res.body as Reading;
};
/** The read as sent, through node:http: fetch would undo the gzip and add `cache-control: no-cache` to a conditional request. */
function raw(headers: Record<string, string>): Promise<{ status: number; encoding?: string; etag?: string; body: Buffer }> {
  const url = new URL(`${app.baseUrl}/api/episodes/${episodeId}/reading`);
  return new Promise((resolve, reject) => {
    request({ host: url.hostname, port: url.port, path: url.pathname, headers }, (res) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () =>
        resolve({
          status: res.statusCode ?? 0,
          encoding: res.headers['content-encoding'],
          etag: res.headers.etag,
          body: Buffer.concat(chunks),
        }),
      );
    })
      .on('error', reject)
      .end();
  });
}

const revision = async () =>
  (await app.deps.db.selectFrom('builds').select('content_revision').where('id', '=', buildId).executeTakeFirstOrThrow()).content_revision;

beforeAll(async () => {
  app = await startTestApp();
  visitor = new TestClient(app.baseUrl);
  const { owner, build } = await createOwnedBuild(app.deps.db, {
    owner: { handle: 'ida-fenwick', display_name: 'Ida Fenwick', email: 'ida@example.test' },
    build: { slug: 'plover-1961', title: '1961 Marsh Plover saloon' },
  });
  buildId = build.id;
  ownerId = owner.id;
  const e = await createEpisode(app.deps.db, {
    build_id: buildId,
    slug: 'front-hubs',
    title: 'Front hubs',
    status: 'published',
    published_at: new Date(Date.now() - 3_600_000),
  });
  episodeId = e.id;
  await app.deps.db
    .insertInto('build_systems')
    .values({ build_id: buildId, key: 'brakes', name: 'Brakes', safety_critical: true, position: 0 })
    .execute();
  await app.deps.db.insertInto('chapters').values({ episode_id: episodeId, position: 0, start_seconds: 0, title: 'Hub off' }).execute();
});
afterAll(async () => {
  await app?.stop();
});

describe('the cached episode read', () => {
  it('answers an unchanged episode from the cache, with a validator and gzip', async () => {
    await read();
    const hits = app.deps.readingCache.hits;
    const first = await raw({ 'accept-encoding': 'identity' });
    expect(app.deps.readingCache.hits).toBe(hits + 1);
    expect(first.encoding).toBeUndefined();
    expect(first.etag).toMatch(/^W\/"/);
    expect((await raw({ 'if-none-match': first.etag! })).status).toBe(304);
    const gz = await raw({ 'accept-encoding': 'gzip' });
    expect(gz.encoding).toBe('gzip');
    expect(gz.etag).toBe(first.etag);
    expect(JSON.parse(gunzipSync(gz.body).toString()).title).toBe('Front hubs');
  });

  it('shows every kind of change on the next read: episode, chapter, system, build, owner, open item, sponsor', async () => {
    const db = app.deps.db;
    const steps: Array<[string, () => Promise<unknown>, (r: Reading) => unknown, unknown]> = [
      [
        'episode title',
        () => db.updateTable('episodes').set({ title: 'Front hubs and bearings' }).where('id', '=', episodeId).execute(),
        (r) => r.title,
        'Front hubs and bearings',
      ],
      [
        'chapter title',
        () => db.updateTable('chapters').set({ title: 'Hub pulled' }).where('episode_id', '=', episodeId).execute(),
        (r) => r.chapters[0]!.title,
        'Hub pulled',
      ],
      [
        'system name',
        () => db.updateTable('build_systems').set({ name: 'Brakes and hubs' }).where('build_id', '=', buildId).execute(),
        (r) => r.systems[0]!.name,
        'Brakes and hubs',
      ],
      [
        'build title',
        () => db.updateTable('builds').set({ title: '1961 Marsh Plover estate' }).where('id', '=', buildId).execute(),
        (r) => r.build.title,
        '1961 Marsh Plover estate',
      ],
      [
        'owner name',
        () => db.updateTable('users').set({ display_name: 'Ida F.' }).where('id', '=', ownerId).execute(),
        (r) => r.build.owner.displayName,
        'Ida F.',
      ],
      [
        'open item',
        () => db.insertInto('open_items').values({ build_id: buildId, opened_in_episode_id: episodeId, title: 'Seal on order' }).execute(),
        (r) => r.openItems.opened.map((o) => o.title),
        ['Seal on order'],
      ],
    ];
    for (const [what, change, pick, expected] of steps) {
      await read(); // cached at the current revision
      const before = await revision();
      await change();
      expect(await revision(), `${what} bumps the revision`).toBeGreaterThan(before);
      expect(pick(await read()), what).toEqual(expected);
    }

    // A supported line brings the disclosure; renaming its sponsor renames it in the disclosure.
    const sponsor = await createSponsor(db, { name: 'Tidewell Bearings' });
    await read();
    await createPartLine(db, {
      build_id: buildId,
      episode_id: episodeId,
      sponsor_id: sponsor.id,
      support_kind: 'gifted',
      list_price_minor: 4_000,
    });
    expect((await read()).disclosure?.text).toContain('Tidewell Bearings');
    await db.updateTable('sponsors').set({ name: 'Tidewell Bearing Co' }).where('id', '=', sponsor.id).execute();
    expect((await read()).disclosure?.text).toContain('Tidewell Bearing Co');
  });

  it('stops serving the cached body when the build is taken away', async () => {
    await read();
    await app.deps.db.updateTable('builds').set({ visibility: 'private' }).where('id', '=', buildId).execute();
    expect((await visitor.get(`/api/episodes/${episodeId}/reading`)).status).toBe(404);
  });
});
