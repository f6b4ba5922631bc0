import { sql, type Kysely } from 'kysely';

// Sponsors (DESIGN.md "Sponsor", "Disclosure", "Money words"): organisation details and logo, the
// suppliers an organisation stands behind, sponsorships of builds, support on part lines (sponsor,
// kind, list price → value given), the creator's confirmation that the video discloses it too, and
// the sponsor-member notice kind.
export async function up(db: Kysely<any>): Promise<void> {
  await sql`
    alter table sponsors
      add column website text,
      add column logo_media_id bigint references media(id) on delete set null`.execute(db);
  await sql`create index sponsors_logo_media_id_idx on sponsors (logo_media_id)`.execute(db);

  // A supplier is backed by at most one organisation, so the suggestion on a part line is unambiguous.
  await sql`
    create table sponsor_suppliers (
      sponsor_id bigint not null references sponsors(id) on delete cascade,
      supplier_id bigint not null references suppliers(id) on delete cascade,
      created_at timestamptz not null default now(),
      primary key (sponsor_id, supplier_id),
      constraint sponsor_suppliers_supplier_key unique (supplier_id)
    )`.execute(db);

  await sql`
    create table sponsorships (
      id bigint generated always as identity primary key,
      build_id bigint not null references builds(id) on delete cascade,
      sponsor_id bigint not null references sponsors(id) on delete cascade,
      kind text not null check (kind in ('gifted', 'discounted', 'paid')),
      starts_on date not null,
      ends_on date,
      created_at timestamptz not null default now(),
      updated_at timestamptz not null default now(),
      constraint sponsorships_dates_check check (ends_on is null or ends_on >= starts_on)
    )`.execute(db);
  await sql`create index sponsorships_build_id_idx on sponsorships (build_id)`.execute(db);
  await sql`create index sponsorships_sponsor_id_idx on sponsorships (sponsor_id)`.execute(db);

  // Support on a line: both sponsor and kind, or neither once published (the publish check names the
  // line). list_price_minor is the unit price without support, in the line's currency; value given
  // is round(quantity × list price) − round(quantity × unit price), never below zero.
  await sql`
    alter table part_lines
      add column support_kind text check (support_kind in ('gifted', 'discounted', 'paid')),
      add column sponsor_id bigint references sponsors(id) on delete set null,
      add column list_price_minor bigint check (list_price_minor >= 0)`.execute(db);
  await sql`
    alter table part_lines
      add column value_given_minor bigint generated always as (
        case when support_kind is not null and list_price_minor is not null
          then greatest(round(quantity * list_price_minor) - round(quantity * unit_price_minor), 0)
          else 0 end) stored`.execute(db);
  // The sponsor summary reads a sponsor's lines by episode.
  await sql`create index part_lines_sponsor_episode_idx on part_lines (sponsor_id, episode_id) where sponsor_id is not null`.execute(db);

  await sql`alter table episodes add column video_disclosure_confirmed boolean not null default false`.execute(db);

  await sql`alter table notifications drop constraint notifications_kind_check`.execute(db);
  await sql`
    alter table notifications add constraint notifications_kind_check
      check (kind in ('new-episode', 'reply', 'state-change', 'new-post', 'sponsor-episode'))`.execute(db);
  await sql`create unique index notifications_sponsor_episode_key on notifications (user_id, episode_id) where kind = 'sponsor-episode'`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`drop index notifications_sponsor_episode_key`.execute(db);
  await sql`delete from notifications where kind = 'sponsor-episode'`.execute(db);
  await sql`alter table notifications drop constraint notifications_kind_check`.execute(db);
  await sql`
    alter table notifications add constraint notifications_kind_check
      check (kind in ('new-episode', 'reply', 'state-change', 'new-post'))`.execute(db);
  await sql`alter table episodes drop column video_disclosure_confirmed`.execute(db);
  await sql`alter table part_lines drop column value_given_minor, drop column list_price_minor, drop column sponsor_id, drop column support_kind`.execute(db);
  await sql`drop table sponsorships`.execute(db);
  await sql`drop table sponsor_suppliers`.execute(db);
  await sql`alter table sponsors drop column logo_media_id, drop column website`.execute(db);
}
