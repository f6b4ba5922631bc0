import { sql, type Kysely } from 'kysely';

export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('builds')
    .addColumn('id', 'bigint', (c) => c.primaryKey().generatedAlwaysAsIdentity())
    .addColumn('owner_id', 'bigint', (c) => c.notNull().references('users.id').onDelete('restrict'))
    .addColumn('slug', 'text', (c) => c.notNull())
    .addColumn('title', 'text', (c) => c.notNull())
    .addColumn('visibility', 'text', (c) => c.notNull().defaultTo('private'))
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('updated_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addCheckConstraint('builds_visibility_check', sql`visibility in ('public', 'unlisted', 'private')`)
    .addUniqueConstraint('builds_owner_slug_key', ['owner_id', 'slug'])
    .execute();

  await db.schema
    .createTable('episodes')
    .addColumn('id', 'bigint', (c) => c.primaryKey().generatedAlwaysAsIdentity())
    .addColumn('build_id', 'bigint', (c) => c.notNull().references('builds.id').onDelete('cascade'))
    .addColumn('number', 'integer', (c) => c.notNull().check(sql`number > 0`))
    .addColumn('slug', 'text', (c) => c.notNull())
    .addColumn('title', 'text', (c) => c.notNull())
    .addColumn('summary', 'text')
    .addColumn('status', 'text', (c) => c.notNull().defaultTo('draft'))
    .addColumn('published_at', 'timestamptz')
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('updated_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addCheckConstraint('episodes_status_check', sql`status in ('draft', 'scheduled', 'published')`)
    .addCheckConstraint('episodes_published_at_check', sql`status = 'draft' or published_at is not null`)
    .addUniqueConstraint('episodes_build_slug_key', ['build_id', 'slug'])
    .addUniqueConstraint('episodes_build_number_key', ['build_id', 'number'])
    .execute();
  // The front page lists the newest published episodes first.
  await sql`create index episodes_published_idx on episodes (published_at desc, id desc) where status = 'published'`.execute(db);

  await db.schema
    .createTable('sponsors')
    .addColumn('id', 'bigint', (c) => c.primaryKey().generatedAlwaysAsIdentity())
    .addColumn('slug', 'text', (c) => c.notNull().unique())
    .addColumn('name', 'text', (c) => c.notNull())
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('updated_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('sponsors').execute();
  await db.schema.dropTable('episodes').execute();
  await db.schema.dropTable('builds').execute();
}
