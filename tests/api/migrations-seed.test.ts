import { sql } from 'kysely';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createDb, type DbHandle } from '../../server/db/kysely';
import { migrateDown, migrateToLatest } from '../../server/db/migrator';
import { runSeed } from '../../server/seed';
import { listFigures } from '../../server/services/figures';
import { loadDemoAccounts } from '../../server/seed/sections/demo-accounts';
import { createTestDatabase, type TestDatabase } from '../helpers/test-db';

let database: TestDatabase;
let handle: DbHandle;
beforeAll(async () => {
  database = await createTestDatabase({ empty: true });
  handle = createDb(database.url, { max: 2 });
});
afterAll(async () => {
  await handle?.destroy();
  await database?.drop();
});

async function schema(): Promise<string[]> {
  // Columns, indexes and triggers (with their definitions), so a migration that only adds an index
  // or a trigger counts too.
  const r = await sql<{ c: string }>`
    select table_name || '.' || column_name as c from information_schema.columns where table_schema = 'public'
    union all
    select 'index ' || indexname || ': ' || indexdef from pg_indexes where schemaname = 'public'
    union all
    select 'trigger ' || t.tgname || ': ' || pg_get_triggerdef(t.oid)
      from pg_trigger t join pg_class c on c.oid = t.tgrelid join pg_namespace n on n.oid = c.relnamespace
     where n.nspname = 'public' and not t.tgisinternal
    order by 1`.execute(handle.db);
  return r.rows.map((t) => t.c);
}

describe('migrations', () => {
  it('go up from empty, down the last one, and up again', async () => {
    const up = await migrateToLatest(handle.db);
    expect(up.results?.length).toBeGreaterThan(0);
    expect(up.results?.every((r) => r.status === 'Success')).toBe(true);
    const full = await schema();
    for (const table of ['users', 'builds', 'episodes', 'sponsors', 'outbox_messages', 'seed_runs'])
      expect(full).toContain(`${table}.id`.replace('seed_runs.id', 'seed_runs.section'));

    const down = await migrateDown(handle.db);
    expect(down.results).toHaveLength(1);
    expect(down.results?.[0]?.migrationName).toBe(up.results?.at(-1)?.migrationName);
    const reduced = await schema();
    expect(reduced).not.toEqual(full);
    expect(reduced).toContain('users.id');

    const again = await migrateToLatest(handle.db);
    expect(again.results).toHaveLength(1);
    expect(await schema()).toEqual(full);
  });
});

describe('demo seed', () => {
  const snapshot = async () => ({
    users: await handle.db.selectFrom('users').select(['id', 'handle', 'display_name', 'is_admin']).orderBy('id').execute(),
    builds: await handle.db.selectFrom('builds').select(['id', 'slug', 'title', 'owner_id']).orderBy('id').execute(),
    members: await handle.db.selectFrom('build_members').select(['build_id', 'user_id', 'role']).orderBy('id').execute(),
    episodes: await handle.db
      .selectFrom('episodes')
      .select(['id', 'build_id', 'slug', 'title', 'status', 'published_at', 'publish_at'])
      .orderBy('id')
      .execute(),
    chapters: await handle.db
      .selectFrom('chapters')
      .select(['id', 'episode_id', 'position', 'start_seconds', 'title'])
      .orderBy('id')
      .execute(),
    figures: await handle.db
      .selectFrom('figures')
      .select(['id', 'episode_id', 'position', 'fastener', 'value', 'unit'])
      .orderBy('id')
      .execute(),
    partLines: await handle.db
      .selectFrom('part_lines')
      .select(['id', 'episode_id', 'position', 'description', 'gross_minor', 'status', 'open_item_id'])
      .orderBy('id')
      .execute(),
    openItems: await handle.db
      .selectFrom('open_items')
      .select(['id', 'title', 'opened_in_episode_id', 'closed_in_episode_id'])
      .orderBy('id')
      .execute(),
  });

  it('creates the demo data, and running it twice leaves the same rows', async () => {
    await runSeed(handle.db);
    const first = await snapshot();
    expect(first.users.map((u) => u.handle).sort()).toEqual(
      loadDemoAccounts()
        .map((a) => a.login)
        .sort(),
    );
    expect(first.users.filter((u) => u.is_admin).map((u) => u.handle)).toEqual(['site-admin']);
    expect(first.builds.length).toBeGreaterThan(0);
    expect(first.episodes.length).toBeGreaterThan(0);
    // The demo: several published episodes per build, one scheduled, one draft, open items carried.
    expect(new Set(first.episodes.map((e) => e.status))).toEqual(new Set(['published', 'scheduled', 'draft']));
    expect(first.chapters.length).toBeGreaterThan(10);
    expect(first.openItems.some((o) => o.closed_in_episode_id !== null && o.closed_in_episode_id !== o.opened_in_episode_id)).toBe(true);

    await runSeed(handle.db);
    expect(await snapshot()).toEqual(first);
    const runs = await handle.db.selectFrom('seed_runs').select(['section']).orderBy('section').execute();
    expect(runs.map((r) => r.section)).toEqual([
      'demo-accounts',
      'demo-builds',
      'demo-figures',
      'demo-followers',
      'demo-parts',
      'demo-sponsors',
    ]);

    // The followers issue's demo: posts in every state, replies, one adopted suggestion with its note,
    // one reported post, follows and a few notices in the outbox; a third run adds nothing.
    const followerRows = async () => ({
      posts: await handle.db.selectFrom('posts').selectAll().orderBy('id').execute(),
      follows: (await handle.db.selectFrom('follows').select('id').execute()).length,
      reports: (await handle.db.selectFrom('post_reports').select('id').execute()).length,
      notices: (await handle.db.selectFrom('outbox_messages').select('id').where('kind', 'like', 'notice-%').execute()).length,
    });
    const demo = await followerRows();
    expect(new Set(demo.posts.map((p) => p.state).filter(Boolean))).toEqual(new Set(['open', 'answered', 'adopted', 'set-aside']));
    expect(demo.posts.some((p) => p.kind === 'reply' && p.by_team)).toBe(true);
    expect(demo.posts.some((p) => p.state === 'adopted' && p.adopted_note)).toBe(true);
    expect(demo.reports).toBe(1);
    expect(demo.follows).toBeGreaterThan(0);
    expect(demo.notices).toBeGreaterThan(0);
    await runSeed(handle.db);
    expect(await followerRows()).toEqual(demo);

    // The parts issue's demo: reused and made lines with an avoided cost, lines on order tied to open items,
    // a line in another currency, a part sold off, per-system budgets with one system over its budget.
    const lines = await handle.db.selectFrom('part_lines').selectAll().execute();
    expect(lines.some((l) => (l.source === 'reused' || l.source === 'made') && l.avoided_cost_minor !== null)).toBe(true);
    expect(lines.some((l) => l.status === 'on-order' && l.open_item_id !== null)).toBe(true);
    expect(lines.some((l) => l.fx_rate !== null)).toBe(true);
    expect(lines.some((l) => l.kind === 'sale')).toBe(true);
    const over = await sql<{ key: string }>`
      select s.key from build_systems s
       where s.budget_minor < (select coalesce(sum(gross_minor), 0) from part_lines pl
                                where pl.build_id = s.build_id and pl.system_key = s.key and pl.status in ('arrived', 'fitted'))`.execute(
      handle.db,
    );
    expect(over.rows.map((r) => r.key)).toEqual(['cooling']);

    // The sponsors issue's demo: two sponsors with a member each, a linked supplier, gifted and
    // discounted lines with list prices on both builds, one paid sponsorship, one affiliate link, and
    // every published or scheduled episode that needs a disclosure confirmed, so it passes the checks.
    const sponsorRows = async () => ({
      sponsors: await handle.db.selectFrom('sponsors').select(['id', 'slug', 'website']).orderBy('slug').execute(),
      members: (await handle.db.selectFrom('sponsor_members').select('id').execute()).length,
      linked: (await handle.db.selectFrom('sponsor_suppliers').select('supplier_id').execute()).length,
      sponsorships: await handle.db.selectFrom('sponsorships').select(['build_id', 'kind', 'starts_on']).orderBy('id').execute(),
      supported: await handle.db
        .selectFrom('part_lines')
        .select(['build_id', 'support_kind', 'sponsor_id', 'list_price_minor', 'unit_price_minor'])
        .where('support_kind', 'is not', null)
        .orderBy('id')
        .execute(),
    });
    const sponsorDemo = await sponsorRows();
    expect(sponsorDemo.sponsors.map((s) => s.slug)).toEqual(['quillon-motor-parts', 'tinderbox-tools']);
    expect(sponsorDemo.sponsors.every((s) => s.website?.endsWith('.example'))).toBe(true);
    expect(sponsorDemo.members).toBe(2);
    expect(sponsorDemo.linked).toBe(1);
    expect(sponsorDemo.sponsorships.filter((s) => s.kind === 'paid')).toHaveLength(1);
    expect(new Set(sponsorDemo.supported.map((l) => l.support_kind))).toEqual(new Set(['gifted', 'discounted']));
    expect(new Set(sponsorDemo.supported.map((l) => l.build_id)).size).toBe(2);
    expect(sponsorDemo.supported.every((l) => l.sponsor_id !== null && l.list_price_minor! > l.unit_price_minor)).toBe(true);
    expect(lines.filter((l) => l.affiliate)).toHaveLength(1);
    const { runPublishChecks } = await import('../../server/services/publish-checks');
    const { episodeDisclosure } = await import('../../server/services/disclosure');
    const out = first.episodes.filter((e) => e.status !== 'draft');
    let disclosed = 0;
    for (const e of out) {
      expect(await runPublishChecks(handle.db, e.id), `episode ${e.id}`).toEqual([]);
      if (await episodeDisclosure(handle.db, e.id)) disclosed += 1;
    }
    expect(disclosed).toBeGreaterThanOrEqual(3);
    await runSeed(handle.db);
    expect(await sponsorRows()).toEqual(sponsorDemo);

    // The figures issue's demo: mixed units, one by hand below the wrench's range, one weaker substitute, one torque plus angle.
    const figures = (
      await Promise.all([...new Set(first.figures.map((f) => f.episode_id))].map((id) => listFigures(handle.db, id)))
    ).flat();
    expect(new Set(figures.map((f) => f.unit)).size).toBeGreaterThanOrEqual(3);
    const kinds = figures.flatMap((f) => f.checks.map((c) => c.kind));
    expect(kinds).toContain('weaker-substitute');
    expect(kinds).toContain('below-wrench-range');
    expect(figures.some((f) => f.method === 'torque-angle' && f.angleStages.length > 0)).toBe(true);
  });
});

describe('demo photos', () => {
  it('are stored like uploads (clean, with sizes) for covers, galleries and one receipt, once', async () => {
    const { startS3Fake } = await import('../../fakes/s3');
    const { createS3Storage } = await import('../../server/adapters/storage');
    const { seedSections } = await import('../../server/seed');
    const { ListObjectsV2Command, GetObjectCommand } = await import('@aws-sdk/client-s3');
    const sharp = (await import('sharp')).default;
    const { mkdtemp } = await import('node:fs/promises');
    const os = await import('node:os');
    const path = await import('node:path');
    const s3 = await startS3Fake({ port: 0, directory: await mkdtemp(path.join(os.tmpdir(), 'rr-seed-s3-')), buckets: ['seed-photos'] });
    const storage = createS3Storage({
      S3_ENDPOINT: s3.url,
      S3_REGION: 'us-east-1',
      S3_BUCKET: 'seed-photos',
      S3_ACCESS_KEY_ID: 'S3RVER',
      S3_SECRET_ACCESS_KEY: 'S3RVER',
      s3ForcePathStyle: true,
    });
    try {
      await runSeed(handle.db, seedSections, { storage });
      const media = await handle.db.selectFrom('media').selectAll().orderBy('id').execute();
      const photos = media.filter((m) => m.kind === 'photo');
      expect(photos.length).toBeGreaterThanOrEqual(8);
      // Every photo is described, ready, and has its WebP sizes.
      for (const p of photos) {
        expect(p.alt_text?.length).toBeGreaterThan(10);
        expect(p.status).toBe('ready');
        expect((p.variants as Array<{ width: number }>).map((v) => v.width)).toEqual([320, 960, 1200]);
      }
      const builds = await handle.db.selectFrom('builds').select(['slug', 'cover_media_id']).execute();
      expect(builds.every((b) => b.cover_media_id !== null)).toBe(true);
      const gallery = await handle.db.selectFrom('episode_gallery').selectAll().execute();
      expect(gallery.length).toBe(5);
      const receipt = media.filter((m) => m.kind === 'receipt');
      expect(receipt).toHaveLength(1);
      expect(receipt[0]!.content_type).toBe('application/pdf');
      const line = await handle.db.selectFrom('part_lines').select('description').where('receipt_media_id', '=', receipt[0]!.id).execute();
      expect(line.map((l) => l.description)).toEqual(['Caliper seal kit, 48 mm']);

      // The objects are there, and the stored originals carry no metadata at all.
      const listed = await storage.client.send(new ListObjectsV2Command({ Bucket: 'seed-photos' }));
      const keys = (listed.Contents ?? []).map((o) => o.Key);
      for (const m of media) expect(keys).toContain(m.object_key);
      const original = await storage.client.send(new GetObjectCommand({ Bucket: 'seed-photos', Key: photos[0]!.object_key }));
      const meta = await sharp(Buffer.from(await original.Body!.transformToByteArray())).metadata();
      expect(meta.exif).toBeUndefined();

      // A second run adds nothing.
      await runSeed(handle.db, seedSections, { storage });
      expect(await handle.db.selectFrom('media').selectAll().orderBy('id').execute()).toEqual(media);
      expect(await handle.db.selectFrom('episode_gallery').selectAll().execute()).toHaveLength(5);
    } finally {
      storage.close();
      await s3.stop();
    }
  });
});
