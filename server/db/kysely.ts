import { Kysely, PostgresDialect } from 'kysely';
import pg from 'pg';
import type { Database } from './database';
import { nameRegisteredStatements } from './prepared';

// int8 (bigint, count(*)) → number, refusing silently lossy values; numeric stays a string
// so decimal quantities and rates are parsed deliberately, never as floats by accident.
pg.types.setTypeParser(pg.types.builtins.INT8, (v: string) => {
  const n = Number(v);
  if (!Number.isSafeInteger(n)) throw new RangeError(`bigint ${v} is outside the safe integer range`);
  return n;
});

// date (a calendar day, e.g. a sponsorship's start) stays 'YYYY-MM-DD': as a JS Date it would
// shift by the process's time zone.
pg.types.setTypeParser(pg.types.builtins.DATE, (v: string) => v);

export type Db = Kysely<Database>;

export interface DbHandle {
  db: Db;
  pool: pg.Pool;
  destroy(): Promise<void>;
}

const CONNECT_TIMEOUT_MS = 5_000;
/** Also how long a query waits for its request's turn (db/request-gate.ts): behind the request's own earlier queries. */
export const QUERY_TIMEOUT_MS = 30_000;

/** Opens a pool and a Kysely instance over it; connection errors are logged, never fatal. */
export function createDb(connectionString: string, opts: { max?: number; onError?: (err: Error) => void } = {}): DbHandle {
  const pool = new pg.Pool({
    connectionString,
    max: opts.max ?? 10,
    connectionTimeoutMillis: CONNECT_TIMEOUT_MS,
    idleTimeoutMillis: 30_000,
    // Fail fast when the database is gone instead of hanging a request.
    query_timeout: QUERY_TIMEOUT_MS,
  });
  pool.on('error', (err) => opts.onError?.(err));
  // pg-pool listens for errors only on idle clients. A client checked out between two statements
  // (inside a transaction) that loses its server — PostgreSQL restarting, 57P01 — would emit an
  // 'error' nobody hears and crash the process (found by the fault suite). Every client gets a
  // listener of its own; the failed statement or the next one on that client answers 503.
  pool.on('connect', (client) => {
    client.on('error', (err) => opts.onError?.(err));
    nameRegisteredStatements(client);
  });
  const db = new Kysely<Database>({ dialect: new PostgresDialect({ pool }) });
  return { db, pool, destroy: () => db.destroy() };
}
