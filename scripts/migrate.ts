// `npm run db:migrate` (up) and `npm run db:rollback` (down the last one) against DATABASE_URL.
import { createDb } from '../server/db/kysely';
import { migrateDown, migrateToLatest } from '../server/db/migrator';
import { migrateQueueSchema } from '../server/jobs/queue';

/** Migrates the database at `url` to the latest schema, the job queue's schema included. */
export async function migrateDatabase(url: string): Promise<string[]> {
  const { db, destroy } = createDb(url, { max: 2 });
  try {
    const result = await migrateToLatest(db);
    await migrateQueueSchema(url);
    return (result.results ?? []).map((r) => `${r.migrationName}: ${r.status}`);
  } finally {
    await destroy();
  }
}

async function main(direction: string | undefined) {
  const url = process.env.DATABASE_URL;
  if (!url) throw new Error('Set DATABASE_URL (see .env.example); npm start and npm test set it for you.');
  if (direction === 'down') {
    const { db, destroy } = createDb(url, { max: 1 });
    const result = await migrateDown(db).finally(destroy);
    for (const r of result.results ?? []) console.log(`${r.migrationName}: ${r.status} (down)`);
    return;
  }
  const lines = await migrateDatabase(url);
  console.log(lines.length ? lines.join('\n') : 'Already up to date.');
}

if (import.meta.url === `file://${process.argv[1]}`) {
  main(process.argv[2]).catch((err: unknown) => {
    console.error(err);
    process.exit(1);
  });
}
