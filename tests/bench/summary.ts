// `npm run bench:summary`: the sponsor summary of the largest sponsor (tests/bench/scale-data.ts,
// BENCH_SCALE as for `npm run bench`) timed through the app, beside the same SQL replayed through pg
// in the same run; prints both, their ratio and whether each statement's plan uses an index, as a
// table and as JSON (.bench/summary.json). The target (issue: within 2× of the raw SQL) is printed,
// never asserted: this is a benchmark, not a test.
import { mkdirSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import pg from 'pg';
import { timeAggregate } from './lib/aggregates';
import { benchDatabase, log, root, startBenchServer } from './lib/bench-env';
import { benchSession } from './lib/load';
import { LARGE } from './scale-data';

const SESSION_SECRET = 'bench-session-secret-not-for-real-use-0123456789';
const RUNS = Number(process.env.BENCH_RUNS ?? 15);

async function main() {
  const { cluster, url: databaseUrl, scale } = await benchDatabase();
  const server = await startBenchServer(databaseUrl);
  try {
    const db = new pg.Client({ connectionString: databaseUrl });
    await db.connect();
    const reader = (await db.query<{ id: number }>(`select id from users where handle = 'bench-reader-1'`)).rows[0]!.id;
    // The summary is its members' alone: the bench reader joins the largest sponsor.
    await db.query(`insert into sponsor_members (sponsor_id, user_id) select id, $1 from sponsors where slug = $2 on conflict do nothing`, [
      reader,
      LARGE.largestSponsor,
    ]);
    const lines = (
      await db.query<{ n: number }>(
        `select count(*)::int as n from part_lines pl join sponsors s on s.id = pl.sponsor_id where s.slug = $1 and pl.support_kind is not null`,
        [LARGE.largestSponsor],
      )
    ).rows[0]!.n;
    await db.end();
    const session = await benchSession(databaseUrl, server.baseUrl, SESSION_SECRET, reader);
    log(`largest sponsor ${LARGE.largestSponsor}: ${lines} supported lines; ${RUNS} runs each …`);
    const cases = [
      ['summary', `/api/sponsors/${LARGE.largestSponsor}/summary`],
      ['summary, gifted since January', `/api/sponsors/${LARGE.largestSponsor}/summary?kind=gifted&from=2026-01-01`],
      ['summary CSV', `/api/sponsors/${LARGE.largestSponsor}/summary.csv`],
    ] as const;
    const results = [];
    for (const [name, p] of cases)
      results.push(await timeAggregate(name, server.baseUrl, databaseUrl, p, RUNS, { cookie: session.cookie }));
    console.log('');
    console.log('case                          endpoint ms  raw SQL ms  ratio  statements  index used (per statement)');
    for (const r of results)
      console.log(
        `${r.name.padEnd(30)}${String(r.ms).padStart(11)}${String(r.raw_sql_ms).padStart(12)}${String(r.ratio).padStart(7)}${String(r.statements).padStart(12)}  ${r.index_use.map((u) => (u ? 'yes' : 'no')).join(' ')}`,
      );
    console.log('target: endpoint within 2× of the raw SQL (the raw replay runs every statement at once on its own pool)');
    const out = { date: new Date().toISOString(), scale, sponsor: LARGE.largestSponsor, supported_lines: lines, runs: RUNS, results };
    console.log(JSON.stringify(out, null, 2));
    mkdirSync(path.join(root, '.bench'), { recursive: true });
    writeFileSync(path.join(root, '.bench', 'summary.json'), `${JSON.stringify(out, null, 2)}\n`);
    log('wrote .bench/summary.json');
  } finally {
    await server.stop();
    cluster.stop();
  }
}

main().catch((err: unknown) => {
  console.error(err);
  process.exitCode = 1;
});
