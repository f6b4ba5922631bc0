import type { Request, Response, Router } from 'express';
import express from 'express';
import type pg from 'pg';

/** One statement as the pool received it. */
export interface LoggedQuery {
  seq: number;
  text: string;
  values: unknown[];
}

const KEEP = 500;

/**
 * Bench mode only (`BENCH_QUERY_COUNT=true`): counts every query sent through the pool, so the
 * benchmark can report SQL round trips per request (it reads the count before and after a run of
 * sequential requests), and keeps the last few hundred statements so it can time the same SQL
 * through `pg` directly. Pooled clients are wrapped as they connect; Kysely, sessions and rate
 * limits all go through them. The job queue has its own pool and is not counted.
 */
export class QueryCounter {
  private count = 0;
  private readonly recent: LoggedQuery[] = [];

  constructor(pool: pg.Pool) {
    pool.on('connect', (client) => {
      const query = client.query.bind(client) as (...args: unknown[]) => unknown;
      (client as unknown as { query: (...args: unknown[]) => unknown }).query = (...args: unknown[]) => {
        this.record(args[0], args[1]);
        return query(...args);
      };
    });
  }

  private record(first: unknown, second: unknown): void {
    this.count += 1;
    const cfg =
      typeof first === 'string'
        ? { text: first, values: Array.isArray(second) ? second : [] }
        : (first as { text?: string; values?: unknown[] });
    this.recent.push({ seq: this.count, text: cfg?.text ?? '', values: cfg?.values ?? [] });
    if (this.recent.length > KEEP) this.recent.shift();
  }

  get total(): number {
    return this.count;
  }

  /** `GET /__bench/queries[?since=n]` → `{ queries, log }`: the running total, and the statements after `since`. */
  router(): Router {
    const r = express.Router();
    r.get('/__bench/queries', (req: Request, res: Response) => {
      const since = Number(req.query.since);
      res.setHeader('cache-control', 'no-store');
      res.json({ queries: this.count, log: Number.isFinite(since) ? this.recent.filter((q) => q.seq > since) : [] });
    });
    return r;
  }
}
