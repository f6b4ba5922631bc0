import { sql, type Kysely } from 'kysely';

export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .alterTable('users')
    .addColumn('notice_email', 'text')
    .addColumn('suspended_at', 'timestamptz')
    .addColumn('deleted_at', 'timestamptz')
    .execute();

  // The ways an account signs in: a GitHub user id, an e-mail address (one-time links).
  await db.schema
    .createTable('identities')
    .addColumn('id', 'bigint', (c) => c.primaryKey().generatedAlwaysAsIdentity())
    .addColumn('user_id', 'bigint', (c) => c.notNull().references('users.id').onDelete('cascade'))
    .addColumn('provider', 'text', (c) => c.notNull().check(sql`provider in ('github', 'email')`))
    .addColumn('provider_uid', 'text', (c) => c.notNull())
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('last_used_at', 'timestamptz')
    .addUniqueConstraint('identities_provider_uid_key', ['provider', 'provider_uid'])
    .execute();
  await db.schema.createIndex('identities_user_id_idx').on('identities').column('user_id').execute();

  // connect-pg-simple's table, created here (its own auto-create collides on fixed names).
  await db.schema
    .createTable('sessions')
    .addColumn('sid', 'varchar', (c) => c.primaryKey())
    .addColumn('sess', 'json', (c) => c.notNull())
    .addColumn('expire', sql`timestamp(6)`, (c) => c.notNull())
    .execute();
  await db.schema.createIndex('sessions_expire_idx').on('sessions').column('expire').execute();

  await db.schema
    .createTable('build_members')
    .addColumn('id', 'bigint', (c) => c.primaryKey().generatedAlwaysAsIdentity())
    .addColumn('build_id', 'bigint', (c) => c.notNull().references('builds.id').onDelete('cascade'))
    .addColumn('user_id', 'bigint', (c) => c.notNull().references('users.id').onDelete('cascade'))
    .addColumn('role', 'text', (c) => c.notNull().check(sql`role in ('owner', 'editor')`))
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addUniqueConstraint('build_members_build_user_key', ['build_id', 'user_id'])
    .execute();
  await db.schema.createIndex('build_members_user_id_idx').on('build_members').column('user_id').execute();
  await sql`create unique index build_members_one_owner_key on build_members (build_id) where role = 'owner'`.execute(db);
  await sql`insert into build_members (build_id, user_id, role) select id, owner_id, 'owner' from builds`.execute(db);

  await db.schema
    .createTable('sponsor_members')
    .addColumn('id', 'bigint', (c) => c.primaryKey().generatedAlwaysAsIdentity())
    .addColumn('sponsor_id', 'bigint', (c) => c.notNull().references('sponsors.id').onDelete('cascade'))
    .addColumn('user_id', 'bigint', (c) => c.notNull().references('users.id').onDelete('cascade'))
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addUniqueConstraint('sponsor_members_sponsor_user_key', ['sponsor_id', 'user_id'])
    .execute();
  await db.schema.createIndex('sponsor_members_user_id_idx').on('sponsor_members').column('user_id').execute();

  await db.schema
    .createTable('sign_in_tokens')
    .addColumn('id', 'bigint', (c) => c.primaryKey().generatedAlwaysAsIdentity())
    .addColumn('token_hash', 'text', (c) => c.notNull().unique())
    .addColumn('email', 'text', (c) => c.notNull())
    .addColumn('return_to', 'text')
    .addColumn('expires_at', 'timestamptz', (c) => c.notNull())
    .addColumn('used_at', 'timestamptz')
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();

  // One invitation mechanism with a kind: build editors here, sponsor members later.
  await db.schema
    .createTable('invitations')
    .addColumn('id', 'bigint', (c) => c.primaryKey().generatedAlwaysAsIdentity())
    .addColumn('kind', 'text', (c) => c.notNull())
    .addColumn('build_id', 'bigint', (c) => c.references('builds.id').onDelete('cascade'))
    .addColumn('sponsor_id', 'bigint', (c) => c.references('sponsors.id').onDelete('cascade'))
    .addColumn('email', 'text', (c) => c.notNull())
    .addColumn('token_hash', 'text', (c) => c.notNull().unique())
    .addColumn('invited_by', 'bigint', (c) => c.references('users.id').onDelete('set null'))
    .addColumn('expires_at', 'timestamptz', (c) => c.notNull())
    .addColumn('last_sent_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('accepted_at', 'timestamptz')
    .addColumn('accepted_by', 'bigint', (c) => c.references('users.id').onDelete('set null'))
    .addColumn('revoked_at', 'timestamptz')
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addCheckConstraint(
      'invitations_kind_check',
      sql`(kind = 'build-editor' and build_id is not null) or (kind = 'sponsor-member' and sponsor_id is not null)`,
    )
    .execute();
  await db.schema.createIndex('invitations_build_id_idx').on('invitations').column('build_id').execute();
  await db.schema.createIndex('invitations_sponsor_id_idx').on('invitations').column('sponsor_id').execute();
  await db.schema.createIndex('invitations_invited_by_idx').on('invitations').column('invited_by').execute();
  await db.schema.createIndex('invitations_accepted_by_idx').on('invitations').column('accepted_by').execute();

  // Who did what to whom, for admin actions (suspend, restore, grant, revoke).
  await db.schema
    .createTable('audit_events')
    .addColumn('id', 'bigint', (c) => c.primaryKey().generatedAlwaysAsIdentity())
    .addColumn('actor_id', 'bigint', (c) => c.references('users.id').onDelete('set null'))
    .addColumn('action', 'text', (c) => c.notNull())
    .addColumn('subject_user_id', 'bigint', (c) => c.references('users.id').onDelete('set null'))
    .addColumn('details', 'jsonb', (c) => c.notNull().defaultTo(sql`'{}'::jsonb`))
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
  await db.schema.createIndex('audit_events_actor_id_idx').on('audit_events').column('actor_id').execute();
  await db.schema.createIndex('audit_events_subject_user_id_idx').on('audit_events').column('subject_user_id').execute();

  // rate-limiter-flexible's PostgreSQL store, shared by every server process.
  await db.schema
    .createTable('rate_limits')
    .addColumn('key', 'varchar(255)', (c) => c.primaryKey())
    .addColumn('points', 'integer', (c) => c.notNull().defaultTo(0))
    .addColumn('expire', 'bigint')
    .execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  for (const t of [
    'rate_limits',
    'audit_events',
    'invitations',
    'sign_in_tokens',
    'sponsor_members',
    'build_members',
    'sessions',
    'identities',
  ]) {
    await db.schema.dropTable(t).execute();
  }
  await db.schema.alterTable('users').dropColumn('notice_email').dropColumn('suspended_at').dropColumn('deleted_at').execute();
}
