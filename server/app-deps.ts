import type pg from 'pg';
import type { Logger } from 'pino';
import type { Mailer } from './adapters/mail';
import type { Storage } from './adapters/storage';
import type { Config } from './config';
import type { Db } from './db/kysely';
import type { RateLimits } from './http/rate-limit';
import type { JobQueue } from './jobs/queue';
import type { Outbox } from './services/outbox';
import type { PageCache } from './ssr/page-cache';
import type { ReadingCache } from './services/reading-cache';
import type { SingleFlight } from './services/single-flight';

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
  /** Public reads of a build's content, per build content revision (server/services/reading-cache.ts). */
  readingCache: ReadingCache;
  /** Reads in progress that a caller asking the same may join (search; server/services/single-flight.ts). */
  sharedReads: SingleFlight;
  /** Server-rendered pages for visitors without a session, checked against their API answers (server/ssr/page-cache.ts). */
  pageCache: PageCache;
  logger: Logger;
}
