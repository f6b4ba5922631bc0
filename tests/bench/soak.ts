// `npm run test:load`: 200 connections for 60 s of mixed reads and writes against the production
// build over the scale dataset. Counts 500s (target: none) and load-shed 503s (reported apart;
// target: none at 200 connections), and compares the server's RSS at the end with its RSS after
// the warm-up (target: within 20 %). Prints its figures, writes .bench/load.json, and exits 1 when
// a 500 was answered or the RSS drifted beyond 20 %.
// Environment: LOAD_CONNECTIONS (200), LOAD_SECONDS (60), BENCH_SCALE (1).
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import autocannon from 'autocannon';
import pg from 'pg';
import { benchDatabase, log, root, startBenchServer } from './lib/bench-env';
import { benchSession, CLIENT_HEADERS } from './lib/load';
import { LARGE } from './scale-data';

const CONNECTIONS = Number(process.env.LOAD_CONNECTIONS ?? 200);
const SECONDS = Number(process.env.LOAD_SECONDS ?? 60);
const WARMUP_SECONDS = 10;
const SESSION_SECRET = 'bench-session-secret-not-for-real-use-0123456789';

/** Resident set size of a process in MB (Linux). */
function rssMb(pid: number): number {
  if (!existsSync(`/proc/${pid}/status`)) throw new Error('the server process is gone (it exited under load; see its log above)');
  const line = readFileSync(`/proc/${pid}/status`, 'utf8')
    .split('\n')
    .find((l) => l.startsWith('VmRSS:'));
  return Math.round(Number(line?.replace(/\D+/g, '') ?? 0) / 1024);
}

async function main() {
  const { cluster, url: databaseUrl, scale } = await benchDatabase();
  const server = await startBenchServer(databaseUrl);
  const base = server.baseUrl;
  try {
    const db = new pg.Client({ connectionString: databaseUrl });
    await db.connect();
    const row = (
      await db.query<{ build_id: number; episode_id: number; reader: number; episodes: number[] }>(
        `select b.id as build_id, e.id as episode_id, (select id from users where handle = 'bench-reader-2') as reader,
                array(select x.id from episodes x join builds bb on bb.id = x.build_id
                       where bb.visibility = 'public' and x.number = 2 order by x.id limit 50) as episodes
           from builds b join episodes e on e.build_id = b.id where b.slug = $1 and e.slug = $2`,
        [LARGE.buildSlug, LARGE.episodeSlug],
      )
    ).rows[0]!;
    await db.end();
    const session = await benchSession(databaseUrl, base, SESSION_SECRET, row.reader);
    const write = {
      method: 'POST' as const,
      headers: { ...CLIENT_HEADERS, cookie: session.cookie, 'x-csrf-token': session.csrf, 'content-type': 'application/json' },
      body: JSON.stringify({ kind: 'question', chapterStartSeconds: 0, body: 'Did the new bushes squeak once they settled in?' }),
    };
    // Nine reads to one write, cycled by every connection.
    const reads = (i: number) => [
      { method: 'GET' as const, path: `/api/episodes/${row.episodes[i % row.episodes.length]}/reading` },
      { method: 'GET' as const, path: `/builds/${LARGE.handle}/${LARGE.buildSlug}/episodes/${LARGE.episodeSlug}` },
      { method: 'GET' as const, path: '/' },
      { method: 'GET' as const, path: `/api/episodes/${row.episode_id}/reading` },
      { method: 'GET' as const, path: '/api/search?q=brake%20shoe' },
      { method: 'GET' as const, path: `/api/builds/${row.build_id}/totals` },
      { method: 'GET' as const, path: `/api/episodes/${row.episodes[(i + 7) % row.episodes.length]}/posts` },
      { method: 'GET' as const, path: '/api/builds' },
      { method: 'GET' as const, path: `/api/episodes/${row.episodes[(i + 3) % row.episodes.length]}/reading` },
    ];
    const requests = [
      ...reads(0),
      { ...write, path: `/api/episodes/${row.episodes[1]}/posts` },
      ...reads(5),
      { ...write, path: `/api/episodes/${row.episodes[2]}/posts` },
    ];

    // Every request accepts gzip, as a browser's does (lib/load.ts, CLIENT_HEADERS).
    const run = (connections: number, seconds: number) =>
      autocannon({ url: base, connections, duration: seconds, requests, headers: { ...CLIENT_HEADERS }, timeout: 20 });

    // The warm-up runs at the full connection count, so "after warm-up" already holds its buffers and caches.
    log(`warm-up: ${WARMUP_SECONDS} s at ${CONNECTIONS} connections …`);
    await run(CONNECTIONS, WARMUP_SECONDS);
    await new Promise((r) => setTimeout(r, 1000));
    const rssAfterWarmup = rssMb(server.child.pid!);
    log(`load: ${CONNECTIONS} connections for ${SECONDS} s, 9 reads to 1 write …`);
    const result = await run(CONNECTIONS, SECONDS);
    await new Promise((r) => setTimeout(r, 2000));
    const rssEnd = rssMb(server.child.pid!);

    const stats = (result as unknown as { statusCodeStats?: Record<string, { count: number }> }).statusCodeStats ?? {};
    const count = (pred: (code: number) => boolean) => Object.entries(stats).reduce((n, [k, v]) => n + (pred(Number(k)) ? v.count : 0), 0);
    const figures = {
      date: new Date().toISOString(),
      cores: os.cpus().length,
      scale,
      connections: CONNECTIONS,
      seconds: SECONDS,
      requests: result.requests.total,
      rps: Math.round(result.requests.average),
      p50_ms: result.latency.p50,
      p99_ms: result.latency.p99,
      status_counts: Object.fromEntries(Object.entries(stats).map(([k, v]) => [k, v.count])),
      errors_500: count((c) => c >= 500 && c !== 503),
      shed_503: count((c) => c === 503),
      other_4xx: count((c) => c >= 400 && c < 500),
      socket_errors: result.errors,
      timeouts: result.timeouts,
      rss_after_warmup_mb: rssAfterWarmup,
      rss_end_mb: rssEnd,
      rss_drift_pct: Math.round(((rssEnd - rssAfterWarmup) / rssAfterWarmup) * 1000) / 10,
    };
    const ok500 = figures.errors_500 === 0;
    const okRss = Math.abs(figures.rss_drift_pct) <= 20;
    console.log(`\nLoad and soak — ${figures.date}, ${figures.cores} cores, scale ${scale}`);
    console.table({
      'requests (total)': { value: figures.requests, target: '' },
      'req/s': { value: figures.rps, target: '' },
      'p50 / p99 ms': { value: `${figures.p50_ms} / ${figures.p99_ms}`, target: '' },
      '500s': { value: figures.errors_500, target: `0: ${ok500 ? 'met' : 'MISSED'}` },
      '503s (load shed, Retry-After)': {
        value: figures.shed_503,
        target: `0 at ${CONNECTIONS} connections: ${figures.shed_503 === 0 ? 'met' : 'MISSED'}`,
      },
      'other 4xx': { value: figures.other_4xx, target: '' },
      'socket errors / timeouts': { value: `${figures.socket_errors} / ${figures.timeouts}`, target: '' },
      'RSS after warm-up → end (MB)': {
        value: `${rssAfterWarmup} → ${rssEnd} (${figures.rss_drift_pct} %)`,
        target: `within 20 %: ${okRss ? 'met' : 'MISSED'}`,
      },
    });
    console.log('status codes:', figures.status_counts);
    mkdirSync(path.join(root, '.bench'), { recursive: true });
    writeFileSync(path.join(root, '.bench', 'load.json'), `${JSON.stringify(figures, null, 2)}\n`);
    process.exitCode = ok500 && okRss ? 0 : 1;
  } finally {
    await server.stop();
    cluster.stop();
  }
}

await main();
