// `npm run bench:profile -- <case> [seconds]`: one case of `npm run bench` under load while the server
// records a CPU profile (`node --cpu-prof`), then the functions and packages that took the server's
// time, heaviest first. The profile itself is left in `.bench/profiles/` (open it in Chrome DevTools).
// Cases: episode-read, episode-page, front-page, ledger-totals, search, sponsor-summary.
import { mkdirSync, readdirSync, readFileSync, rmSync } from 'node:fs';
import path from 'node:path';
import pg from 'pg';
import { benchDatabase, log, root, startBenchServer } from './lib/bench-env';
import { benchSession, load } from './lib/load';
import { LARGE } from './scale-data';

interface ProfileNode {
  id: number;
  callFrame: { functionName: string; url: string; lineNumber: number };
  children?: number[];
}
interface CpuProfile {
  nodes: ProfileNode[];
  samples: number[];
  timeDeltas: number[];
}

const SESSION_SECRET = 'bench-session-secret-not-for-real-use-0123456789';

/** Where a frame's code lives: a package name, `node:` internals, our own file, or (program/gc/idle). */
function owner(url: string, name: string): string {
  if (!url) return `(${name || 'native'})`;
  const nm = url.lastIndexOf('node_modules/');
  if (nm >= 0) {
    const rest = url.slice(nm + 'node_modules/'.length).split('/');
    return rest[0]!.startsWith('@') ? `${rest[0]}/${rest[1]}` : rest[0]!;
  }
  if (url.startsWith('node:')) return url;
  return path.relative(root, url.replace(/^file:\/\//, ''));
}

function summarise(profile: CpuProfile, top = 25): void {
  const byId = new Map(profile.nodes.map((n) => [n.id, n]));
  const self = new Map<number, number>();
  profile.samples.forEach((id, i) => self.set(id, (self.get(id) ?? 0) + (profile.timeDeltas[i] ?? 0)));
  const total = [...self.values()].reduce((a, b) => a + b, 0);
  const fns = new Map<string, number>();
  const owners = new Map<string, number>();
  for (const [id, us] of self) {
    const { functionName, url, lineNumber } = byId.get(id)!.callFrame;
    const o = owner(url, functionName);
    const key = `${functionName || '(anonymous)'}  ${o}${url ? `:${lineNumber + 1}` : ''}`;
    fns.set(key, (fns.get(key) ?? 0) + us);
    owners.set(o, (owners.get(o) ?? 0) + us);
  }
  const pct = (us: number) => `${((100 * us) / total).toFixed(1).padStart(5)} %`;
  console.log(`\nself time by package or file (${(total / 1e6).toFixed(1)} s sampled)`);
  for (const [o, us] of [...owners].sort((a, b) => b[1] - a[1]).slice(0, top)) console.log(`  ${pct(us)}  ${o}`);
  console.log('\nself time by function');
  for (const [f, us] of [...fns].sort((a, b) => b[1] - a[1]).slice(0, top)) console.log(`  ${pct(us)}  ${f}`);
}

async function main() {
  const which = process.argv[2] ?? 'episode-read';
  const seconds = Number(process.argv[3] ?? 10);
  const { cluster, url: databaseUrl } = await benchDatabase();
  const dir = path.join(root, '.bench', 'profiles');
  mkdirSync(dir, { recursive: true });
  for (const f of readdirSync(dir)) if (f.endsWith('.cpuprofile')) rmSync(path.join(dir, f));
  const server = await startBenchServer(databaseUrl, { BENCH_QUERY_COUNT: 'false' }, ['--cpu-prof', `--cpu-prof-dir=${dir}`]);
  try {
    const db = new pg.Client({ connectionString: databaseUrl });
    await db.connect();
    const ids = (
      await db.query<{ build_id: number; episode_id: number; reader: number }>(
        `select b.id as build_id, e.id as episode_id, (select id from users where handle = 'bench-reader-1') as reader
           from builds b join episodes e on e.build_id = b.id where b.slug = $1 and e.slug = $2`,
        [LARGE.buildSlug, LARGE.episodeSlug],
      )
    ).rows[0]!;
    await db.query(`insert into sponsor_members (sponsor_id, user_id) select id, $1 from sponsors where slug = $2 on conflict do nothing`, [
      ids.reader,
      LARGE.largestSponsor,
    ]);
    await db.end();
    const paths: Record<string, string> = {
      'front-page': '/',
      'episode-read': `/api/episodes/${ids.episode_id}/reading`,
      'episode-page': `/builds/${LARGE.handle}/${LARGE.buildSlug}/episodes/${LARGE.episodeSlug}`,
      'ledger-totals': `/api/builds/${ids.build_id}/totals`,
      search: '/api/search?q=caliper%20piston',
      'sponsor-summary': `/api/sponsors/${LARGE.largestSponsor}/summary`,
    };
    const p = paths[which];
    if (!p) throw new Error(`unknown case ${which}; one of ${Object.keys(paths).join(', ')}`);
    const headers =
      which === 'sponsor-summary'
        ? { cookie: (await benchSession(databaseUrl, server.baseUrl, SESSION_SECRET, ids.reader)).cookie }
        : undefined;
    log(`${which}: ${p}, 32 connections, ${seconds} s under the profiler …`);
    const r = await load({ url: `${server.baseUrl}${p}`, connections: 32, seconds, headers });
    log(`  ${r.rps} req/s, p50 ${r.p50_ms} ms, p99 ${r.p99_ms} ms, ${r.errors} errors (slower than without the profiler)`);
  } finally {
    await server.stop();
    cluster.stop();
  }
  const file = readdirSync(dir).find((f) => f.endsWith('.cpuprofile'));
  if (!file) throw new Error('the server wrote no profile');
  summarise(JSON.parse(readFileSync(path.join(dir, file), 'utf8')) as CpuProfile);
  console.log(`\nprofile: ${path.relative(root, path.join(dir, file))}`);
}

main().catch((err: unknown) => {
  console.error(err);
  process.exit(1);
});
