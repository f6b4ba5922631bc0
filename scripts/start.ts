// `npm start`: PostgreSQL, the fakes, migrations, demo data, the client bundle, then the server
// on 127.0.0.1:3000. Ctrl-C stops all of it.
import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { startAllFakes } from '../fakes/all';
import { ensureBuilt } from './lib/build';
import { ensureDatabase, startCluster } from './lib/postgres';
import { watchParent } from './lib/watch-parent';
import { migrateDatabase } from './migrate';
import { seedDatabase } from './seed';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const log = (msg: string) => console.log(`[rivet-reel] ${msg}`);
const env = process.env;
const APP_PORT = Number(env.PORT ?? 3000);
const ports = { s3: env.S3_FAKE_PORT ?? '4569', smtp: env.SMTP_FAKE_PORT ?? '2525', inbox: env.SMTP_FAKE_HTTP_PORT ?? '8025', github: env.GITHUB_FAKE_PORT ?? '8090' };

const cleanups: Array<() => Promise<void> | void> = [];
let server: ChildProcess | undefined;
let stopping = false;

async function stopAll(code: number): Promise<never> {
  if (stopping) return new Promise<never>(() => {});
  stopping = true;
  log('stopping…');
  if (server && server.exitCode === null) {
    const exited = new Promise((r) => server?.once('exit', r));
    server.kill('SIGTERM');
    await Promise.race([exited, new Promise((r) => setTimeout(r, 25_000))]);
  }
  for (const fn of cleanups.reverse()) {
    try {
      await fn();
    } catch (err) {
      console.error(err);
    }
  }
  process.exit(code);
}

async function main() {
  for (const sig of ['SIGINT', 'SIGTERM', 'SIGHUP'] as const) process.on(sig, () => void stopAll(0));
  watchParent(() => void stopAll(1));

  const cluster = await startCluster(root, 'dev', Number(env.RR_PG_PORT ?? 54320), { durable: true });
  cleanups.push(() => cluster.stop());
  log(`PostgreSQL on 127.0.0.1:${cluster.port} (data in ${cluster.dataDir})`);
  await ensureDatabase(cluster.url('postgres'), 'rivet_reel');
  const databaseUrl = cluster.url('rivet_reel');

  const fakes = await startAllFakes({ ...env, S3_FAKE_PORT: ports.s3, SMTP_FAKE_PORT: ports.smtp, SMTP_FAKE_HTTP_PORT: ports.inbox, GITHUB_FAKE_PORT: ports.github, S3_FAKE_DIR: path.join(root, '.data/s3'), SMTP_FAKE_DIR: path.join(root, '.data/smtp') });
  cleanups.push(() => fakes.stop());
  for (const line of fakes.lines) log(line);

  for (const line of await migrateDatabase(databaseUrl)) log(`migrated ${line}`);
  log(`seeded: ${(await seedDatabase(databaseUrl)).join(', ')}`);
  ensureBuilt(root, 'dist', log);

  const github = `http://127.0.0.1:${ports.github}`;
  server = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], {
    cwd: root,
    stdio: 'inherit',
    env: {
      NODE_ENV: 'production',
      LOG_LEVEL: 'info',
      PUBLIC_URL: `http://127.0.0.1:${APP_PORT}`,
      S3_ENDPOINT: `http://127.0.0.1:${ports.s3}`,
      SMTP_HOST: '127.0.0.1',
      SMTP_PORT: ports.smtp,
      MAIL_INBOX_URL: `http://127.0.0.1:${ports.inbox}`,
      GITHUB_AUTHORIZATION_URL: `${github}/login/oauth/authorize`,
      GITHUB_TOKEN_URL: `${github}/login/oauth/access_token`,
      GITHUB_USER_PROFILE_URL: `${github}/user`,
      GITHUB_USER_EMAIL_URL: `${github}/user/emails`,
      SESSION_SECRET: 'local-start-session-secret-not-for-real-use-0123456789',
      ...env,
      HOST: '127.0.0.1',
      PORT: String(APP_PORT),
      DATABASE_URL: databaseUrl,
      DIST_DIR: 'dist',
    },
  });
  server.once('exit', (code) => {
    if (!stopping) {
      log(`server exited (${code}); stopping`);
      void stopAll(code ?? 1);
    }
  });
  log('');
  log(`app:          http://127.0.0.1:${APP_PORT}`);
  log(`mail inbox:   http://127.0.0.1:${ports.inbox}`);
  log(`demo sign-in: ${github} (the GitHub stand-in with the invented demo accounts)`);
  log('Ctrl-C stops the server, the fakes and PostgreSQL.');
}

main().catch((err: unknown) => {
  console.error(err);
  void stopAll(1);
});
