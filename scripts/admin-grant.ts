// `npm run admin:grant <handle>`: make an account a site admin (recorded as an operator action).
// Uses DATABASE_URL, or the database of `npm start` when it is running.
import { existsSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { sql } from 'kysely';
import { createDb } from '../server/db/kysely';
import { applyAccountAction } from '../server/services/admin-accounts';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
export const DEV_DATABASE_URL_FILE = path.join(root, '.data', 'dev-database-url');

async function main(handle: string | undefined) {
  if (!handle) throw new Error('usage: npm run admin:grant <handle>');
  const url =
    process.env.DATABASE_URL ?? (existsSync(DEV_DATABASE_URL_FILE) ? readFileSync(DEV_DATABASE_URL_FILE, 'utf8').trim() : undefined);
  if (!url) throw new Error('Set DATABASE_URL, or run npm start first');
  const { db, destroy } = createDb(url, { max: 1 });
  try {
    const user = await db
      .selectFrom('users')
      .select(['id', 'handle'])
      .where(sql`lower(handle)`, '=', handle.toLowerCase())
      .executeTakeFirst();
    if (!user) throw new Error(`No account with handle "${handle}"`);
    await applyAccountAction(db, null, user.id, 'grant-admin');
    console.log(`${user.handle} is now a site admin.`);
  } finally {
    await destroy();
  }
}

main(process.argv[2]).catch((err: unknown) => {
  console.error(err instanceof Error ? err.message : err);
  process.exit(1);
});
