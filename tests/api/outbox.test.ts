import pino from 'pino';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startSmtpFake, type SmtpFake } from '../../fakes/smtp';
import type { Mailer } from '../../server/adapters/mail';
import { createDb } from '../../server/db/kysely';
import { Outbox } from '../../server/services/outbox';
import { startTestApp, type TestApp } from '../helpers/test-app';

let app: TestApp;
let smtp: SmtpFake;
beforeAll(async () => {
  app = await startTestApp();
  smtp = app.smtp;
});
afterAll(async () => {
  await smtp?.stop();
  await app?.stop();
});

const silent = pino({ level: 'silent' });

async function queue(to: string, subject: string) {
  return app.deps.db
    .transaction()
    .execute((trx) => app.deps.outbox.enqueue(trx, { to, subject, text: `Body of ${subject}`, kind: 'test' }));
}

async function row(id: number) {
  return app.deps.db.selectFrom('outbox_messages').selectAll().where('id', '=', id).executeTakeFirstOrThrow();
}

describe('e-mail outbox', () => {
  it('keeps a message queued while SMTP is down and delivers it once after it starts', async () => {
    const port = smtp.smtpPort;
    await smtp.stop();
    const id = await queue('pria@example.test', 'Queued while down');
    await app.runJobs();
    expect((await row(id)).status).toBe('pending');
    expect((await row(id)).attempts).toBe(1);

    smtp = await startSmtpFake({ smtpPort: port, httpPort: 0 });
    // The once-a-minute sweep picks the waiting message up; run it as its schedule would.
    await app.runJobs({ recurring: true });
    await app.runJobs({ recurring: true });
    const sent = await row(id);
    expect(sent.status).toBe('sent');
    const res = await fetch(`${smtp.httpUrl}/api/messages`);
    const messages = (await res.json()) as Array<{ subject: string; messageId: string }>;
    const copies = messages.filter((m) => m.subject === 'Queued while down');
    expect(copies).toHaveLength(1);
    expect(copies[0]?.messageId).toBe(sent.message_id);
  });

  it('does not queue the message when the surrounding transaction rolls back', async () => {
    const before = await app.deps.db
      .selectFrom('outbox_messages')
      .select((eb) => eb.fn.countAll<number>().as('n'))
      .executeTakeFirstOrThrow();
    await expect(
      app.deps.db.transaction().execute(async (trx) => {
        await app.deps.outbox.enqueue(trx, { to: 'x@example.test', subject: 'Never', text: 'x', kind: 'test' });
        throw new Error('the causing event failed');
      }),
    ).rejects.toThrow('the causing event failed');
    const after = await app.deps.db
      .selectFrom('outbox_messages')
      .select((eb) => eb.fn.countAll<number>().as('n'))
      .executeTakeFirstOrThrow();
    expect(after.n).toBe(before.n);
  });

  it('delivers each message once when two workers race over the same rows', async () => {
    smtp.clear();
    const ids: number[] = [];
    for (let i = 0; i < 30; i += 1) ids.push(await queue(`racer${i}@example.test`, `Race ${i}`));
    // A second "process": its own pool and its own Outbox over the same database.
    const second = createDb(app.config.DATABASE_URL, { max: 3 });
    const other = new Outbox(second.db, app.deps.queue, app.deps.mailer, silent, {
      from: app.config.MAIL_FROM,
      messageIdDomain: 'test',
      batchSize: 4,
    });
    const mine = new Outbox(app.deps.db, app.deps.queue, app.deps.mailer, silent, {
      from: app.config.MAIL_FROM,
      messageIdDomain: 'test',
      batchSize: 4,
    });
    const [a, b] = await Promise.all([mine.deliverDue(), other.deliverDue()]);
    await second.destroy();
    expect(a.sent + b.sent).toBe(30);
    expect(a.sent).toBeGreaterThan(0);
    expect(b.sent).toBeGreaterThan(0);
    const subjects = smtp
      .messages()
      .map((m) => m.subject)
      .filter((s) => s.startsWith('Race '));
    expect(subjects).toHaveLength(30);
    expect(new Set(subjects).size).toBe(30);
  });

  it('resends with the same Message-ID after a failure that happened once SMTP had accepted', async () => {
    smtp.clear();
    let calls = 0;
    const flaky: Mailer = {
      ...app.deps.mailer,
      async send(mail) {
        await app.deps.mailer.send(mail);
        calls += 1;
        if (calls === 1) throw new Error('connection lost after the server accepted the message');
      },
    };
    const outbox = new Outbox(app.deps.db, app.deps.queue, flaky, silent, {
      from: app.config.MAIL_FROM,
      messageIdDomain: 'test',
      baseBackoffMs: 0,
    });
    const id = await queue('dup@example.test', 'Maybe twice');
    await outbox.deliverDue();
    await outbox.deliverDue();
    const copies = smtp.messages().filter((m) => m.subject === 'Maybe twice');
    expect(copies).toHaveLength(2);
    expect(new Set(copies.map((c) => c.messageId))).toEqual(new Set([(await row(id)).message_id]));
    expect((await row(id)).status).toBe('sent');
  });

  it('gives up after too many attempts and marks the row failed', async () => {
    const down: Mailer = { ...app.deps.mailer, send: () => Promise.reject(new Error('550 mailbox unavailable')) };
    const outbox = new Outbox(app.deps.db, app.deps.queue, down, silent, {
      from: app.config.MAIL_FROM,
      messageIdDomain: 'test',
      baseBackoffMs: 0,
      maxAttempts: 3,
    });
    const id = await queue('nobody@example.test', 'Undeliverable');
    for (let i = 0; i < 5; i += 1) await outbox.deliverDue();
    const r = await row(id);
    expect(r.status).toBe('failed');
    expect(r.attempts).toBe(3);
    expect(r.last_error).toContain('550');
  });
});
