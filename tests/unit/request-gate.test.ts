// A request's queries take turns on one pooled connection (server/db/request-gate.ts); separate
// requests use the pool side by side. Checked against a stand-in pool that counts checkouts.
import type pg from 'pg';
import { describe, expect, it } from 'vitest';
import { Gate, gatedPool } from '../../server/db/request-gate';
import { SingleFlight } from '../../server/services/single-flight';

function countingPool() {
  let out = 0;
  const stats = { most: 0, checkouts: 0 };
  const pool = {
    async connect() {
      out += 1;
      stats.checkouts += 1;
      stats.most = Math.max(stats.most, out);
      const client = { release: () => void (out -= 1) };
      return client as unknown as pg.PoolClient;
    },
  } as unknown as pg.Pool;
  return { pool, stats };
}

const tick = () => new Promise((r) => setTimeout(r, 5));

/** A query as Kysely runs it: check a client out, wait for the answer, give it back. */
async function query(p: ReturnType<typeof gatedPool>): Promise<void> {
  const c = await p.connect();
  await tick();
  c.release();
}

describe('one pooled connection at a time per request', () => {
  it('runs parallel queries of one request one after another on the pool', async () => {
    const { pool, stats } = countingPool();
    const request = gatedPool(pool, new Gate(), 1_000);
    await Promise.all([query(request), query(request), query(request), query(request)]);
    expect(stats).toEqual({ most: 1, checkouts: 4 });
  });

  it('lets separate requests use the pool side by side', async () => {
    const { pool, stats } = countingPool();
    const [a, b, c] = [1, 2, 3].map(() => gatedPool(pool, new Gate(), 1_000));
    await Promise.all([query(a!), query(a!), query(b!), query(b!), query(c!), query(c!)]);
    expect(stats.checkouts).toBe(6);
    expect(stats.most).toBe(3);
  });

  it("gives the request's turn back when the pool refuses a connection", async () => {
    let fail = true;
    const pool = {
      async connect() {
        if (fail) {
          fail = false;
          throw new Error('timeout exceeded when trying to connect');
        }
        return { release: () => undefined } as unknown as pg.PoolClient;
      },
    } as unknown as pg.Pool;
    const request = gatedPool(pool, new Gate(), 1_000);
    await expect(request.connect()).rejects.toThrow(/timeout exceeded/);
    const c = await request.connect();
    c.release();
  });

  it('fails, instead of hanging, when a query waits for a turn its own request never gives back', async () => {
    const { pool } = countingPool();
    const request = gatedPool(pool, new Gate(), 50);
    const held = await request.connect(); // a transaction's connection, say
    await expect(request.connect()).rejects.toThrow(/timeout exceeded when trying to connect/);
    held.release();
  });
});

describe('single flight', () => {
  it('runs a key once for everyone who asks while it runs, and again after', async () => {
    const flights = new SingleFlight();
    let runs = 0;
    const work = async () => {
      const run = (runs += 1);
      await tick();
      return run;
    };
    const answers = await Promise.all([flights.run('a', work), flights.run('a', work), flights.run('a', work)]);
    expect(answers).toEqual([1, 1, 1]);
    expect(await flights.run('a', work)).toBe(2);
    expect(await Promise.all([flights.run('b', work), flights.run('c', work)])).toEqual([3, 4]);
  });

  it('shares a failure with the callers waiting for it, then forgets it', async () => {
    const flights = new SingleFlight();
    let calls = 0;
    const failing = async () => {
      calls += 1;
      await tick();
      throw new Error('database gone');
    };
    const results = await Promise.allSettled([flights.run('k', failing), flights.run('k', failing)]);
    expect(results.map((r) => r.status)).toEqual(['rejected', 'rejected']);
    expect(calls).toBe(1);
    await expect(flights.run('k', async () => 'back')).resolves.toBe('back');
  });
});
