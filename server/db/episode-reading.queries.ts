import { sql, type Selectable } from 'kysely';
import { jsonArrayFrom, jsonObjectFrom } from 'kysely/helpers/postgres';
import type { MediaTable } from './database';
import type { Db } from './kysely';
import { disclosureFactsSql } from './disclosure.queries';
import { compiledById } from './prepared';
import { isPublishedEpisode } from './reading.queries';

type MediaRow = Selectable<MediaTable>;

/** A media row as JSON aggregation returns it: `created_at` arrives as a string. */
type MediaJson = Omit<MediaRow, 'created_at'> & { created_at: string };

/** JSON numbers and strings back to the row shape the media presenter takes. */
export const mediaFromJson = (m: MediaJson): MediaRow => ({ ...m, created_at: new Date(m.created_at) });

/**
 * Everything the episode page shows, in ONE SQL round trip: the episode with its build and owner,
 * and as JSON (aggregated in PostgreSQL) its chapters, the build's systems, the published
 * neighbours, open items opened and closed here, the systems its part lines and figures touch,
 * its cover and gallery, and the facts its disclosure is worked out from. The cost stays one query whatever the episode's size.
 */
export function selectEpisodeReading(db: Db, episodeId: number) {
  return db
    .selectFrom('episodes as e')
    .innerJoin('builds as b', 'b.id', 'e.build_id')
    .innerJoin('users as u', 'u.id', 'b.owner_id')
    .select([
      'e.id',
      'e.build_id',
      'e.number',
      'e.slug',
      'e.title',
      'e.summary',
      'e.status',
      'e.published_at',
      'e.updated_at',
      'e.video_url',
      'e.duration_seconds',
      'e.minutes_worked',
      'e.raised_vehicle',
      'e.write_up_html',
      'b.slug as build_slug',
      'b.title as build_title',
      'b.visibility',
      'b.vehicle_kind',
      'b.vehicle_make',
      'b.vehicle_model',
      'b.vehicle_year',
      'b.video_link_pattern',
      'u.handle',
      'u.display_name',
    ])
    .select((eb) => [
      jsonArrayFrom(
        eb
          .selectFrom('chapters as c')
          .select(['c.id', 'c.start_seconds', 'c.title', 'c.system_key', 'c.notes'])
          .whereRef('c.episode_id', '=', 'e.id')
          .orderBy('c.position'),
      ).as('chapters'),
      jsonArrayFrom(
        eb
          .selectFrom('build_systems as s')
          .select(['s.key', 's.name', 's.safety_critical'])
          .whereRef('s.build_id', '=', 'e.build_id')
          .orderBy('s.position'),
      ).as('systems'),
      jsonObjectFrom(
        eb
          .selectFrom('episodes as p')
          .select(['p.id', 'p.number', 'p.slug', 'p.title'])
          .whereRef('p.build_id', '=', 'e.build_id')
          .whereRef('p.number', '<', 'e.number')
          .where('p.status', '=', 'published')
          .where('p.published_at', '<=', sql<Date>`now()`)
          .where('p.deleted_at', 'is', null)
          .orderBy('p.number', 'desc')
          .limit(1),
      ).as('previous'),
      jsonObjectFrom(
        eb
          .selectFrom('episodes as n')
          .select(['n.id', 'n.number', 'n.slug', 'n.title'])
          .whereRef('n.build_id', '=', 'e.build_id')
          .whereRef('n.number', '>', 'e.number')
          .where('n.status', '=', 'published')
          .where('n.published_at', '<=', sql<Date>`now()`)
          .where('n.deleted_at', 'is', null)
          .orderBy('n.number', 'asc')
          .limit(1),
      ).as('next'),
      // Closed for readers only when the closing episode is itself published, its time come, not in the trash.
      jsonArrayFrom(
        eb
          .selectFrom('open_items as o')
          .leftJoin('episodes as ce', 'ce.id', 'o.closed_in_episode_id')
          .select([
            'o.id',
            'o.title',
            'o.note',
            sql<boolean>`coalesce(ce.status = 'published' and ce.deleted_at is null and ce.published_at <= now(), false)`.as('closed'),
          ])
          .whereRef('o.opened_in_episode_id', '=', 'e.id')
          .orderBy('o.id'),
      ).as('opened'),
      jsonArrayFrom(
        eb
          .selectFrom('open_items as o')
          .innerJoin('episodes as e', 'e.id', 'o.opened_in_episode_id')
          .select(['o.id', 'o.title', 'e.id as episode_id', 'e.number', 'e.slug', 'e.title as episode_title'])
          .where('o.closed_in_episode_id', '=', episodeId)
          .where(isPublishedEpisode)
          .orderBy('o.id'),
      ).as('closed'),
      // The systems this episode's part lines and figures name (chapters' come with the chapters).
      sql<string[]>`array(
        select pl.system_key from part_lines pl where pl.episode_id = e.id and pl.system_key is not null
        union
        select f.system_key from figures f where f.episode_id = e.id and f.system_key is not null
      )`.as('other_system_keys'),
      jsonObjectFrom(eb.selectFrom('media as m').selectAll('m').whereRef('m.id', '=', 'e.cover_media_id')).as('cover'),
      jsonArrayFrom(
        eb
          .selectFrom('episode_gallery as g')
          .innerJoin('media as m', 'm.id', 'g.media_id')
          .selectAll('m')
          .whereRef('g.episode_id', '=', 'e.id')
          .orderBy('g.position'),
      ).as('gallery'),
      disclosureFactsSql().as('disclosure_facts'),
    ])
    .where('e.id', '=', episodeId);
}

// Built and compiled once, then run as a prepared statement (see `compiledById`).
const reading = compiledById(selectEpisodeReading);

/** The episode page's row; see `selectEpisodeReading`. */
export async function findEpisodeReading(db: Db, episodeId: number) {
  const row = (await reading(db, episodeId)).rows[0];
  if (!row) return null;
  return {
    ...row,
    cover: row.cover ? mediaFromJson(row.cover as unknown as MediaJson) : null,
    gallery: (row.gallery as unknown as MediaJson[]).map(mediaFromJson),
  };
}
