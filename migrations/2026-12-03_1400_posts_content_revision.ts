import { sql, type Kysely } from 'kysely';

// Followers' posts join the build's `content_revision` (see 2026-12-03_1130): the episode page's
// answer, which carries the posts, is then cached per revision like the episode read, and so is the
// server-rendered page built from it. A post written, edited, answered, adopted, hidden or deleted
// bumps its build; so does a change to a post author's name or handle, which every post shows.
// The page's parts list and the build's totals name suppliers: renaming one bumps the builds that
// bought from it.

const EVENTS = [
  ['insert', 'new table as new_rows'],
  ['update', 'old table as old_rows new table as new_rows'],
  ['delete', 'old table as old_rows'],
] as const;

export async function up(db: Kysely<any>): Promise<void> {
  for (const [event, referencing] of EVENTS)
    await sql
      .raw(
        `create trigger posts_content_revision_${event} after ${event} on posts referencing ${referencing} for each statement execute function content_revision_by_build()`,
      )
      .execute(db);
  await sql`
    create or replace function content_revision_by_user() returns trigger language plpgsql as $$
    begin
      update builds set content_revision = content_revision + 1
       where owner_id in (select id from new_rows)
          or id in (select p.build_id from posts p where p.author_id in (select id from new_rows));
      return null;
    end $$`.execute(db);
  await sql`
    create function content_revision_by_supplier() returns trigger language plpgsql as $$
    begin
      update builds set content_revision = content_revision + 1
       where id in (select pl.build_id from part_lines pl where pl.supplier_id in (select id from new_rows));
      return null;
    end $$`.execute(db);
  await sql`create trigger suppliers_content_revision_update after update on suppliers referencing new table as new_rows for each statement execute function content_revision_by_supplier()`.execute(
    db,
  );
}

export async function down(db: Kysely<any>): Promise<void> {
  for (const [event] of EVENTS) await sql.raw(`drop trigger posts_content_revision_${event} on posts`).execute(db);
  await sql`drop trigger suppliers_content_revision_update on suppliers`.execute(db);
  await sql`drop function content_revision_by_supplier()`.execute(db);
  await sql`
    create or replace function content_revision_by_user() returns trigger language plpgsql as $$
    begin
      update builds set content_revision = content_revision + 1 where owner_id in (select id from new_rows);
      return null;
    end $$`.execute(db);
}
