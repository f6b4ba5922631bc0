import type pg from 'pg';
import { RateLimiterPostgres, RateLimiterRes } from 'rate-limiter-flexible';
import { HttpError } from './http-error';

/** Every named limit; counters live in PostgreSQL so all server processes share them. */
export const RATE_LIMITS = {
  'sign-in': { points: 20, duration: 15 * 60 },
  'sign-in-link-ip': { points: 10, duration: 60 * 60 },
  'sign-in-link-email': { points: 5, duration: 60 * 60 },
  invitation: { points: 30, duration: 60 * 60 },
  // New supplier records are site-wide: a typo storm should not fill the list.
  'supplier-create': { points: 100, duration: 60 * 60 },
  'ledger-import': { points: 60, duration: 60 * 60 },
  // Posts and replies per account; reports per account (a flood of either is the abuse).
  'post-create': { points: 20, duration: 10 * 60 },
  'post-report': { points: 10, duration: 60 * 60 },
} satisfies Record<string, { points: number; duration: number }>;

export type RateLimitName = keyof typeof RATE_LIMITS;

export interface RateLimits {
  /** Spends one point of the named limit for the key; throws 429 with Retry-After when out. */
  consume(name: RateLimitName, key: string): Promise<void>;
}

export function createRateLimits(pool: pg.Pool, multiplier = 1): RateLimits {
  const limiters = new Map<RateLimitName, RateLimiterPostgres>();
  for (const [name, opts] of Object.entries(RATE_LIMITS) as Array<[RateLimitName, { points: number; duration: number }]>) {
    limiters.set(
      name,
      new RateLimiterPostgres({
        storeClient: pool,
        storeType: 'pool',
        tableName: 'rate_limits',
        tableCreated: true,
        clearExpiredByTimeout: false,
        keyPrefix: name,
        duration: opts.duration,
        points: opts.points * multiplier,
      }),
    );
  }
  return {
    async consume(name, key) {
      try {
        await limiters.get(name)!.consume(key);
      } catch (err) {
        if (err instanceof RateLimiterRes) {
          const seconds = Math.max(1, Math.ceil(err.msBeforeNext / 1000));
          throw new HttpError(429, 'rate_limited', `Too many attempts; try again in ${seconds} s`, undefined, {
            'retry-after': String(seconds),
          });
        }
        throw err;
      }
    },
  };
}
