import { sql, type RawBuilder } from 'kysely';
import type { SponsorRefRow } from '../presenters/sponsors';
import type { Db } from './kysely';

/** What an episode's disclosure is worked out from, as one JSON value (see `disclosureFactsSql`). */
export interface DisclosureFacts {
  status: 'draft' | 'scheduled' | 'published';
  published_at: string | null;
  publish_at: string | null;
  /** Supported lines grouped by sponsor and kind (a kind without a sponsor is kept, for the publish check). */
  groups: Array<{ sponsor_id: number | null; kind: string; lines: number }>;
  /** Lines with an affiliate link. */
  affiliate: number;
  /** The build's paid sponsorships, dates as YYYY-MM-DD. */
  paid: Array<{ sponsor_id: number; starts_on: string; ends_on: string | null }>;
  /** Every sponsor named above, with its logo's media columns. */
  sponsors: SponsorRefRow[];
}

/**
 * The disclosure facts of the episode aliased `e` in the surrounding query, as a JSON value built
 * in PostgreSQL — so the episode read stays one round trip, and a single episode costs one query.
 */
export function disclosureFactsSql(): RawBuilder<DisclosureFacts> {
  return sql<DisclosureFacts>`json_build_object(
    'status', e.status,
    'published_at', e.published_at,
    'publish_at', e.publish_at,
    'groups', coalesce((
      select json_agg(json_build_object('sponsor_id', g.sponsor_id, 'kind', g.support_kind, 'lines', g.lines) order by g.sponsor_id, g.support_kind)
      from (
        select pl.sponsor_id, pl.support_kind, count(*)::int as lines
        from part_lines pl
        where pl.episode_id = e.id and pl.support_kind is not null
        group by pl.sponsor_id, pl.support_kind
      ) g), '[]'::json),
    'affiliate', (
      select count(*)::int from part_lines pl
      where pl.episode_id = e.id and pl.affiliate and pl.buy_url is not null),
    'paid', coalesce((
      select json_agg(json_build_object('sponsor_id', s.sponsor_id, 'starts_on', s.starts_on, 'ends_on', s.ends_on) order by s.id)
      from sponsorships s
      where s.build_id = e.build_id and s.kind = 'paid'), '[]'::json),
    'sponsors', coalesce((
      select json_agg(json_build_object(
        'id', sp.id, 'slug', sp.slug, 'name', sp.name, 'website', sp.website,
        'logo_id', lm.id, 'logo_sha256', lm.sha256, 'logo_object_key', lm.object_key, 'logo_variants', lm.variants))
      from sponsors sp
      left join media lm on lm.id = sp.logo_media_id
      where sp.id in (
        select pl.sponsor_id from part_lines pl
        where pl.episode_id = e.id and pl.support_kind is not null and pl.sponsor_id is not null
        union
        select s.sponsor_id from sponsorships s where s.build_id = e.build_id and s.kind = 'paid')), '[]'::json)
  )`;
}

/** One episode's disclosure facts in one query, or undefined when there is no such episode. */
export async function findDisclosureFacts(db: Db, episodeId: number): Promise<DisclosureFacts | undefined> {
  const row = await db
    .selectFrom('episodes as e')
    .select(disclosureFactsSql().as('facts'))
    .where('e.id', '=', episodeId)
    .executeTakeFirst();
  return row?.facts;
}
