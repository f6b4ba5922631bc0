// The benchmark's scale dataset, generated small (the same SQL as `npm run bench`, at BENCH_SCALE 0.005):
// its shape, its largest sponsor, and that the rows it writes pass the schema's checks and triggers.
import pg from 'pg';
import { afterAll, beforeAll, expect, it } from 'vitest';
import { generateScaleData, hasScaleData, LARGE, scaleSizes } from '../bench/scale-data';
import { createTestDatabase, type TestDatabase } from '../helpers/test-db';

const SCALE = 0.005;
let database: TestDatabase;
let client: pg.Client;
const one = async <T>(text: string, values: unknown[] = []): Promise<T> => (await client.query(text, values)).rows[0] as T;

beforeAll(async () => {
  database = await createTestDatabase();
  await generateScaleData(database.url, SCALE);
  client = new pg.Client({ connectionString: database.url });
  await client.connect();
}, 120_000);
afterAll(async () => {
  await client?.end();
  await database?.drop();
});

it('writes the counts the scale asks for, and remembers it', async () => {
  const s = scaleSizes(SCALE);
  const counts = await one<{ builds: number; episodes: number; sponsors: number; lines: number; chapters: number }>(
    `select (select count(*) from builds)::int as builds, (select count(*) from episodes)::int as episodes,
            (select count(*) from sponsors)::int as sponsors, (select count(*) from part_lines)::int as lines,
            (select count(*) from chapters)::int as chapters`,
  );
  expect(counts.builds).toBe(s.builds);
  expect(counts.episodes).toBe(s.builds * s.episodesPerBuild);
  expect(counts.sponsors).toBe(s.sponsors);
  // Every episode has its lines and chapters; the large one has more (150 and 40).
  expect(counts.lines).toBe((counts.episodes - 1) * s.linesPerEpisode + 150);
  expect(counts.chapters).toBe((counts.episodes - 1) * s.chaptersPerEpisode + 40);
  expect(await hasScaleData(database.url, SCALE)).toBe(true);
  expect(await hasScaleData(database.url, 1)).toBe(false);
});

it('has the large episode the bench reads: 40 chapters, 150 part lines, 200 posts, published', async () => {
  const e = await one<{ chapters: number; lines: number; posts: number; status: string; words: number }>(
    `select (select count(*) from chapters c where c.episode_id = e.id)::int as chapters,
            (select count(*) from part_lines l where l.episode_id = e.id)::int as lines,
            (select count(*) from posts p where p.episode_id = e.id)::int as posts, e.status,
            array_length(regexp_split_to_array(e.write_up_text, '\\s+'), 1) as words
       from episodes e join builds b on b.id = e.build_id join users u on u.id = b.owner_id
      where u.handle = $1 and b.slug = $2 and e.slug = $3`,
    [LARGE.handle, LARGE.buildSlug, LARGE.episodeSlug],
  );
  expect(e).toMatchObject({ chapters: 40, lines: 150, posts: 200, status: 'published' });
  // The search trigger filled the write-up's text from the JSON document.
  expect(e.words).toBeGreaterThan(500);
});

it('gives support to a share of lines, each with both sponsor and kind, the first sponsor clearly largest', async () => {
  const rows = (
    await client.query<{ slug: string; lines: number }>(
      `select s.slug, count(l.id)::int as lines from sponsors s left join part_lines l on l.sponsor_id = s.id
        group by s.slug order by lines desc`,
    )
  ).rows;
  expect(rows[0]!.slug).toBe(LARGE.largestSponsor);
  expect(rows[0]!.lines).toBeGreaterThan(2 * rows[1]!.lines);
  const half = await one<{ n: number }>(`select count(*)::int as n from part_lines where (sponsor_id is null) <> (support_kind is null)`);
  expect(half.n).toBe(0);
  const share = await one<{ share: number }>(`select avg((sponsor_id is not null)::int)::float as share from part_lines`);
  expect(share.share).toBeGreaterThan(0.08);
  expect(share.share).toBeLessThan(0.25);
  // Every sponsored build has its sponsorship.
  const missing = await one<{ n: number }>(
    `select count(*)::int as n from (select distinct build_id, sponsor_id from part_lines where sponsor_id is not null) x
      where not exists (select 1 from sponsorships s where s.build_id = x.build_id and s.sponsor_id = x.sponsor_id)`,
  );
  expect(missing.n).toBe(0);
});
