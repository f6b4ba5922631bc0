import { randomBytes } from 'node:crypto';
import pg from 'pg';
import { inject } from 'vitest';

export interface TestDatabase {
  url: string;
  name: string;
  drop(): Promise<void>;
}

async function admin<T>(fn: (client: pg.Client) => Promise<T>): Promise<T> {
  const client = new pg.Client({ connectionString: inject('pgAdminUrl') });
  await client.connect();
  try {
    return await fn(client);
  } finally {
    await client.end();
  }
}

/** A fresh database copied from the migrated template (or empty): one per test file, dropped afterwards. */
export async function createTestDatabase({ empty = false }: { empty?: boolean } = {}): Promise<TestDatabase> {
  const name = `rr_t_${process.pid}_${randomBytes(4).toString('hex')}`;
  const template = empty ? 'template0' : inject('pgTemplate');
  await admin((c) => c.query(`create database "${name}" template "${template}"`));
  const url = new URL(inject('pgAdminUrl'));
  url.pathname = `/${name}`;
  return {
    url: url.toString(),
    name,
    drop: () => admin(async (c) => void (await c.query(`drop database if exists "${name}" with (force)`))),
  };
}

/** A handle on a test database that already exists (kept by an earlier app); drop() removes it. */
export function existingTestDatabase(url: string): TestDatabase {
  const name = decodeURIComponent(new URL(url).pathname.slice(1));
  return {
    url,
    name,
    drop: () => admin(async (c) => void (await c.query(`drop database if exists "${name}" with (force)`))),
  };
}
