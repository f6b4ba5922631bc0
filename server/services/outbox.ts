import { randomUUID } from 'node:crypto';
import { sql, type Kysely } from 'kysely';
import type { Logger } from 'pino';
import type { Mailer } from '../adapters/mail';
import type { Database } from '../db/database';
import type { JobQueue } from '../jobs/queue';

export const OUTBOX_JOB = 'outbox.deliver';

export interface QueuedEmail {
  to: string;
  subject: string;
  text: string;
  html?: string;
  /** What caused the message (`sign-in-link`, `invitation`, …). */
  kind: string;
  /** Extra headers, e.g. `List-Unsubscribe` and `List-Unsubscribe-Post` for notices. */
  headers?: Record<string, string>;
}

/** An SMTP answer in the 5xx range: the address will not work on a retry. */
function isPermanent(err: unknown): boolean {
  const code = typeof err === 'object' && err !== null && 'responseCode' in err ? Number(err.responseCode) : NaN;
  return code >= 500 && code < 600;
}

export interface OutboxOptions {
  from: string;
  /** Right-hand side of generated Message-IDs. */
  messageIdDomain: string;
  maxAttempts?: number;
  /** First retry delay; doubles per attempt, capped at an hour. 0 retries at once (tests). */
  baseBackoffMs?: number;
  leaseSeconds?: number;
  batchSize?: number;
}

type Row = {
  id: number;
  message_id: string;
  to_address: string;
  subject: string;
  text_body: string;
  html_body: string | null;
  headers: Record<string, string>;
  attempts: number;
};

/**
 * The e-mail outbox: messages are rows written in the same transaction as their cause, and a
 * queue job delivers them. A lease keeps two workers off the same row; a stable Message-ID makes
 * the one possible duplicate (crash after SMTP accepted, before the row was marked) recognisable.
 */
export class Outbox {
  private readonly maxAttempts: number;
  private readonly baseBackoffMs: number;
  private readonly leaseSeconds: number;
  private readonly batchSize: number;

  constructor(
    private readonly db: Kysely<Database>,
    private readonly queue: JobQueue,
    private readonly mailer: Mailer,
    private readonly logger: Logger,
    private readonly opts: OutboxOptions,
  ) {
    this.maxAttempts = opts.maxAttempts ?? 8;
    this.baseBackoffMs = opts.baseBackoffMs ?? 10_000;
    this.leaseSeconds = opts.leaseSeconds ?? 60;
    this.batchSize = opts.batchSize ?? 20;
  }

  /** Registers the delivery job (and a once-a-minute sweep) on the queue. */
  register(): void {
    this.queue.define({
      name: OUTBOX_JOB,
      handler: async () => void (await this.deliverDue()),
      cron: '* * * * *',
      retryLimit: 2,
      pollingIntervalSeconds: 1,
    });
  }

  /** Queues a message inside the caller's transaction; returns its row id. */
  async enqueue(trx: Kysely<Database>, mail: QueuedEmail): Promise<number> {
    const row = await trx
      .insertInto('outbox_messages')
      .values({
        message_id: `<${randomUUID()}@${this.opts.messageIdDomain}>`,
        to_address: mail.to,
        subject: mail.subject,
        text_body: mail.text,
        html_body: mail.html ?? null,
        kind: mail.kind,
        headers: JSON.stringify(mail.headers ?? {}),
      })
      .returning('id')
      .executeTakeFirstOrThrow();
    await this.queue.send(OUTBOX_JOB, {}, { trx: trx as unknown as Kysely<unknown> });
    return row.id;
  }

  /** Sends every due message once; returns how many were sent in this run. */
  async deliverDue(): Promise<{ sent: number; failed: number }> {
    let sent = 0;
    let failed = 0;
    for (;;) {
      const rows = await this.claim();
      for (const row of rows) {
        if (await this.deliver(row)) sent += 1;
        else failed += 1;
      }
      if (rows.length < this.batchSize) break;
    }
    await this.scheduleNextRetry();
    return { sent, failed };
  }

  private async claim(): Promise<Row[]> {
    const result = await sql<Row>`
      update outbox_messages
         set lease_until = now() + make_interval(secs => ${this.leaseSeconds}), attempts = attempts + 1, updated_at = now()
       where id in (
         select id from outbox_messages
          where status = 'pending' and next_attempt_at <= now() and (lease_until is null or lease_until < now())
          order by id
          limit ${this.batchSize}
          for update skip locked)
       returning id, message_id, to_address, subject, text_body, html_body, headers, attempts`.execute(this.db);
    return result.rows;
  }

  private async deliver(row: Row): Promise<boolean> {
    try {
      await this.mailer.send({
        from: this.opts.from,
        to: row.to_address,
        subject: row.subject,
        text: row.text_body,
        html: row.html_body,
        messageId: row.message_id,
        headers: row.headers,
      });
    } catch (err) {
      const permanent = isPermanent(err);
      const final = permanent || row.attempts >= this.maxAttempts;
      // A refused address is marked so notices skip it from now on (sign-in mail still tries).
      if (permanent)
        await this.db
          .insertInto('mail_suppressions')
          .values({ address: row.to_address.toLowerCase(), reason: err instanceof Error ? err.message.slice(0, 300) : 'refused' })
          .onConflict((oc) => oc.column('address').doNothing())
          .execute();
      const delayMs = Math.min(this.baseBackoffMs * 2 ** (row.attempts - 1), 3_600_000);
      this.logger.warn({ err, outboxId: row.id, attempts: row.attempts, final }, 'e-mail delivery failed');
      await this.db
        .updateTable('outbox_messages')
        .set({
          status: final ? 'failed' : 'pending',
          lease_until: null,
          last_error: err instanceof Error ? err.message.slice(0, 500) : String(err),
          next_attempt_at: sql<Date>`now() + make_interval(secs => ${delayMs / 1000})`,
          updated_at: sql<Date>`now()`,
        })
        .where('id', '=', row.id)
        .execute();
      return false;
    }
    await this.db
      .updateTable('outbox_messages')
      .set({ status: 'sent', sent_at: sql<Date>`now()`, lease_until: null, last_error: null, updated_at: sql<Date>`now()` })
      .where('id', '=', row.id)
      .execute();
    return true;
  }

  /** Retries wait in the row; wake the worker when the earliest one falls due. */
  private async scheduleNextRetry(): Promise<void> {
    const next = await this.db
      .selectFrom('outbox_messages')
      .select((eb) => eb.fn.min('next_attempt_at').as('at'))
      .where('status', '=', 'pending')
      .where('next_attempt_at', '>', sql<Date>`now()`)
      .executeTakeFirst();
    if (next?.at) await this.queue.send(OUTBOX_JOB, {}, { startAfter: new Date(next.at) });
  }
}
