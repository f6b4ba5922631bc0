import { CompiledQuery, type Kysely } from 'kysely';
import PgBoss from 'pg-boss';
import type { Logger } from 'pino';

export const QUEUE_SCHEMA = 'pgboss';

export interface JobDefinition<T extends object = object> {
  name: string;
  /** Runs one job; throw to let pg-boss retry it with the queue's backoff. */
  handler: (data: T) => Promise<void>;
  policy?: 'standard' | 'short' | 'singleton' | 'stately';
  retryLimit?: number;
  retryDelay?: number;
  retryBackoff?: boolean;
  expireInSeconds?: number;
  /** Cron expression (minute precision) for a recurring job. */
  cron?: string;
  pollingIntervalSeconds?: number;
}

export interface SendOptions {
  startAfter?: number | Date;
  singletonKey?: string;
  /** Send inside this Kysely transaction, so the job exists only if the transaction commits. */
  trx?: Kysely<unknown>;
}

/** The app's one job queue: pg-boss with its jobs registered here by each feature. */
export class JobQueue {
  readonly boss: PgBoss;
  private readonly defs = new Map<string, JobDefinition>();
  private started = false;

  constructor(
    connectionString: string,
    private readonly logger: Logger,
  ) {
    this.boss = new PgBoss({ connectionString, schema: QUEUE_SCHEMA, max: 4, migrate: true });
    this.boss.on('error', (err) => this.logger.error({ err }, 'job queue error'));
  }

  /** Registers a job type; call before start(). */
  define<T extends object>(def: JobDefinition<T>): void {
    this.defs.set(def.name, def as unknown as JobDefinition);
  }

  get names(): string[] {
    return [...this.defs.keys()];
  }

  /** Starts pg-boss and creates queues; with `workers: false` nothing polls (tests drain by hand). */
  async start({ workers = true }: { workers?: boolean } = {}): Promise<void> {
    await this.boss.start();
    this.started = true;
    for (const def of this.defs.values()) {
      await this.boss.createQueue(def.name, {
        name: def.name,
        policy: def.policy ?? 'standard',
        retryLimit: def.retryLimit ?? 5,
        retryDelay: def.retryDelay ?? 5,
        retryBackoff: def.retryBackoff ?? true,
        expireInSeconds: def.expireInSeconds ?? 300,
      });
      if (!workers) continue;
      if (def.cron) await this.boss.schedule(def.name, def.cron, {});
      await this.boss.work(def.name, { pollingIntervalSeconds: def.pollingIntervalSeconds ?? 2 }, async (jobs) => {
        for (const job of jobs) await def.handler(job.data as object);
      });
    }
  }

  /** Queues a job; returns its id, or null when a singleton/short policy dropped a duplicate. */
  async send<T extends object>(name: string, data: T, opts: SendOptions = {}): Promise<string | null> {
    if (!this.defs.has(name)) throw new Error(`Unknown job "${name}"`);
    const { trx, ...rest } = opts;
    const db = trx
      ? { executeSql: async (text: string, values: unknown[]) => trx.executeQuery(CompiledQuery.raw(text, values)) }
      : undefined;
    return this.boss.send(name, data, { ...rest, ...(db ? { db } : {}) });
  }

  /** Queues one run of every recurring (cron) job now, as its schedule would. For tests and scripts. */
  async triggerRecurring(): Promise<void> {
    for (const def of this.defs.values()) if (def.cron) await this.boss.send(def.name, {});
  }

  /** Runs every job that is due now, once each; returns how many ran. For tests and scripts. */
  async runDueJobs(): Promise<number> {
    let ran = 0;
    for (const def of this.defs.values()) {
      for (;;) {
        const jobs = await this.boss.fetch<object>(def.name, { batchSize: 10 });
        if (jobs.length === 0) break;
        for (const job of jobs) {
          try {
            await def.handler(job.data);
            await this.boss.complete(def.name, job.id);
          } catch (err) {
            await this.boss.fail(def.name, job.id, { message: err instanceof Error ? err.message : String(err) });
          }
          ran += 1;
        }
      }
    }
    return ran;
  }

  /** Stops polling, waits for running jobs, closes the queue's pool. */
  async stop(): Promise<void> {
    if (!this.started) return;
    this.started = false;
    await this.boss.stop({ graceful: true, wait: true, timeout: 10_000 });
  }
}

/** Creates or upgrades pg-boss's own schema; run by `db:migrate` beside the Kysely migrations. */
export async function migrateQueueSchema(connectionString: string): Promise<void> {
  const boss = new PgBoss({ connectionString, schema: QUEUE_SCHEMA, max: 1, migrate: true, supervise: false, schedule: false });
  await boss.start();
  await boss.stop({ graceful: false, wait: true });
}
