import { AsyncLocalStorage } from 'node:async_hooks';
import type pg from 'pg';

/**
 * One pooled connection at a time per request.
 *
 * Services read in parallel (`Promise.all` over several queries). Left alone, one episode page
 * waited for ten pooled connections at once, so the pool's queue counted queries rather than
 * requests: 200 readers overran a bound of 400 waiting (load shedding, `http/load-shed.ts`) and
 * were answered 503 although the machine had room. Inside `oneConnectionAtATime(work)` a query
 * first takes the request's gate, then a connection from the pool, and gives both back when it
 * ends, so a request waits in the pool's queue with one query at most. A request that is served
 * from a cache or waits for another request's read holds no connection at all.
 *
 * Transactions take their connection through the gate too and keep it until they end: code inside
 * a transaction must query through the transaction, never through `db` (that would wait for the
 * gate the transaction holds; it fails after the statement timeout instead of hanging).
 */
const gates = new AsyncLocalStorage<Gate>();

class Gate {
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

/** Runs `work` with its database queries taking turns on one pooled connection at a time. */
export function oneConnectionAtATime<T>(work: () => Promise<T>): Promise<T> {
  return gates.run(new Gate(), work);
}

/** The pool as Kysely sees it: a checkout inside `oneConnectionAtATime` waits for its request's turn first. */
export function gatedPool(pool: pg.Pool, timeoutMs: number): { connect(): Promise<pg.PoolClient>; end(): Promise<void> } {
  return {
    async connect() {
      const gate = gates.getStore();
      if (!gate) return pool.connect();
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
    end: () => pool.end(),
  };
}
