import type { RequestHandler } from 'express';
import type pg from 'pg';

/** Seconds a shed client is asked to wait before trying again. */
export const SHED_RETRY_AFTER_SECONDS = 2;

/**
 * Bounds the queue for database connections: when more than `maxWaiting` callers already wait
 * for a pooled connection, a new request is answered at once with 503 and `Retry-After`, before
 * it does any work (nothing is half-written). Below the bound nothing changes. Health checks and
 * static files are never shed: they do not wait on the pool.
 */
export function loadShed(pool: pg.Pool, maxWaiting: number): RequestHandler {
  return (req, res, next) => {
    if (pool.waitingCount < maxWaiting || req.path === '/api/health' || req.path.startsWith('/assets/')) return next();
    res.setHeader('retry-after', String(SHED_RETRY_AFTER_SECONDS));
    res.setHeader('cache-control', 'no-store');
    res.status(503).json({
      error: { code: 'overloaded', message: 'The server is busy; try again in a few seconds' },
    });
  };
}
