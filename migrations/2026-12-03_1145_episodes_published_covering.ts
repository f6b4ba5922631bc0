import { sql, type Kysely } from 'kysely';

// Counting the published episodes of public builds (the front page's "N episodes", a creator's
// page) read the whole episodes heap: write-ups make the rows wide, and the published index had no
// build id, so PostgreSQL chose a sequential scan — 32 ms per front page on the bench dataset
// (20,000 episodes; EXPLAIN ANALYZE). With the build id and deletion time in the index, the count is
// an index-only scan. Same leading columns and predicate as before, so the newest-first listing
// keeps using it.
export async function up(db: Kysely<any>): Promise<void> {
  await sql`
    create index episodes_published_cover_idx on episodes (published_at desc, id desc)
      include (build_id, deleted_at) where status = 'published'`.execute(db);
  await sql`drop index episodes_published_idx`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`create index episodes_published_idx on episodes (published_at desc, id desc) where status = 'published'`.execute(db);
  await sql`drop index episodes_published_cover_idx`.execute(db);
}
