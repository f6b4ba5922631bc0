// The local services `npm start` and `npm run dev` share: PostgreSQL, the fakes, migrations and
// demo data, plus the environment the server needs to use them.
import { writeFileSync } from 'node:fs';
import path from 'node:path';
import { startAllFakes } from '../../fakes/all';
import { migrateDatabase } from '../migrate';
import { seedDatabase, seedStorageFromEnv } from '../seed';
import { ensureDatabase, startCluster } from './postgres';

export interface LocalServices {
  serverEnv: Record<string, string>;
  urls: { inbox: string; github: string };
  stop(): Promise<void>;
}

/** Brings up everything the server talks to, on loopback, and migrates and seeds the database. */
export async function startLocalServices(root: string, log: (msg: string) => void, appPort: number): Promise<LocalServices> {
  const env = process.env;
  const ports = {
    s3: env.S3_FAKE_PORT ?? '4569',
    smtp: env.SMTP_FAKE_PORT ?? '2525',
    inbox: env.SMTP_FAKE_HTTP_PORT ?? '8025',
    github: env.GITHUB_FAKE_PORT ?? '8090',
  };
  const stops: Array<() => Promise<void> | void> = [];
  const stop = async () => {
    for (const fn of stops.reverse()) {
      try {
        await fn();
      } catch (err) {
        console.error(err);
      }
    }
  };
  try {
    const cluster = await startCluster(root, 'dev', Number(env.RR_PG_PORT ?? 54320), { durable: true });
    stops.push(() => cluster.stop());
    log(`PostgreSQL on 127.0.0.1:${cluster.port} (data in ${cluster.dataDir})`);
    await ensureDatabase(cluster.url('postgres'), 'rivet_reel');
    const databaseUrl = cluster.url('rivet_reel');
    // For operator commands (npm run admin:grant) while npm start runs.
    writeFileSync(path.join(root, '.data', 'dev-database-url'), `${databaseUrl}\n`, { mode: 0o600 });

    const fakes = await startAllFakes({
      ...env,
      S3_FAKE_PORT: ports.s3,
      SMTP_FAKE_PORT: ports.smtp,
      SMTP_FAKE_HTTP_PORT: ports.inbox,
      GITHUB_FAKE_PORT: ports.github,
      S3_FAKE_DIR: path.join(root, '.data/s3'),
      SMTP_FAKE_DIR: path.join(root, '.data/smtp'),
    });
    stops.push(() => fakes.stop());
    for (const line of fakes.lines) log(line);

    for (const line of await migrateDatabase(databaseUrl)) log(`migrated ${line}`);
    // The demo photos go into the S3 fake just started, as uploads would.
    const storage = seedStorageFromEnv({ ...env, S3_ENDPOINT: `http://127.0.0.1:${ports.s3}` });
    log(`seeded: ${(await seedDatabase(databaseUrl, storage)).join(', ')}`);

    const github = `http://127.0.0.1:${ports.github}`;
    return {
      serverEnv: {
        PUBLIC_URL: `http://127.0.0.1:${appPort}`,
        S3_ENDPOINT: `http://127.0.0.1:${ports.s3}`,
        SMTP_HOST: '127.0.0.1',
        SMTP_PORT: ports.smtp,
        MAIL_INBOX_URL: `http://127.0.0.1:${ports.inbox}`,
        GITHUB_AUTHORIZATION_URL: `${github}/login/oauth/authorize`,
        GITHUB_TOKEN_URL: `${github}/login/oauth/access_token`,
        GITHUB_USER_PROFILE_URL: `${github}/user`,
        GITHUB_USER_EMAIL_URL: `${github}/user/emails`,
        SESSION_SECRET: 'local-start-session-secret-not-for-real-use-0123456789',
        DATABASE_URL: databaseUrl,
      },
      urls: { inbox: `http://127.0.0.1:${ports.inbox}`, github },
      stop,
    };
  } catch (err) {
    await stop();
    throw err;
  }
}
