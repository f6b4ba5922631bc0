import { sql, type Kysely } from 'kysely';

export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('outbox_messages')
    .addColumn('id', 'bigint', (c) => c.primaryKey().generatedAlwaysAsIdentity())
    .addColumn('message_id', 'text', (c) => c.notNull().unique())
    .addColumn('to_address', 'text', (c) => c.notNull())
    .addColumn('subject', 'text', (c) => c.notNull())
    .addColumn('text_body', 'text', (c) => c.notNull())
    .addColumn('html_body', 'text')
    .addColumn('kind', 'text', (c) => c.notNull())
    .addColumn('status', 'text', (c) => c.notNull().defaultTo('pending'))
    .addColumn('attempts', 'integer', (c) => c.notNull().defaultTo(0))
    .addColumn('next_attempt_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('lease_until', 'timestamptz')
    .addColumn('last_error', 'text')
    .addColumn('sent_at', 'timestamptz')
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('updated_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addCheckConstraint('outbox_messages_status_check', sql`status in ('pending', 'sent', 'failed')`)
    .execute();
  await sql`create index outbox_messages_due_idx on outbox_messages (next_attempt_at) where status = 'pending'`.execute(db);

  // Which demo-seed sections ran at which version, so the seed can report what it did.
  await db.schema
    .createTable('seed_runs')
    .addColumn('section', 'text', (c) => c.primaryKey())
    .addColumn('version', 'integer', (c) => c.notNull())
    .addColumn('ran_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('seed_runs').execute();
  await db.schema.dropTable('outbox_messages').execute();
}
