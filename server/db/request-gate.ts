import { Kysely, PostgresDialect } from 'kysely';
import type pg from 'pg';
import type { Database } from './database';

/**
 * One pooled connection at a time per request.
 *
 * Services read in parallel (`Promise.all` over several queries). Left alone, one episode page
 * waited for ten pooled connections at once, so the pool's queue counted queries rather than
 * requests: 200 readers overran a bound of 400 waiting (load shedding, `http/load-shed.ts`) and
 * were answered 503 although the machine had room. A GET handler gets `requestDb(pool)` as its
 * `deps.db` (the route registry does it): a query first takes the request's turn, then a connection
 * from the pool, and gives both back when it ends, so a request waits in the pool's queue with one
 * query at most. A request served from a cache, or waiting for another request's read, holds none.
 *
 * Transactions take their connection through the turn too and keep it until they end: code inside
 * a transaction must query through the transaction, never through `db` (that would wait for the
 * turn the transaction holds; it fails after the statement timeout instead of hanging).
 *
 * A Kysely of its own per request (a few microseconds) rather than AsyncLocalStorage: with it every
 * promise in the process paid Node 20's async-context hook, about 6 % of the cached episode read.
 */
export class Gate {
  private busy = false;
  private readonly waiting: Array<() => void> = [];

  async acquire(timeoutMs: number): Promise<void> {
    if (!this.busy) {
      this.busy = true;
      return;
    }
    await new Promise<void>((resolve, reject) => {
      const turn = () => {
        clearTimeout(timer);
        resolve();
      };
      const timer = setTimeout(() => {
        this.waiting.splice(this.waiting.indexOf(turn), 1);
        // The pool's own wording, so the error handler answers 503 as for a pool timeout.
        reject(new Error('timeout exceeded when trying to connect (waiting for this request’s connection)'));
      }, timeoutMs);
      this.waiting.push(turn);
    });
  }

  release(): void {
    const next = this.waiting.shift();
    if (next) next();
    else this.busy = false;
  }
}

/** The pool as one request's Kysely sees it: a checkout waits for the request's turn first. */
export function gatedPool(pool: pg.Pool, gate: Gate, timeoutMs: number): { connect(): Promise<pg.PoolClient>; end(): Promise<void> } {
  return {
    async connect() {
      await gate.acquire(timeoutMs);
      let client: pg.PoolClient;
      try {
        client = await pool.connect();
      } catch (err) {
        gate.release();
        throw err;
      }
      // pg-pool gives every checkout its own `release`; the request's turn ends with it.
      const release = client.release.bind(client);
      client.release = (err?: Error | boolean) => {
        client.release = release;
        release(err);
        gate.release();
      };
      return client;
    },
    // The pool is the process's; a request's Kysely never ends it.
    end: async () => undefined,
  };
}

/** A Kysely for one request whose queries take turns on one pooled connection at a time. */
export function requestDb(pool: pg.Pool, timeoutMs = 30_000): Kysely<Database> {
  return new Kysely<Database>({ dialect: new PostgresDialect({ pool: gatedPool(pool, new Gate(), timeoutMs) }) });
}
