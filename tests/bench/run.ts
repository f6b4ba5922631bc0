// `npm run bench`: every performance figure of the product in one run, beside the ceilings of this
// machine measured in the same run (see README "Performance"). Load comes from autocannon on
// loopback after a warm-up, against the production build with the scale dataset (tests/bench/
// scale-data.ts; BENCH_SCALE=0.01 for a quick smoke run). Prints a table; writes .bench/results.json.
// Environment: BENCH_SECONDS (per case, default 10), BENCH_CONNECTIONS (default 32), BENCH_SCALE.
import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import pg from 'pg';
import { freePort } from '../helpers/server-process';
import { timeAggregate, type AggregateResult } from './lib/aggregates';
import { benchDatabase, log, root, startBenchServer } from './lib/bench-env';
import { bundleFigures } from './lib/bundle';
import { benchSession, load, queriesPerRequest, type LoadResult } from './lib/load';
import { LARGE } from './scale-data';

const SECONDS = Number(process.env.BENCH_SECONDS ?? 10);
const CONNECTIONS = Number(process.env.BENCH_CONNECTIONS ?? 32);
const WARMUP_SECONDS = 3;
const SESSION_SECRET = 'bench-session-secret-not-for-real-use-0123456789';

interface CaseResult {
  name: string;
  rps: number;
  p50_ms: number;
  p99_ms: number;
  errors: number;
  ratio_to_baseline: number | null;
  queries_per_request: number | null;
  note?: string;
}

async function startBaseline(mode: 'http' | 'express-pg', databaseUrl: string): Promise<{ url: string; child: ChildProcess }> {
  const port = await freePort();
  const child = spawn(process.execPath, ['--import', 'tsx', 'tests/bench/baseline-server.ts', mode, String(port), databaseUrl], {
    cwd: root,
    stdio: ['ignore', 'pipe', 'inherit'],
  });
  await new Promise<void>((resolve, reject) => {
    child.stdout?.on('data', (d: Buffer) => d.toString().includes('ready') && resolve());
    child.once('exit', (code) => reject(new Error(`baseline ${mode} exited (${code})`)));
  });
  return { url: `http://127.0.0.1:${port}/`, child };
}

/** Warm-up, then the measured run. */
async function measure(opts: Parameters<typeof load>[0]): Promise<LoadResult> {
  await load({ ...opts, seconds: WARMUP_SECONDS });
  return load(opts);
}

async function main() {
  const { cluster, url: databaseUrl, scale } = await benchDatabase();
  const server = await startBenchServer(databaseUrl);
  const base = server.baseUrl;
  const cases: CaseResult[] = [];
  const aggregates: Array<AggregateResult | { name: string; ms: null; raw_sql_ms: null; ratio: null; note: string }> = [];
  try {
    const db = new pg.Client({ connectionString: databaseUrl });
    await db.connect();
    const ids = (
      await db.query<{ build_id: number; episode_id: number; other_episode: number; reader: number }>(
        `select b.id as build_id, e.id as episode_id,
                (select x.id from episodes x join builds bb on bb.id = x.build_id where bb.slug = 'bench-build-2' and x.number = 1) as other_episode,
                (select id from users where handle = 'bench-reader-1') as reader
           from builds b join episodes e on e.build_id = b.id where b.slug = $1 and e.slug = $2`,
        [LARGE.buildSlug, LARGE.episodeSlug],
      )
    ).rows[0]!;
    const size = (
      await db.query<{ chapters: number; lines: number; posts: number }>(
        `select (select count(*) from chapters where episode_id = $1)::int as chapters,
                (select count(*) from part_lines where episode_id = $1)::int as lines,
                (select count(*) from posts where episode_id = $1)::int as posts`,
        [ids.episode_id],
      )
    ).rows[0]!;
    // The summary is its members' alone (404 to anyone else): the bench reader joins the largest sponsor.
    await db.query(`insert into sponsor_members (sponsor_id, user_id) select id, $1 from sponsors where slug = $2 on conflict do nothing`, [
      ids.reader,
      LARGE.largestSponsor,
    ]);
    await db.end();
    log(`large episode: ${size.chapters} chapters, ${size.lines} part lines, ${size.posts} posts`);

    // Baselines first, each in its own process, then the app (the baseline servers are stopped before it runs).
    for (const mode of ['http', 'express-pg'] as const) {
      const b = await startBaseline(mode, databaseUrl);
      try {
        log(`baseline-${mode} …`);
        const r = await measure({ url: b.url, connections: CONNECTIONS, seconds: SECONDS });
        cases.push({ name: `baseline-${mode}`, ...pick(r), ratio_to_baseline: null, queries_per_request: mode === 'http' ? 0 : 1 });
        log(`  ${JSON.stringify(cases.at(-1))}`);
      } finally {
        b.child.kill('SIGTERM');
      }
    }
    const baseline = cases.find((c) => c.name === 'baseline-express-pg')!;

    const routes = await sponsorSummaryAvailable();
    const session = await benchSession(databaseUrl, base, SESSION_SECRET, ids.reader);
    const episodePath = `/builds/${LARGE.handle}/${LARGE.buildSlug}/episodes/${LARGE.episodeSlug}`;
    const question = JSON.stringify({
      kind: 'question',
      chapterStartSeconds: 0,
      body: 'Which torque figure did you use for the caliper bolts?',
    });
    const writeHeaders = { cookie: session.cookie, 'x-csrf-token': session.csrf, 'content-type': 'application/json' };
    const plan: Array<{
      name: string;
      path: string;
      method?: 'POST';
      headers?: Record<string, string>;
      body?: string;
      status?: number;
      skip?: string;
    }> = [
      { name: 'front-page', path: '/' },
      { name: 'episode-read', path: `/api/episodes/${ids.episode_id}/reading` },
      { name: 'episode-page', path: episodePath },
      { name: 'ledger-totals', path: `/api/builds/${ids.build_id}/totals` },
      {
        name: 'sponsor-summary',
        path: `/api/sponsors/${LARGE.largestSponsor}/summary`,
        headers: { cookie: session.cookie },
        skip: routes ? undefined : 'not available (GET /api/sponsors/:slug/summary is not in the route registry yet)',
      },
      { name: 'search', path: '/api/search?q=caliper%20piston' },
      {
        name: 'post-question',
        path: `/api/episodes/${ids.other_episode}/posts`,
        method: 'POST',
        headers: writeHeaders,
        body: question,
        status: 201,
      },
    ];
    for (const c of plan) {
      if (c.skip) {
        log(`${c.name}: ${c.skip}`);
        cases.push({
          name: c.name,
          rps: 0,
          p50_ms: 0,
          p99_ms: 0,
          errors: 0,
          ratio_to_baseline: null,
          queries_per_request: null,
          note: c.skip,
        });
        continue;
      }
      log(`${c.name} …`);
      const send = () => fetch(`${base}${c.path}`, { method: c.method ?? 'GET', headers: c.headers, body: c.body });
      const probe = await send();
      if (probe.status !== (c.status ?? 200)) throw new Error(`${c.name}: ${c.path} answered ${probe.status}: ${await probe.text()}`);
      await probe.arrayBuffer();
      const qpr = await queriesPerRequest(base, send);
      const r = await measure({
        url: `${base}${c.path}`,
        connections: CONNECTIONS,
        seconds: SECONDS,
        method: c.method,
        headers: c.headers,
        body: c.body,
        expectStatus: c.status,
      });
      cases.push({ name: c.name, ...pick(r), ratio_to_baseline: round(r.rps / baseline.rps), queries_per_request: qpr });
      log(`  ${JSON.stringify(cases.at(-1))}`);
    }

    log('aggregates against the same SQL through pg …');
    const aggregate = async (name: string, p: string, headers: Record<string, string> = {}, invalidate?: () => Promise<void>) => {
      try {
        aggregates.push(await timeAggregate(name, base, databaseUrl, p, 15, headers, invalidate));
      } catch (err) {
        aggregates.push({ name, ms: null, raw_sql_ms: null, ratio: null, note: `failed: ${(err as Error).message}` });
      }
    };
    // The published totals are kept per build content revision: each timed request first moves the
    // revision on (as any edit of the build would), so the endpoint computes them.
    const revise = new pg.Client({ connectionString: databaseUrl });
    await revise.connect();
    try {
      await aggregate('ledger-totals', `/api/builds/${ids.build_id}/totals`, {}, async () => {
        await revise.query('update builds set content_revision = content_revision + 1 where id = $1', [ids.build_id]);
      });
    } finally {
      await revise.end();
    }
    // The summary is for the sponsor's members only: the bench reader is one (bench-env joins it).
    if (routes) await aggregate('sponsor-summary', `/api/sponsors/${LARGE.largestSponsor}/summary`, { cookie: session.cookie });
    else aggregates.push({ name: 'sponsor-summary', ms: null, raw_sql_ms: null, ratio: null, note: 'not available' });
  } finally {
    await server.stop();
    cluster.stop();
  }

  log('client bundle (vite manifest) …');
  const bundle = bundleFigures(path.join(root, 'dist', 'client'));
  log('media benchmark (npm run bench:media) …');
  const mediaRun = spawnSync(process.execPath, ['--import', 'tsx', 'tests/bench/media.ts'], {
    cwd: root,
    stdio: ['ignore', 'ignore', 'inherit'],
    env: { ...process.env, BENCH_RUNS: process.env.BENCH_MEDIA_RUNS ?? '3' },
  });
  const mediaFile = path.join(root, '.bench', 'media.json');
  const media =
    mediaRun.status === 0 && existsSync(mediaFile)
      ? (JSON.parse(readFileSync(mediaFile, 'utf8')) as Record<string, unknown>)
      : { error: `bench:media exited ${mediaRun.status}` };

  const results = {
    date: new Date().toISOString(),
    cores: os.cpus().length,
    scale,
    connections: CONNECTIONS,
    seconds_per_case: SECONDS,
    cases,
    aggregates,
    bundle: {
      episode_initial_js_gzip_kb: bundle.episode_initial_js_gzip_kb,
      editor_chunk_gzip_kb: bundle.editor_chunk_gzip_kb,
      css_gzip_kb: bundle.css_gzip_kb,
    },
    media,
  };
  print(results, baselineOf(cases));
  mkdirSync(path.join(root, '.bench'), { recursive: true });
  writeFileSync(path.join(root, '.bench', 'results.json'), `${JSON.stringify(results, null, 2)}\n`);
  log('wrote .bench/results.json');
}

const round = (x: number) => Math.round(x * 100) / 100;
const pick = (r: LoadResult) => ({ rps: r.rps, p50_ms: r.p50_ms, p99_ms: r.p99_ms, errors: r.errors });
const baselineOf = (cases: CaseResult[]) => cases.find((c) => c.name === 'baseline-express-pg')!;

/** Whether another issue's sponsor summary route is in the registry yet. */
async function sponsorSummaryAvailable(): Promise<boolean> {
  const { routeRegistry } = await import('../../server/routes');
  return routeRegistry.some((r) => r.method === 'get' && r.path === '/sponsors/:slug/summary');
}

function targetOf(c: CaseResult, baseline: CaseResult): string {
  if (c.name === 'episode-read') {
    const ok = c.rps >= 0.6 * baseline.rps && c.p99_ms <= 2 * baseline.p99_ms && (c.queries_per_request ?? 99) <= 3;
    return `≥ 60 % rps, p99 ≤ ${2 * baseline.p99_ms} ms, ≤ 3 SQL: ${ok ? 'met' : 'MISSED'}`;
  }
  return '';
}

function print(
  r: {
    date: string;
    cores: number;
    scale: number;
    cases: CaseResult[];
    aggregates: unknown[];
    bundle: Record<string, number>;
    media: Record<string, unknown>;
  },
  baseline: CaseResult,
) {
  console.log(
    `\nRivet & Reel benchmark — ${r.date}, ${r.cores} cores, scale ${r.scale}, ${CONNECTIONS} connections, ${SECONDS} s per case`,
  );
  console.table(
    Object.fromEntries(
      r.cases.map((c) => [
        c.name,
        {
          'req/s': c.rps,
          'p50 ms': c.p50_ms,
          'p99 ms': c.p99_ms,
          errors: c.errors,
          'vs express+pg': c.ratio_to_baseline ?? '',
          'SQL/req': c.queries_per_request ?? '',
          target: c.note ?? targetOf(c, baseline),
        },
      ]),
    ),
  );
  console.log('Aggregates: endpoint vs the same SQL through pg (target ratio ≤ 2)');
  console.table(
    Object.fromEntries(
      (r.aggregates as Array<Partial<AggregateResult> & { name: string; note?: string }>).map((a) => [
        a.name,
        a.note
          ? { note: a.note }
          : {
              'endpoint ms': a.ms,
              'raw SQL ms': a.raw_sql_ms,
              'cached ms': a.cached_ms ?? '',
              ratio: a.ratio,
              target: (a.ratio ?? 99) <= 2 ? 'met' : 'MISSED',
              'uses an index': `${a.index_use?.filter(Boolean).length} of ${a.index_use?.length}`,
            },
      ]),
    ),
  );
  console.log('Client bundle, gzip kB (target: episode route initial JS ≤ 150)');
  console.table(r.bundle);
  console.log('Media pipeline (targets: ratio ≤ 1.3, peak RSS < 400 MB)');
  console.table(r.media);
}

await main();
