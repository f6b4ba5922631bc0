import { sql, type Kysely } from 'kysely';

// Media: photos, receipts and (for the sponsors issue) logos stored in S3 under content-derived keys.
// An object is written before its row; rows point at their objects, never the other way round.
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('media')
    .addColumn('id', 'bigint', (c) => c.primaryKey().generatedAlwaysAsIdentity())
    .addColumn('build_id', 'bigint', (c) => c.references('builds.id').onDelete('cascade'))
    .addColumn('sponsor_id', 'bigint', (c) => c.references('sponsors.id').onDelete('cascade'))
    .addColumn('kind', 'text', (c) => c.notNull().check(sql`kind in ('photo', 'receipt', 'logo')`))
    .addColumn('sha256', sql`char(64)`, (c) => c.notNull())
    .addColumn('object_key', 'text', (c) => c.notNull())
    .addColumn('content_type', 'text', (c) => c.notNull())
    .addColumn('size_bytes', 'bigint', (c) => c.notNull())
    .addColumn('width', 'integer')
    .addColumn('height', 'integer')
    .addColumn('alt_text', 'text')
    .addColumn('placeholder', 'text')
    .addColumn('status', 'text', (c) => c.notNull().defaultTo('ready').check(sql`status in ('processing', 'ready', 'failed')`))
    .addColumn('variants', 'jsonb', (c) => c.notNull().defaultTo(sql`'[]'::jsonb`))
    .addColumn('created_by', 'bigint', (c) => c.references('users.id').onDelete('set null'))
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addCheckConstraint('media_one_owner', sql`(build_id is null) <> (sponsor_id is null)`)
    .execute();
  // The same bytes under the same owner are stored once.
  await sql`create unique index media_build_sha_key on media (build_id, kind, sha256) where build_id is not null`.execute(db);
  await sql`create unique index media_sponsor_sha_key on media (sponsor_id, kind, sha256) where sponsor_id is not null`.execute(db);
  await db.schema.createIndex('media_sponsor_id_idx').on('media').column('sponsor_id').execute();
  await db.schema.createIndex('media_created_by_idx').on('media').column('created_by').execute();
  await db.schema.createIndex('media_object_key_idx').on('media').column('object_key').execute();

  await db.schema
    .alterTable('part_lines')
    .addColumn('receipt_media_id', 'bigint', (c) => c.references('media.id').onDelete('set null'))
    .execute();
  await db.schema.createIndex('part_lines_receipt_idx').on('part_lines').column('receipt_media_id').execute();
  await db.schema
    .alterTable('builds')
    .addColumn('cover_media_id', 'bigint', (c) => c.references('media.id').onDelete('set null'))
    .execute();
  await db.schema.createIndex('builds_cover_idx').on('builds').column('cover_media_id').execute();
  await db.schema
    .alterTable('episodes')
    .addColumn('cover_media_id', 'bigint', (c) => c.references('media.id').onDelete('set null'))
    .execute();
  await db.schema.createIndex('episodes_cover_idx').on('episodes').column('cover_media_id').execute();

  await db.schema
    .createTable('episode_gallery')
    .addColumn('id', 'bigint', (c) => c.primaryKey().generatedAlwaysAsIdentity())
    .addColumn('episode_id', 'bigint', (c) => c.notNull().references('episodes.id').onDelete('cascade'))
    .addColumn('media_id', 'bigint', (c) => c.notNull().references('media.id').onDelete('cascade'))
    .addColumn('position', 'integer', (c) => c.notNull())
    .addUniqueConstraint('episode_gallery_episode_media_key', ['episode_id', 'media_id'])
    .execute();
  await db.schema.createIndex('episode_gallery_media_idx').on('episode_gallery').column('media_id').execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('episode_gallery').execute();
  await db.schema.alterTable('episodes').dropColumn('cover_media_id').execute();
  await db.schema.alterTable('builds').dropColumn('cover_media_id').execute();
  await db.schema.alterTable('part_lines').dropColumn('receipt_media_id').execute();
  await db.schema.dropTable('media').execute();
}
