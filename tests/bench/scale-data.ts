// The scale dataset for `npm run bench` and `npm run test:load`: 1,000 builds, 20,000 episodes
// (~10 chapters and a write-up of several paragraphs each), 400,000 part lines (a share supported by
// 50 sponsors, the first clearly the largest), 100,000 posts, open items. Written by bulk
// `INSERT … SELECT` over generate_series into a database of its own, never the demo one.
// BENCH_SCALE (default 1) multiplies the counts: BENCH_SCALE=0.01 makes a small copy for a smoke test.
// Every name is invented. Run alone: `DATABASE_URL=… npx tsx tests/bench/scale-data.ts`.
import pg from 'pg';

/** Bump when the generated shape changes: a cached dataset of another version is regenerated. */
export const DATASET_VERSION = 1;

export interface ScaleSizes {
  builds: number;
  episodesPerBuild: number;
  chaptersPerEpisode: number;
  linesPerEpisode: number;
  postsTotal: number;
  sponsors: number;
  readers: number;
}

/** The counts for a scale factor; 1 is the issue's dataset. */
export function scaleSizes(scale: number): ScaleSizes {
  return {
    builds: Math.max(5, Math.round(1000 * scale)),
    episodesPerBuild: 20,
    chaptersPerEpisode: 10,
    linesPerEpisode: 20,
    postsTotal: Math.max(300, Math.round(100_000 * scale)),
    sponsors: Math.max(5, Math.min(50, Math.round(50 * Math.sqrt(scale)))),
    readers: Math.max(20, Math.round(2000 * scale)),
  };
}

/** Where the benchmark finds its cases. */
export const LARGE = {
  handle: 'bench-creator-1',
  buildSlug: 'bench-build-1',
  episodeSlug: 'the-big-teardown',
  largestSponsor: 'bench-sponsor-1',
};

const SENTENCES = [
  'The seized caliper piston finally let go after a night soaking in penetrating oil and a gentle push from the grease gun.',
  'Every bolt on the subframe came out except one, which had rusted into the captive nut and needed heat and patience.',
  'We measured the brake disc at the centre of the swept area and it was well under the thickness stamped on the hub face.',
  'The wiring loom had been cut and twisted back together twice, so it came out whole and went on the bench for a proper look.',
  'A cardboard template of the sill section saved two attempts with the shears and made the final panel fit first time.',
  'Sandblasting showed pinholes around the spring hanger that paint had hidden for decades.',
  'The carburettor float was set by the workshop manual figure, then checked again with the fuel line connected.',
  'We bagged and labelled every fastener as it came off, which is the only reason the reassembly went in a single evening.',
  'The old hoses crumbled when squeezed, so the whole cooling circuit was replaced rather than patched.',
  'Seam sealer went along every new weld before the primer, and the drain holes were cleared with a drill bit by hand.',
  'The steering box had a flat spot in the middle of its travel, which the adjuster screw could only partly take up.',
  'Fresh gear oil went in to the level plug, and the old oil came out with a fine silver sheen that told its own story.',
  'The dash gauges were tested on a bench supply before they went back behind the new cluster glass.',
  'A borrowed engine crane made short work of lifting the block, but the chain angle needed three attempts to get right.',
  'Chassis numbers were photographed before any paint went near them, for the registration paperwork later.',
  'The new bushes were pressed in with a threaded rod and two sockets, since the press was out on loan.',
];
const CHAPTER_TITLES = [
  'Strip down',
  'Assessment',
  'Cutting out the rot',
  'Fabricating the repair',
  'Welding',
  'Seam sealing',
  'Primer',
  'Reassembly',
  'Torque-up',
  'First start',
  'Road test',
  'What went wrong',
  'Parts haul',
  'Wiring',
];
const SYSTEMS: Array<[string, string, boolean]> = [
  ['body', 'Body and chassis', false],
  ['brakes', 'Brakes', true],
  ['engine', 'Engine', false],
  ['electrics', 'Electrics', false],
  ['steering', 'Steering and suspension', true],
  ['fuel', 'Fuel system', true],
];
const MAKES = ['Tollgate', 'Wexford Motor Co.', 'Harland', 'Bramley', 'Corran', 'Ostler', 'Fenwick & Dale', 'Marlow'];
const PARTS = [
  'brake shoe set',
  'wheel cylinder',
  'sill panel',
  'floor pan section',
  'radiator hose',
  'spark plug',
  'fuel pump',
  'track rod end',
  'wiper motor',
  'door seal',
  'head gasket',
  'clutch cable',
  'drum',
  'dynamo brush set',
  'exhaust clamp',
];

const lit = (values: string[]) => `array[${values.map((v) => `'${v.replace(/'/g, "''")}'`).join(',')}]::text[]`;

/** The statements, in order; each `INSERT … SELECT` writes a whole table at once. */
export function scaleDataSql(s: ScaleSizes): Array<[string, string]> {
  const episodes = s.builds * s.episodesPerBuild;
  const sentences = lit(SENTENCES);
  const n = SENTENCES.length;
  return [
    [
      'people',
      `insert into users (handle, display_name, email)
       select 'bench-creator-' || g, 'Creator ' || g, 'creator' || g || '@bench.example.test' from generate_series(1, ${s.builds}) g
       union all
       select 'bench-reader-' || g, 'Reader ' || g, 'reader' || g || '@bench.example.test' from generate_series(1, ${s.readers}) g`,
    ],
    [
      'builds',
      `insert into builds (owner_id, slug, title, visibility, vehicle_kind, vehicle_make, vehicle_model, vehicle_year, summary, currency, budget_minor)
       select u.id, 'bench-build-' || g, (${lit(MAKES)})[1 + g % ${MAKES.length}] || ' restoration no. ' || g,
              case when g % 10 = 0 then 'unlisted' else 'public' end,
              (array['car','motorcycle','tractor','boat'])[1 + g % 4], (${lit(MAKES)})[1 + g % ${MAKES.length}], 'Model ' || (g % 23),
              (1948 + g % 40)::text, 'A restoration filmed one session at a time.', 'GBP', 800000 + (g % 50) * 10000
       from generate_series(1, ${s.builds}) g join users u on u.handle = 'bench-creator-' || g`,
    ],
    [
      'systems',
      `insert into build_systems (build_id, key, name, safety_critical, position, budget_minor)
       select b.id, s.key, s.name, s.critical, s.pos, 100000 from builds b
       cross join (values ${SYSTEMS.map(([k, name, c], i) => `('${k}', '${name}', ${c}, ${i})`).join(',')}) as s(key, name, critical, pos)`,
    ],
    [
      'episodes (write-ups)',
      `insert into episodes (build_id, number, slug, title, summary, status, published_at, write_up, write_up_html, video_url,
                             duration_seconds, minutes_worked, raised_vehicle)
       select b.id, e.n,
              case when big then '${LARGE.episodeSlug}' else 'episode-' || e.n end,
              case when big then 'The big teardown' else 'Session ' || e.n || ': ' || (${lit(CHAPTER_TITLES)})[1 + (b.id + e.n) % ${CHAPTER_TITLES.length}] end,
              'What happened in the workshop this session.', 'published',
              now() - interval '1 hour' - ((${episodes} - (b.id * ${s.episodesPerBuild} + e.n)) * interval '5 minutes'),
              w.doc, w.html, 'https://video.example.test/watch?v=b' || b.id || 'e' || e.n, 3600, 180 + (e.n % 5) * 30, e.n % 7 = 0
       from builds b cross join generate_series(1, ${s.episodesPerBuild}) e(n)
       cross join lateral (select b.slug = '${LARGE.buildSlug}' and e.n = ${s.episodesPerBuild} as big) l
       cross join lateral (
         select jsonb_build_object('type', 'doc', 'content', jsonb_agg(jsonb_build_object('type', 'paragraph', 'content',
                  jsonb_build_array(jsonb_build_object('type', 'text', 'text', p.t))) order by p.i)) as doc,
                string_agg('<p>' || p.t || '</p>', '' order by p.i) as html
         from (select i, s[1 + (b.id * 7 + e.n * 13 + i * 3) % ${n}] || ' ' || s[1 + (b.id * 11 + e.n * 5 + i * 7 + 1) % ${n}] || ' '
                         || s[1 + (b.id * 3 + e.n * 17 + i * 5 + 2) % ${n}] as t
               from generate_series(1, case when l.big then 24 else 6 end) i, (select ${sentences} as s) ss) p
       ) w`,
    ],
    [
      'chapters',
      `insert into chapters (episode_id, position, start_seconds, title, system_key, notes)
       select e.id, c, c * (3600 / k.n), (${lit(CHAPTER_TITLES)})[1 + (e.id + c) % ${CHAPTER_TITLES.length}],
              case when c % 3 = 1 then (array['body','brakes','engine','electrics','steering','fuel'])[1 + (e.id + c) % 6] end,
              case when c % 4 = 0 then 'Take your time here; the photos help at reassembly.' end
       from episodes e
       cross join lateral (select case when e.slug = '${LARGE.episodeSlug}' then 40 else ${s.chaptersPerEpisode} end as n) k
       cross join lateral generate_series(0, k.n - 1) c`,
    ],
    [
      'suppliers and sponsors',
      `with sup as (
         insert into suppliers (name, website)
         select 'Bench Supplier ' || g || ' ' || (array['Spares','Motor Factors','Panels','Fixings','Autojumble'])[1 + g % 5], 'https://supplier' || g || '.example.test'
         from generate_series(1, 200) g returning id),
       sp as (
         insert into sponsors (slug, name, website)
         select 'bench-sponsor-' || g, 'Bench Sponsor ' || g || ' Ltd', 'https://sponsor' || g || '.example.test'
         from generate_series(1, ${s.sponsors}) g returning id)
       select (select count(*) from sup), (select count(*) from sp)`,
    ],
    [
      'sponsor suppliers',
      `insert into sponsor_suppliers (sponsor_id, supplier_id)
       select sp.id, su.id from (select id, row_number() over (order by id) r from sponsors) sp
       join (select id, row_number() over (order by id) r from suppliers) su on su.r = sp.r`,
    ],
    [
      'part lines (support)',
      // h spreads lines over sponsors: 6 % of lines go to sponsor 1, 9 % over the others, 85 % unsupported.
      `insert into part_lines (build_id, episode_id, position, kind, description, part_number, supplier_id, system_key, at_seconds,
                               source, status, quantity, unit_price_minor, currency, tax_rate_bp, support_kind, sponsor_id, list_price_minor)
       select e.build_id, e.id, p, (array['part','part','part','consumable','tool','service'])[1 + (e.id + p) % 6],
              initcap((${lit(PARTS)})[1 + (e.id * 3 + p) % ${PARTS.length}]), 'RR-' || (e.id % 9000 + p), sup.id,
              (array['body','brakes','engine','electrics','steering','fuel'])[1 + (e.id + p) % 6], p * 20,
              (array['new','new','used','reconditioned'])[1 + p % 4], (array['fitted','fitted','arrived','on-order','needed'])[1 + (e.id + p) % 5],
              1 + p % 3, case when sk.kind = 'gifted' then 0 else 250 + ((e.id * 37 + p * 101) % 9000) end, 'GBP', 2000,
              sk.kind, sk.sponsor_id, case when sk.kind is not null then 400 + ((e.id * 37 + p * 101) % 9000) end
       from episodes e
       cross join lateral generate_series(0, case when e.slug = '${LARGE.episodeSlug}' then 149 else ${s.linesPerEpisode - 1} end) p
       cross join lateral (select (e.id * 7919 + p * 104729) % 100 as h) hh
       cross join lateral (
         select case when hh.h < 15 then (array['gifted','discounted','paid'])[1 + (e.id + p) % 3] end as kind,
                case when hh.h < 6 then (select min(id) from sponsors)
                     when hh.h < 15 then (select min(id) from sponsors) + 1 + (e.id + p) % ${s.sponsors - 1} end as sponsor_id) sk
       cross join lateral (select min(id) + (e.id + p) % 200 as id from suppliers) sup`,
    ],
    [
      'sponsorships',
      `insert into sponsorships (build_id, sponsor_id, kind, starts_on)
       select distinct on (build_id, sponsor_id) build_id, sponsor_id, support_kind, date '2026-01-01'
       from part_lines where sponsor_id is not null order by build_id, sponsor_id, support_kind`,
    ],
    [
      'open items',
      `insert into open_items (build_id, title, note, opened_in_episode_id, closed_in_episode_id)
       select e.build_id, 'Check ' || (${lit(PARTS)})[1 + e.id % ${PARTS.length}] || ' again after the road test', null, e.id,
              case when e.number % 8 = 0 then (select x.id from episodes x where x.build_id = e.build_id and x.number = e.number + 1) end
       from episodes e where e.number % 4 = 0`,
    ],
    [
      'posts',
      // Questions and suggestions spread over the episodes (200 on the large one, a quarter of them replies).
      `with top as (
         insert into posts (episode_id, build_id, author_id, kind, state, chapter_start_seconds, body, created_at)
         select e.id, e.build_id, r.first + (e.id * 31 + k) % r.n, case when k % 3 = 2 then 'suggestion' else 'question' end,
                case when k % 3 = 2 then 'open' when k % 2 = 0 then 'answered' else 'open' end, 0,
                'Which ' || (${lit(PARTS)})[1 + (e.id + k) % ${PARTS.length}] || ' did you end up fitting, and would you use it again?',
                e.published_at + k * interval '3 minutes'
         from episodes e
         cross join (select min(id) as first, count(*) as n from users where handle like 'bench-reader-%') r
         cross join lateral generate_series(1, case when e.slug = '${LARGE.episodeSlug}' then 150
                                                    else greatest(1, round((${s.postsTotal} - 200) * 0.8 / ${episodes - 1}))::int end) k
         returning id, episode_id, build_id)
       insert into posts (episode_id, build_id, author_id, parent_id, kind, state, body)
       select t.episode_id, t.build_id, b.owner_id, t.id, 'reply', null, 'Thanks — the part number is in the parts list under this chapter.'
       from (select *, row_number() over (partition by episode_id order by id) rn from top) t
       join builds b on b.id = t.build_id
       where t.rn <= case when t.episode_id = (select id from episodes where slug = '${LARGE.episodeSlug}') then 50
                          else greatest(1, round((${s.postsTotal} - 200) * 0.2 / ${episodes - 1}))::int end`,
    ],
    ['statistics', 'analyze'],
  ];
}

/** Fills an empty, migrated database; returns the seconds each step took. */
export async function generateScaleData(databaseUrl: string, scale: number, log: (msg: string) => void = () => {}): Promise<void> {
  const client = new pg.Client({ connectionString: databaseUrl });
  await client.connect();
  try {
    const sizes = scaleSizes(scale);
    for (const [name, text] of scaleDataSql(sizes)) {
      const t0 = performance.now();
      const r = await client.query(text);
      log(`${name}: ${r.rowCount ?? 0} rows in ${((performance.now() - t0) / 1000).toFixed(1)} s`);
    }
    await client.query(
      `create table if not exists bench_dataset (version int not null, scale numeric not null, created_at timestamptz not null default now())`,
    );
    await client.query('insert into bench_dataset (version, scale) values ($1, $2)', [DATASET_VERSION, scale]);
  } finally {
    await client.end();
  }
}

/** True when the database already holds this version of the dataset at this scale. */
export async function hasScaleData(databaseUrl: string, scale: number): Promise<boolean> {
  const client = new pg.Client({ connectionString: databaseUrl });
  await client.connect();
  try {
    const r = await client.query(`select 1 from information_schema.tables where table_name = 'bench_dataset'`);
    if (!r.rowCount) return false;
    const d = await client.query('select 1 from bench_dataset where version = $1 and scale = $2', [DATASET_VERSION, scale]);
    return (d.rowCount ?? 0) > 0;
  } finally {
    await client.end();
  }
}

if (import.meta.url === `file://${process.argv[1]}`) {
  const url = process.env.DATABASE_URL;
  if (!url) throw new Error('DATABASE_URL must name a migrated, empty database');
  await generateScaleData(url, Number(process.env.BENCH_SCALE ?? 1), console.log);
}
