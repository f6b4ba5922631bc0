import { mkdtemp, rm } from 'node:fs/promises';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { sql } from 'kysely';
import pino from 'pino';
import { startS3Fake, type S3Fake } from '../../fakes/s3';
import { startSmtpFake, type SmtpFake } from '../../fakes/smtp';
import { createApp } from '../../server/app';
import { loadConfig, type Config } from '../../server/config';
import { createDeps, type RunningDeps } from '../../server/deps';
import { QUEUE_SCHEMA } from '../../server/jobs/queue';
import { startRoundRobin, type RoundRobin } from './round-robin';
import { spawnServerProcess, type ServerProcess } from './server-process';
import { createTestDatabase, existingTestDatabase, type TestDatabase } from './test-db';
import { prepareHttpServer } from '../../server/http/server-settings';

/**
 * `RR_TWO_PROCESSES=1` (the `two-processes` Vitest project): `baseUrl` is a round-robin front over
 * two spawned server processes on the same database and fakes, so consecutive requests of a test
 * alternate between them. The in-process app still exists for `deps` and `runJobs()`.
 */
export const TWO_PROCESSES = process.env.RR_TWO_PROCESSES === '1';

export const TEST_BUCKET = 'rivet-reel-test';
export const TEST_SESSION_SECRET = 'test-session-secret-0123456789-abcdefghij';

export interface TestApp {
  /** Where the suites send HTTP: the in-process app on an ephemeral loopback port. */
  baseUrl: string;
  deps: RunningDeps;
  config: Config;
  database: TestDatabase;
  s3: S3Fake;
  smtp: SmtpFake;
  /** Runs queued jobs until none is due (jobs may queue more); `recurring` first fires the cron jobs. */
  runJobs(opts?: { recurring?: boolean }): Promise<number>;
  stop(): Promise<void>;
}

export interface TestAppOptions {
  distDir?: string;
  env?: Record<string, string>;
  /** Serve an existing database (e.g. one kept by an earlier app) instead of creating a fresh one. */
  databaseUrl?: string;
  /** Leave the database in place on stop(), so another app or process can use it afterwards. */
  keepDatabase?: boolean;
  /** Serve from this process only, even in two-process mode (for tests that spawn their own). */
  inProcessOnly?: boolean;
}

/** Starts the whole app in-process over a fresh database and fresh S3/SMTP fakes. */
export async function startTestApp(opts: TestAppOptions = {}): Promise<TestApp> {
  const database = opts.databaseUrl ? existingTestDatabase(opts.databaseUrl) : await createTestDatabase();
  const dir = await mkdtemp(path.join(os.tmpdir(), 'rr-test-'));
  const s3 = await startS3Fake({ port: 0, directory: path.join(dir, 's3'), buckets: [TEST_BUCKET] });
  const smtp = await startSmtpFake({ smtpPort: 0, httpPort: 0 });
  // Listen first so PUBLIC_URL (OAuth callback, e-mailed links) can name the real port.
  const server = http.createServer();
  prepareHttpServer(server);
  server.listen(0, '127.0.0.1');
  await new Promise<void>((resolve) => server.once('listening', resolve));
  const { port } = server.address() as AddressInfo;
  const front: RoundRobin | null = TWO_PROCESSES && !opts.inProcessOnly ? await startRoundRobin() : null;
  const config = loadConfig({
    NODE_ENV: 'test',
    PUBLIC_URL: front?.url ?? `http://127.0.0.1:${port}`,
    SESSION_SECRET: TEST_SESSION_SECRET,
    LOG_LEVEL: 'silent',
    DATABASE_URL: database.url,
    DATABASE_POOL_MAX: '5',
    S3_ENDPOINT: s3.url,
    S3_BUCKET: TEST_BUCKET,
    SMTP_HOST: '127.0.0.1',
    SMTP_PORT: String(smtp.smtpPort),
    DIST_DIR: opts.distDir ?? 'dist-test',
    ...opts.env,
  });
  const deps = createDeps(config, pino({ level: 'silent' }), { outbox: { baseBackoffMs: 0 } });
  // No workers poll in tests: jobs run when a test calls runJobs(), so results are deterministic.
  await deps.queue.start({ workers: false });
  server.on('request', createApp(deps));

  const job = sql.table(`${QUEUE_SCHEMA}.job`);
  const queueBusy = async () =>
    (
      await sql<{ n: number }>`select count(*)::int as n from ${job}
        where state = 'active' or (state in ('created', 'retry') and start_after <= now())`.execute(deps.db)
    ).rows[0]!.n > 0;
  const completedJobs = async () =>
    (await sql<{ n: number }>`select count(*)::int as n from ${job} where state = 'completed'`.execute(deps.db)).rows[0]!.n;
  let completedBefore = 0;
  let processes: ServerProcess[] = [];
  if (front) {
    const env = { RATE_LIMIT_MULTIPLIER: config.RATE_LIMIT_MULTIPLIER.toString(), DIST_DIR: config.DIST_DIR, ...opts.env };
    processes = await Promise.all([0, 1].map(() => spawnServerProcess({ database, s3, smtp }, { env, publicUrl: front.url })));
    front.setTargets(processes.map((p) => p.baseUrl));
    completedBefore = await completedJobs();
  }

  return {
    baseUrl: front?.url ?? `http://127.0.0.1:${port}`,
    deps,
    config,
    database,
    s3,
    smtp,
    async runJobs({ recurring = false } = {}) {
      if (recurring) await deps.queue.triggerRecurring();
      let total = 0;
      for (let i = 0; i < 20; i += 1) {
        const ran = await deps.queue.runDueJobs();
        total += ran;
        if (ran === 0) break;
      }
      if (!front) return total;
      // Two processes: their workers take jobs too. Wait (up to 15 s) until no job is running or due,
      // running what is left here, and count the jobs completed by anyone since the last call.
      const deadline = Date.now() + 15_000;
      while (Date.now() < deadline && (await queueBusy())) {
        total += await deps.queue.runDueJobs();
        await new Promise((r) => setTimeout(r, 100));
      }
      const completed = await completedJobs();
      const byAnyone = completed - completedBefore;
      completedBefore = completed;
      return Math.max(total, byAnyone);
    },
    async stop() {
      if (front) {
        const codes = await Promise.all(processes.map((p) => p.terminate()));
        // No duplicates: every e-mail the fake received has a Message-ID of its own. No lost jobs:
        // the queue's jobs by state once both processes (and their workers) are gone.
        const ids = smtp.messages().map((m) => m.messageId);
        const duplicates = ids.filter((id, i) => id !== null && ids.indexOf(id) !== i);
        const { rows } = await sql<{
          state: string;
          n: number;
        }>`select state, count(*)::int as n from ${job} group by state order by state`.execute(deps.db);
        console.log(
          `[two-processes] requests alternated between two server processes: ${front.counts.join(' and ')}; they exited with ${codes.join(', ')}; ` +
            `${ids.length} e-mails received, ${duplicates.length} duplicated; jobs by state: ${rows.map((r) => `${r.state} ${r.n}`).join(', ') || 'none'}`,
        );
        await front.stop();
        if (duplicates.length) throw new Error(`e-mail sent twice with two processes: ${duplicates.join(', ')}`);
        if (codes.some((c) => c !== 0))
          throw new Error(`a server process exited with ${codes.join(', ')}: ${processes.map((p) => p.stderr()).join('\n')}`);
      }
      server.closeAllConnections();
      await new Promise<void>((resolve) => server.close(() => resolve()));
      await deps.close();
      await Promise.allSettled([s3.stop(), smtp.stop()]);
      if (!opts.keepDatabase) await database.drop();
      await rm(dir, { recursive: true, force: true });
    },
  };
}
