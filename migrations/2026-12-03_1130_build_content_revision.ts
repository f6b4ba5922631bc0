import { sql, type Kysely } from 'kysely';

// `builds.content_revision` goes up, in the same transaction, whenever anything a reader sees of one
// of the build's episodes changes: the build, its episodes, chapters, systems, open items, part
// lines, figures, pictures and their media, sponsorships, and the owner's or a sponsor's name. The
// episode read is cached per (episode, revision) (server/services/reading-cache.ts): a reader who
// sees the new revision also sees the new content, since both commit together.
//
// Statement-level triggers with transition tables: a statement that writes 150 part lines bumps
// the build once, not 150 times. PostgreSQL allows transition tables on single-event triggers only,
// hence one trigger per table and event.

/** Tables with a `build_id` column, and tables linked through `episode_id`. */
const BY_BUILD = ['episodes', 'part_lines', 'open_items', 'build_systems', 'sponsorships', 'media'] as const;
const BY_EPISODE = ['chapters', 'figures', 'episode_gallery'] as const;
const EVENTS = [
  ['insert', 'new table as new_rows'],
  ['update', 'old table as old_rows new table as new_rows'],
  ['delete', 'old table as old_rows'],
] as const;

const triggerName = (table: string, event: string) => `${table}_content_revision_${event}`;

export async function up(db: Kysely<any>): Promise<void> {
  await sql`alter table builds add column content_revision bigint not null default 0`.execute(db);

  // A change to the build row itself: bump unless the statement is the bump.
  await sql`
    create function builds_content_revision_bump() returns trigger language plpgsql as $$
    begin
      if new.content_revision = old.content_revision then
        new.content_revision := old.content_revision + 1;
      end if;
      return new;
    end $$`.execute(db);
  await sql`create trigger builds_content_revision before update on builds for each row execute function builds_content_revision_bump()`.execute(
    db,
  );

  // The rows' build ids, from whichever transition tables this event has.
  await sql`
    create function content_revision_by_build() returns trigger language plpgsql as $$
    begin
      if tg_op in ('INSERT', 'UPDATE') then
        update builds set content_revision = content_revision + 1 where id in (select build_id from new_rows);
      end if;
      if tg_op in ('UPDATE', 'DELETE') then
        update builds set content_revision = content_revision + 1 where id in (select build_id from old_rows);
      end if;
      -- A sponsor's logo has no build: the builds it is shown on are those the sponsor supports.
      -- (A new file is no one's logo yet; a deleted one leaves the sponsor's row, whose trigger fires.)
      if tg_table_name = 'media' and tg_op = 'UPDATE' then
        update builds set content_revision = content_revision + 1
         where id in (select pl.build_id from part_lines pl join sponsors s on s.id = pl.sponsor_id
                       where s.logo_media_id in (select id from new_rows)
                      union
                      select sp.build_id from sponsorships sp join sponsors s on s.id = sp.sponsor_id
                       where s.logo_media_id in (select id from new_rows));
      end if;
      return null;
    end $$`.execute(db);

  await sql`
    create function content_revision_by_episode() returns trigger language plpgsql as $$
    begin
      if tg_op in ('INSERT', 'UPDATE') then
        update builds set content_revision = content_revision + 1
         where id in (select e.build_id from episodes e where e.id in (select episode_id from new_rows));
      end if;
      if tg_op in ('UPDATE', 'DELETE') then
        update builds set content_revision = content_revision + 1
         where id in (select e.build_id from episodes e where e.id in (select episode_id from old_rows));
      end if;
      return null;
    end $$`.execute(db);

  // The owner's handle and name are on every episode page; a sponsor's name and logo beside the disclosure.
  await sql`
    create function content_revision_by_user() returns trigger language plpgsql as $$
    begin
      update builds set content_revision = content_revision + 1 where owner_id in (select id from new_rows);
      return null;
    end $$`.execute(db);
  await sql`
    create function content_revision_by_sponsor() returns trigger language plpgsql as $$
    begin
      update builds set content_revision = content_revision + 1
       where id in (select pl.build_id from part_lines pl where pl.sponsor_id in (select id from new_rows)
                    union
                    select sp.build_id from sponsorships sp where sp.sponsor_id in (select id from new_rows));
      return null;
    end $$`.execute(db);

  for (const table of BY_BUILD) {
    for (const [event, referencing] of EVENTS) {
      await sql
        .raw(
          `create trigger ${triggerName(table, event)} after ${event} on ${table} referencing ${referencing} for each statement execute function content_revision_by_build()`,
        )
        .execute(db);
    }
  }
  for (const table of BY_EPISODE) {
    for (const [event, referencing] of EVENTS) {
      await sql
        .raw(
          `create trigger ${triggerName(table, event)} after ${event} on ${table} referencing ${referencing} for each statement execute function content_revision_by_episode()`,
        )
        .execute(db);
    }
  }
  // Inserting or deleting a user or sponsor changes no page by itself (rows that refer to it do).
  await sql`create trigger users_content_revision_update after update on users referencing new table as new_rows for each statement execute function content_revision_by_user()`.execute(
    db,
  );
  await sql`create trigger sponsors_content_revision_update after update on sponsors referencing new table as new_rows for each statement execute function content_revision_by_sponsor()`.execute(
    db,
  );
}

export async function down(db: Kysely<any>): Promise<void> {
  for (const table of [...BY_BUILD, ...BY_EPISODE])
    for (const [event] of EVENTS) await sql.raw(`drop trigger ${triggerName(table, event)} on ${table}`).execute(db);
  await sql`drop trigger users_content_revision_update on users`.execute(db);
  await sql`drop trigger sponsors_content_revision_update on sponsors`.execute(db);
  await sql`drop trigger builds_content_revision on builds`.execute(db);
  for (const fn of [
    'builds_content_revision_bump',
    'content_revision_by_build',
    'content_revision_by_episode',
    'content_revision_by_user',
    'content_revision_by_sponsor',
  ])
    await sql.raw(`drop function ${fn}()`).execute(db);
  await sql`alter table builds drop column content_revision`.execute(db);
}
