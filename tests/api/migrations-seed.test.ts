import { sql } from 'kysely';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createDb, type DbHandle } from '../../server/db/kysely';
import { migrateDown, migrateToLatest } from '../../server/db/migrator';
import { runSeed } from '../../server/seed';
import { loadDemoAccounts } from '../../server/seed/sections/demo-accounts';
import { createTestDatabase, type TestDatabase } from '../helpers/test-db';

let database: TestDatabase;
let handle: DbHandle;
beforeAll(async () => {
  database = await createTestDatabase({ empty: true });
  handle = createDb(database.url, { max: 2 });
});
afterAll(async () => {
  await handle?.destroy();
  await database?.drop();
});

async function tables(): Promise<string[]> {
  const r = await sql<{
    table_name: string;
  }>`select table_name from information_schema.tables where table_schema = 'public' order by table_name`.execute(handle.db);
  return r.rows.map((t) => t.table_name);
}

describe('migrations', () => {
  it('go up from empty, down the last one, and up again', async () => {
    const up = await migrateToLatest(handle.db);
    expect(up.results?.every((r) => r.status === 'Success')).toBe(true);
    expect(await tables()).toEqual(expect.arrayContaining(['users', 'builds', 'episodes', 'sponsors', 'outbox_messages', 'seed_runs']));

    const down = await migrateDown(handle.db);
    expect(down.results).toHaveLength(1);
    expect(await tables()).not.toContain('outbox_messages');
    expect(await tables()).toContain('users');

    const again = await migrateToLatest(handle.db);
    expect(again.results).toHaveLength(1);
    expect(await tables()).toContain('outbox_messages');
  });
});

describe('demo seed', () => {
  it('creates the demo accounts, and running it twice leaves the same rows', async () => {
    await runSeed(handle.db);
    const first = await handle.db.selectFrom('users').select(['id', 'handle', 'display_name', 'is_admin']).orderBy('id').execute();
    expect(first.map((u) => u.handle).sort()).toEqual(
      loadDemoAccounts()
        .map((a) => a.login)
        .sort(),
    );
    expect(first.filter((u) => u.is_admin).map((u) => u.handle)).toEqual(['site-admin']);

    await runSeed(handle.db);
    const second = await handle.db.selectFrom('users').select(['id', 'handle', 'display_name', 'is_admin']).orderBy('id').execute();
    expect(second).toEqual(first);
    const runs = await handle.db.selectFrom('seed_runs').select(['section', 'version']).execute();
    expect(runs).toEqual([{ section: 'demo-accounts', version: 1 }]);
  });
});
