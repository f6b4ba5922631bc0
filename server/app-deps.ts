import type pg from 'pg';
import type { Logger } from 'pino';
import type { Mailer } from './adapters/mail';
import type { Storage } from './adapters/storage';
import type { Config } from './config';
import type { Db } from './db/kysely';
import type { RateLimits } from './http/rate-limit';
import type { JobQueue } from './jobs/queue';
import type { Outbox } from './services/outbox';
import type { ReadingCache } from './services/reading-cache';

/** Everything the app talks to, injected so tests can build the app in-process. */
export interface AppDeps {
  config: Config;
  db: Db;
  /** The pool under `db`, for libraries that need pg itself (sessions, rate limits). */
  pool: pg.Pool;
  rateLimits: RateLimits;
  storage: Storage;
  mailer: Mailer;
  queue: JobQueue;
  outbox: Outbox;
  /** The episode read, per build content revision (server/services/reading-cache.ts). */
  readingCache: ReadingCache;
  logger: Logger;
}
