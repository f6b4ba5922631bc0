// `npm run bench:summary`: the sponsor summary for the largest sponsor of the scale dataset
// (GET /api/sponsors/:slug/summary, and its .csv when there is one) against the same SQL run
// directly through pg, with the ratio (target ≤ 2) and whether EXPLAIN shows each statement using
// an index. Prints a table; writes .bench/summary.json. Until the route is in the registry it
// prints "not available".
import { mkdirSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { routeRegistry } from '../../server/routes';
import { timeAggregate, type AggregateResult } from './lib/aggregates';
import { benchDatabase, log, root, startBenchServer } from './lib/bench-env';
import { LARGE } from './scale-data';

const has = (p: string) => routeRegistry.some((r) => r.method === 'get' && r.path === p);

async function main() {
  const out = path.join(root, '.bench');
  mkdirSync(out, { recursive: true });
  if (!has('/sponsors/:slug/summary')) {
    console.log('sponsor summary: not available (GET /api/sponsors/:slug/summary is not in the route registry yet)');
    writeFileSync(path.join(out, 'summary.json'), `${JSON.stringify({ date: new Date().toISOString(), available: false }, null, 2)}\n`);
    return;
  }
  const { cluster, url } = await benchDatabase();
  const server = await startBenchServer(url);
  const results: AggregateResult[] = [];
  try {
    log(`sponsor summary of ${LARGE.largestSponsor} …`);
    results.push(await timeAggregate('sponsor-summary', server.baseUrl, url, `/api/sponsors/${LARGE.largestSponsor}/summary`));
    if (has('/sponsors/:slug/summary.csv'))
      results.push(await timeAggregate('sponsor-summary.csv', server.baseUrl, url, `/api/sponsors/${LARGE.largestSponsor}/summary.csv`));
  } finally {
    await server.stop();
    cluster.stop();
  }
  console.log(`\nSponsor summary — ${new Date().toISOString()}, ${os.cpus().length} cores (target: ratio ≤ 2)`);
  console.table(
    Object.fromEntries(
      results.map((r) => [
        r.name,
        {
          'endpoint ms': r.ms,
          'raw SQL ms': r.raw_sql_ms,
          ratio: r.ratio,
          target: r.ratio <= 2 ? 'met' : 'MISSED',
          statements: r.statements,
          'uses an index': `${r.index_use.filter(Boolean).length} of ${r.index_use.length}`,
        },
      ]),
    ),
  );
  writeFileSync(path.join(out, 'summary.json'), `${JSON.stringify({ date: new Date().toISOString(), available: true, results }, null, 2)}\n`);
}

await main();
