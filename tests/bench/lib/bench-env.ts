// What `npm run bench`, `npm run bench:summary` and `npm run test:load` share: a PostgreSQL cluster
// of their own (`.data/pg-bench`), the scale dataset in its own database (generated once per
// version and scale, then reused), the S3 and SMTP fakes, and the production build of the server
// spawned as `npm start` runs it, in bench mode (SQL queries counted).
import { spawn, type ChildProcess } from 'node:child_process';
import { mkdtemp, rm } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { startS3Fake } from '../../../fakes/s3';
import { startSmtpFake } from '../../../fakes/smtp';
import { ensureBuilt } from '../../../scripts/lib/build';
import { recreateDatabase, startCluster, type Cluster } from '../../../scripts/lib/postgres';
import { migrateDatabase } from '../../../scripts/migrate';
import { freePort } from '../../helpers/server-process';
import { generateScaleData, hasScaleData, scaleSizes } from '../scale-data';

export const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../../..');
export const log = (msg: string) => console.log(`[bench] ${msg}`);

export interface BenchDatabase {
  cluster: Cluster;
  url: string;
  scale: number;
}

/** The bench cluster and the scale dataset (BENCH_SCALE, default 1), generating it when missing. */
export async function benchDatabase(): Promise<BenchDatabase> {
  const scale = Number(process.env.BENCH_SCALE ?? 1);
  if (!(scale > 0 && scale <= 1)) throw new Error('BENCH_SCALE must be in (0, 1]');
  // Not durable (fsync off): a throwaway copy on a shared machine; the same for the baseline and the app.
  const cluster = await startCluster(root, 'bench', Number(process.env.RR_BENCH_PG_PORT ?? 54360), { durable: false });
  const name = `rr_bench_${String(scale).replace('.', '_')}`;
  const url = cluster.url(name);
  let ready = false;
  try {
    ready = await hasScaleData(url, scale);
  } catch {
    ready = false;
  }
  if (!ready) {
    const s = scaleSizes(scale);
    log(`generating the dataset (scale ${scale}: ${s.builds} builds, ${s.builds * s.episodesPerBuild} episodes) into ${name} …`);
    const t0 = performance.now();
    await recreateDatabase(cluster.url('postgres'), name);
    await migrateDatabase(url);
    await generateScaleData(url, scale, (m) => log(`  ${m}`));
    log(`dataset ready in ${((performance.now() - t0) / 1000).toFixed(0)} s`);
  } else {
    log(`dataset ${name} is ready (scale ${scale})`);
    await migrateDatabase(url);
  }
  return { cluster, url, scale };
}

export interface BenchServer {
  baseUrl: string;
  child: ChildProcess;
  stop(): Promise<void>;
}

/** Builds the client if stale, starts the fakes, and spawns the production server over `databaseUrl`. */
export async function startBenchServer(
  databaseUrl: string,
  env: Record<string, string> = {},
  nodeArgs: string[] = [],
): Promise<BenchServer> {
  ensureBuilt(root, 'dist', log);
  const dir = await mkdtemp(path.join(os.tmpdir(), 'rr-bench-'));
  const s3 = await startS3Fake({ port: 0, directory: path.join(dir, 's3'), buckets: ['rivet-reel-bench'] });
  const smtp = await startSmtpFake({ smtpPort: 0, httpPort: 0 });
  const port = await freePort();
  const baseUrl = `http://127.0.0.1:${port}`;
  const child = spawn(process.execPath, [...nodeArgs, '--import', 'tsx', 'server/index.ts'], {
    cwd: root,
    env: {
      PATH: process.env.PATH,
      HOME: process.env.HOME,
      NODE_ENV: 'production',
      // Request logging off for the run: the baselines do not log either (warnings and errors still do).
      LOG_LEVEL: 'warn',
      HOST: '127.0.0.1',
      PORT: String(port),
      PUBLIC_URL: baseUrl,
      DATABASE_URL: databaseUrl,
      SESSION_SECRET: 'bench-session-secret-not-for-real-use-0123456789',
      S3_ENDPOINT: s3.url,
      S3_BUCKET: 'rivet-reel-bench',
      SMTP_HOST: '127.0.0.1',
      SMTP_PORT: String(smtp.smtpPort),
      DIST_DIR: 'dist',
      BENCH_QUERY_COUNT: 'true',
      // The write case posts hundreds of questions from one address and one account.
      RATE_LIMIT_MULTIPLIER: '100000',
      AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED: 'true',
      ...env,
    },
    stdio: ['ignore', 'inherit', 'inherit'],
  });
  const deadline = Date.now() + 90_000;
  for (;;) {
    if (child.exitCode !== null) throw new Error(`the server exited (${child.exitCode})`);
    try {
      const res = await fetch(`${baseUrl}/api/health`);
      await res.arrayBuffer();
      break;
    } catch {
      if (Date.now() > deadline) {
        child.kill('SIGKILL');
        throw new Error('the server did not answer /api/health in time');
      }
      await new Promise((r) => setTimeout(r, 200));
    }
  }
  return {
    baseUrl,
    child,
    async stop() {
      if (child.exitCode === null) {
        const exited = new Promise((r) => child.once('exit', r));
        child.kill('SIGTERM');
        await Promise.race([exited, new Promise((r) => setTimeout(r, 25_000))]);
      }
      await Promise.allSettled([s3.stop(), smtp.stop()]);
      await rm(dir, { recursive: true, force: true });
    },
  };
}
