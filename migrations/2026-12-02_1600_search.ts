import { sql, type Kysely } from 'kysely';

// Full-text search over published work: a generated tsvector per build and per episode, each with a
// GIN index. An episode's vector also covers its write-up's plain text and its chapter titles, kept
// in columns of the row by triggers so every writer (editor, seed, tests) keeps them current.
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .alterTable('episodes')
    .addColumn('write_up_text', 'text', (c) => c.notNull().defaultTo(''))
    .addColumn('chapter_titles', 'text', (c) => c.notNull().defaultTo(''))
    .execute();

  await sql`
    create function episodes_write_up_text() returns trigger language plpgsql as $$
    begin
      new.write_up_text := coalesce(
        (select string_agg(t #>> '{}', ' ') from jsonb_path_query(new.write_up, 'strict $.** ? (@.type == "text").text') t),
        '');
      return new;
    end $$`.execute(db);
  await sql`create trigger episodes_write_up_text before insert or update of write_up on episodes
    for each row execute function episodes_write_up_text()`.execute(db);

  // One statement-level trigger per event (transition tables allow one event each).
  await sql`
    create function chapters_to_episode_titles() returns trigger language plpgsql as $$
    begin
      update episodes e
         set chapter_titles = coalesce((select string_agg(c.title, ' ' order by c.position) from chapters c where c.episode_id = e.id), '')
       where e.id in (select episode_id from changed_chapters);
      return null;
    end $$`.execute(db);
  for (const [event, table] of [
    ['insert', 'new'],
    ['update', 'new'],
    ['delete', 'old'],
  ] as const) {
    await sql
      .raw(
        `create trigger chapters_titles_${event} after ${event} on chapters referencing ${table} table as changed_chapters
         for each statement execute function chapters_to_episode_titles()`,
      )
      .execute(db);
  }

  await sql`update episodes set write_up = write_up`.execute(db);
  await sql`update episodes e set chapter_titles = coalesce((select string_agg(c.title, ' ' order by c.position) from chapters c where c.episode_id = e.id), '')`.execute(
    db,
  );

  await sql`alter table episodes add column search_vector tsvector generated always as (
      setweight(to_tsvector('english', coalesce(title, '')), 'A') ||
      setweight(to_tsvector('english', coalesce(summary, '')), 'B') ||
      setweight(to_tsvector('english', chapter_titles), 'B') ||
      setweight(to_tsvector('english', write_up_text), 'C')
    ) stored`.execute(db);
  await sql`create index episodes_search_idx on episodes using gin (search_vector)`.execute(db);

  await sql`alter table builds add column search_vector tsvector generated always as (
      setweight(to_tsvector('english', coalesce(title, '')), 'A') ||
      setweight(to_tsvector('english', coalesce(vehicle_make, '') || ' ' || coalesce(vehicle_model, '') || ' ' || coalesce(vehicle_year, '')), 'A') ||
      setweight(to_tsvector('english', coalesce(summary, '')), 'B')
    ) stored`.execute(db);
  await sql`create index builds_search_idx on builds using gin (search_vector)`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`alter table builds drop column search_vector`.execute(db);
  await sql`alter table episodes drop column search_vector`.execute(db);
  for (const event of ['insert', 'update', 'delete']) await sql.raw(`drop trigger chapters_titles_${event} on chapters`).execute(db);
  await sql`drop function chapters_to_episode_titles()`.execute(db);
  await sql`drop trigger episodes_write_up_text on episodes`.execute(db);
  await sql`drop function episodes_write_up_text()`.execute(db);
  await db.schema.alterTable('episodes').dropColumn('write_up_text').dropColumn('chapter_titles').execute();
}
