import type { Request, Response, Router } from 'express';
import express from 'express';
import type pg from 'pg';

/**
 * Bench mode only (`BENCH_QUERY_COUNT=true`): counts every query sent through the pool, so the
 * benchmark can report SQL round trips per request (it reads the count before and after a run of
 * sequential requests). Pooled clients are wrapped as they connect; Kysely, sessions and rate
 * limits all go through them. The job queue has its own pool and is not counted.
 */
export class QueryCounter {
  private count = 0;

  constructor(pool: pg.Pool) {
    pool.on('connect', (client) => {
      const query = client.query.bind(client) as (...args: unknown[]) => unknown;
      (client as unknown as { query: (...args: unknown[]) => unknown }).query = (...args: unknown[]) => {
        this.count += 1;
        return query(...args);
      };
    });
  }

  get total(): number {
    return this.count;
  }

  /** `GET /__bench/queries` → `{ "queries": n }`, the running total. */
  router(): Router {
    const r = express.Router();
    r.get('/__bench/queries', (_req: Request, res: Response) => {
      res.setHeader('cache-control', 'no-store');
      res.json({ queries: this.count });
    });
    return r;
  }
}
