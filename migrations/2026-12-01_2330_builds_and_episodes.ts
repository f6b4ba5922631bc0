import { sql, type Kysely } from 'kysely';

export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .alterTable('builds')
    .addColumn('vehicle_kind', 'text', (c) => c.notNull().defaultTo('car'))
    .addColumn('vehicle_make', 'text')
    .addColumn('vehicle_model', 'text')
    .addColumn('vehicle_year', 'text')
    .addColumn('summary', 'text')
    .addColumn('currency', sql`char(3)`, (c) => c.notNull().defaultTo('EUR'))
    .addColumn('budget_minor', 'bigint', (c) => c.check(sql`budget_minor >= 0`))
    .addColumn('video_link_pattern', 'text', (c) => c.notNull().defaultTo('t={seconds}'))
    .addColumn('pending_transfer_to', 'bigint', (c) => c.references('users.id').onDelete('set null'))
    .addColumn('deleted_at', 'timestamptz')
    .execute();
  await sql`alter table builds add constraint builds_vehicle_kind_check check (vehicle_kind in ('car', 'motorcycle', 'tractor', 'boat', 'other'))`.execute(
    db,
  );
  await db.schema.createIndex('builds_pending_transfer_to_idx').on('builds').column('pending_transfer_to').execute();

  await db.schema
    .createTable('build_systems')
    .addColumn('id', 'bigint', (c) => c.primaryKey().generatedAlwaysAsIdentity())
    .addColumn('build_id', 'bigint', (c) => c.notNull().references('builds.id').onDelete('cascade'))
    .addColumn('key', 'text', (c) => c.notNull())
    .addColumn('name', 'text', (c) => c.notNull())
    .addColumn('safety_critical', 'boolean', (c) => c.notNull().defaultTo(false))
    .addColumn('position', 'integer', (c) => c.notNull())
    .addUniqueConstraint('build_systems_build_key_key', ['build_id', 'key'])
    .execute();

  // Earlier slugs keep working: a renamed build or episode redirects from its old slug.
  await db.schema
    .createTable('build_slugs')
    .addColumn('id', 'bigint', (c) => c.primaryKey().generatedAlwaysAsIdentity())
    .addColumn('build_id', 'bigint', (c) => c.notNull().references('builds.id').onDelete('cascade'))
    .addColumn('owner_id', 'bigint', (c) => c.notNull().references('users.id').onDelete('cascade'))
    .addColumn('slug', 'text', (c) => c.notNull())
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addUniqueConstraint('build_slugs_owner_slug_key', ['owner_id', 'slug'])
    .execute();
  await db.schema.createIndex('build_slugs_build_id_idx').on('build_slugs').column('build_id').execute();

  await sql`alter table episodes drop constraint episodes_published_at_check`.execute(db);
  await db.schema
    .alterTable('episodes')
    .addColumn('write_up', 'jsonb', (c) => c.notNull().defaultTo(sql`'{"type":"doc","content":[{"type":"paragraph"}]}'::jsonb`))
    .addColumn('write_up_html', 'text', (c) => c.notNull().defaultTo(''))
    .addColumn('video_url', 'text')
    .addColumn('duration_seconds', 'integer', (c) => c.check(sql`duration_seconds > 0`))
    .addColumn('minutes_worked', 'integer', (c) => c.check(sql`minutes_worked >= 0`))
    .addColumn('raised_vehicle', 'boolean', (c) => c.notNull().defaultTo(false))
    .addColumn('publish_at', 'timestamptz')
    .addColumn('publish_error', 'text')
    .addColumn('version', 'integer', (c) => c.notNull().defaultTo(1))
    .addColumn('deleted_at', 'timestamptz')
    .execute();
  await sql`alter table episodes add constraint episodes_status_times_check check ((status <> 'published' or published_at is not null) and (status <> 'scheduled' or publish_at is not null))`.execute(
    db,
  );
  await sql`create index episodes_scheduled_idx on episodes (publish_at) where status = 'scheduled'`.execute(db);

  await db.schema
    .createTable('episode_slugs')
    .addColumn('id', 'bigint', (c) => c.primaryKey().generatedAlwaysAsIdentity())
    .addColumn('episode_id', 'bigint', (c) => c.notNull().references('episodes.id').onDelete('cascade'))
    .addColumn('build_id', 'bigint', (c) => c.notNull().references('builds.id').onDelete('cascade'))
    .addColumn('slug', 'text', (c) => c.notNull())
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addUniqueConstraint('episode_slugs_build_slug_key', ['build_id', 'slug'])
    .execute();
  await db.schema.createIndex('episode_slugs_episode_id_idx').on('episode_slugs').column('episode_id').execute();

  await db.schema
    .createTable('chapters')
    .addColumn('id', 'bigint', (c) => c.primaryKey().generatedAlwaysAsIdentity())
    .addColumn('episode_id', 'bigint', (c) => c.notNull().references('episodes.id').onDelete('cascade'))
    .addColumn('position', 'integer', (c) => c.notNull())
    .addColumn('start_seconds', 'integer', (c) => c.notNull().check(sql`start_seconds >= 0`))
    .addColumn('title', 'text', (c) => c.notNull())
    .addColumn('system_key', 'text')
    .addColumn('notes', 'text')
    .addUniqueConstraint('chapters_episode_position_key', ['episode_id', 'position'])
    .execute();

  await db.schema
    .createTable('open_items')
    .addColumn('id', 'bigint', (c) => c.primaryKey().generatedAlwaysAsIdentity())
    .addColumn('build_id', 'bigint', (c) => c.notNull().references('builds.id').onDelete('cascade'))
    .addColumn('title', 'text', (c) => c.notNull())
    .addColumn('note', 'text')
    .addColumn('opened_in_episode_id', 'bigint', (c) => c.notNull().references('episodes.id').onDelete('cascade'))
    .addColumn('closed_in_episode_id', 'bigint', (c) => c.references('episodes.id').onDelete('set null'))
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('updated_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
  await db.schema.createIndex('open_items_build_id_idx').on('open_items').column('build_id').execute();
  await db.schema.createIndex('open_items_opened_idx').on('open_items').column('opened_in_episode_id').execute();
  await db.schema.createIndex('open_items_closed_idx').on('open_items').column('closed_in_episode_id').execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  for (const t of ['open_items', 'chapters', 'episode_slugs', 'build_slugs', 'build_systems']) await db.schema.dropTable(t).execute();
  await sql`alter table episodes drop constraint episodes_status_times_check`.execute(db);
  await sql`drop index episodes_scheduled_idx`.execute(db);
  await db.schema
    .alterTable('episodes')
    .dropColumn('write_up')
    .dropColumn('write_up_html')
    .dropColumn('video_url')
    .dropColumn('duration_seconds')
    .dropColumn('minutes_worked')
    .dropColumn('raised_vehicle')
    .dropColumn('publish_at')
    .dropColumn('publish_error')
    .dropColumn('version')
    .dropColumn('deleted_at')
    .execute();
  await sql`alter table episodes add constraint episodes_published_at_check check (status = 'draft' or published_at is not null)`.execute(
    db,
  );
  await sql`alter table builds drop constraint builds_vehicle_kind_check`.execute(db);
  await db.schema
    .alterTable('builds')
    .dropColumn('vehicle_kind')
    .dropColumn('vehicle_make')
    .dropColumn('vehicle_model')
    .dropColumn('vehicle_year')
    .dropColumn('summary')
    .dropColumn('currency')
    .dropColumn('budget_minor')
    .dropColumn('video_link_pattern')
    .dropColumn('pending_transfer_to')
    .dropColumn('deleted_at')
    .execute();
}
