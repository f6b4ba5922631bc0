import type { Logger } from 'pino';
import { createSmtpMailer } from './adapters/mail';
import { createS3Storage } from './adapters/storage';
import type { AppDeps } from './app-deps';
import type { Config } from './config';
import { createDb } from './db/kysely';
import { createRateLimits } from './http/rate-limit';
import { registerJobs } from './jobs';
import { JobQueue } from './jobs/queue';
import { Outbox, type OutboxOptions } from './services/outbox';
import { ReadingCache } from './services/reading-cache';
import { SingleFlight } from './services/single-flight';
import { PageCache } from './ssr/page-cache';

export interface RunningDeps extends AppDeps {
  /** Closes everything in reverse order of opening. */
  close(): Promise<void>;
}

/** Opens the real dependencies from config (the queue is created but not started). */
export function createDeps(config: Config, logger: Logger, overrides: { outbox?: Partial<OutboxOptions> } = {}): RunningDeps {
  const { db, pool, destroy } = createDb(config.DATABASE_URL, {
    max: config.DATABASE_POOL_MAX,
    onError: (err) => logger.warn({ err }, 'idle database client error'),
  });
  const storage = createS3Storage(config);
  const mailer = createSmtpMailer(config);
  const queue = new JobQueue(config.DATABASE_URL, logger);
  const outbox = new Outbox(db, queue, mailer, logger, {
    from: config.MAIL_FROM,
    messageIdDomain: new URL(config.PUBLIC_URL).hostname,
    ...overrides.outbox,
  });
  const deps: AppDeps = {
    config,
    db,
    pool,
    rateLimits: createRateLimits(pool, config.RATE_LIMIT_MULTIPLIER),
    storage,
    mailer,
    queue,
    outbox,
    readingCache: new ReadingCache(),
    pageCache: new PageCache(),
    sharedReads: new SingleFlight(),
    logger,
  };
  registerJobs(deps);
  return {
    ...deps,
    async close() {
      await queue.stop();
      mailer.close();
      storage.close();
      await destroy();
    },
  };
}
