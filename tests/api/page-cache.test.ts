// What visitors without a session read is kept: the episode page's answer and the build's totals per
// build content revision (posts and supplier names now bump it too, migration 2026-12-03_1400), and
// the server-rendered page per address, served again only while the answers it was built from are
// unchanged. Each check below changes something a visitor sees and expects the next read to show it.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createOwnedBuild, signedInClient } from '../helpers/accounts';
import { createEpisode, createUser } from '../helpers/factories';
import { TestClient } from '../helpers/http-client';
import { createPartLine } from '../helpers/sponsors';
import { startTestApp, type TestApp } from '../helpers/test-app';

let app: TestApp;
let visitor: TestClient;
let buildId = 0;
let episodeId = 0;
let followerId = 0;
const pagePath = '/builds/nell-ashdown/heron-1958/episodes/rear-axle';

interface EpisodePageAnswer {
  posts: { items: { body: string; author: { displayName: string } }[] } | null;
  parts: { items: { supplier: { name: string } | null }[] } | null;
}

const answer = async (): Promise<EpisodePageAnswer> => {
  const res = await visitor.get(`/api/builds/${buildId}/episode-page/rear-axle`);
  expect(res.status).toBe(200);
  return res.body as EpisodePageAnswer;
};
const page = async (cookie?: string): Promise<string> => {
  const res = await fetch(`${app.baseUrl}${pagePath}`, { headers: cookie ? { cookie } : {} });
  expect(res.status).toBe(200);
  return res.text();
};
const totalLines = async (): Promise<number> => {
  const res = await visitor.get(`/api/builds/${buildId}/totals`);
  expect(res.status).toBe(200);
  return (res.body as { totals: { lines: number } }).totals.lines;
};

beforeAll(async () => {
  app = await startTestApp();
  visitor = new TestClient(app.baseUrl);
  const { build } = await createOwnedBuild(app.deps.db, {
    owner: { handle: 'nell-ashdown', display_name: 'Nell Ashdown', email: 'nell@example.test' },
    build: { slug: 'heron-1958', title: '1958 Heron roadster' },
  });
  buildId = build.id;
  const e = await createEpisode(app.deps.db, {
    build_id: buildId,
    slug: 'rear-axle',
    title: 'Rear axle out',
    status: 'published',
    published_at: new Date(Date.now() - 3_600_000),
  });
  episodeId = e.id;
  await app.deps.db.insertInto('chapters').values({ episode_id: episodeId, position: 0, start_seconds: 0, title: 'Axle down' }).execute();
  followerId = (await createUser(app.deps.db, { handle: 'wren-okafor', display_name: 'Wren Okafor' })).id;
});
afterAll(async () => {
  await app?.stop();
});

describe("the episode page's answer for visitors", () => {
  it('shows a new post, a post author’s new name and a supplier’s new name on the next read', async () => {
    const db = app.deps.db;
    expect((await answer()).posts?.items).toEqual([]);
    const hits = app.deps.readingCache.hits;
    await answer();
    expect(app.deps.readingCache.hits, 'an unchanged page is answered from the cache').toBe(hits + 1);

    await db
      .insertInto('posts')
      .values({
        episode_id: episodeId,
        build_id: buildId,
        author_id: followerId,
        kind: 'question',
        state: 'open',
        chapter_start_seconds: 0,
        body: 'Were the half-shafts splined or keyed?',
      })
      .execute();
    expect((await answer()).posts?.items.map((p) => p.body)).toEqual(['Were the half-shafts splined or keyed?']);

    await db.updateTable('users').set({ display_name: 'Wren O.' }).where('id', '=', followerId).execute();
    expect((await answer()).posts?.items[0]?.author.displayName).toBe('Wren O.');

    const supplier = await db.insertInto('suppliers').values({ name: 'Kestrel Axle Works' }).returning('id').executeTakeFirstOrThrow();
    await createPartLine(db, { build_id: buildId, episode_id: episodeId, supplier_id: supplier.id, description: 'Axle bearing' });
    expect((await answer()).parts?.items.map((l) => l.supplier?.name)).toEqual(['Kestrel Axle Works']);
    await db.updateTable('suppliers').set({ name: 'Kestrel Axle Co' }).where('id', '=', supplier.id).execute();
    expect((await answer()).parts?.items.map((l) => l.supplier?.name)).toEqual(['Kestrel Axle Co']);
  });

  it("keeps the build's published totals until a line changes them", async () => {
    const before = await totalLines();
    const hits = app.deps.readingCache.hits;
    expect(await totalLines()).toBe(before);
    expect(app.deps.readingCache.hits).toBe(hits + 1);
    await createPartLine(app.deps.db, { build_id: buildId, episode_id: episodeId, description: 'Hub seal' });
    expect(await totalLines()).toBe(before + 1);
  });
});

describe('the server-rendered page for visitors', () => {
  it('is rendered once and then served from the cache while its answers are unchanged', async () => {
    const first = await page();
    expect(first).toContain('Rear axle out');
    const hits = app.deps.pageCache.hits;
    expect(await page()).toBe(first);
    expect(app.deps.pageCache.hits).toBe(hits + 1);
  });

  it('is rendered again once anything on it changes', async () => {
    await page();
    await app.deps.db.updateTable('episodes').set({ title: 'Rear axle out and stripped' }).where('id', '=', episodeId).execute();
    expect(await page()).toContain('Rear axle out and stripped');
    await app.deps.db
      .insertInto('posts')
      .values({
        episode_id: episodeId,
        build_id: buildId,
        author_id: followerId,
        kind: 'suggestion',
        state: 'open',
        chapter_start_seconds: 0,
        body: 'Try a slide hammer on the flange.',
      })
      .execute();
    expect(await page()).toContain('Try a slide hammer on the flange.');
  });

  it('is never kept for, nor served to, someone signed in', async () => {
    await page();
    const member = await signedInClient(app, 'nell@example.test');
    const hits = app.deps.pageCache.hits;
    const misses = app.deps.pageCache.misses;
    const html = await page(member.cookie);
    expect(html).toContain('Rear axle out and stripped');
    expect(app.deps.pageCache.hits).toBe(hits);
    expect(app.deps.pageCache.misses).toBe(misses);
  });
});
