import { sql } from 'kysely';
import type { Db } from './kysely';
import { isPublishedEpisode } from './reading.queries';

/** Published episodes of public builds, newest first, with their build and creator (optionally one creator's). */
export async function listLatestEpisodes(db: Db, { limit, offset, ownerId }: { limit: number; offset: number; ownerId?: number }) {
  let base = db
    .selectFrom('episodes as e')
    .innerJoin('builds as b', 'b.id', 'e.build_id')
    .innerJoin('users as u', 'u.id', 'b.owner_id')
    .where(isPublishedEpisode)
    .where('b.visibility', '=', 'public')
    .where('b.deleted_at', 'is', null);
  if (ownerId !== undefined) base = base.where('b.owner_id', '=', ownerId);
  const [rows, count] = await Promise.all([
    base
      .select([
        'e.id',
        'e.number',
        'e.slug',
        'e.title',
        'e.summary',
        'e.published_at',
        'b.id as build_id',
        'b.slug as build_slug',
        'b.title as build_title',
        'b.vehicle_kind',
        'b.vehicle_make',
        'b.vehicle_model',
        'b.vehicle_year',
        'u.handle',
        'u.display_name',
        // The cover: the episode's chosen one, else the first picture of its write-up.
        sql<
          string | null
        >`(select m.id || '/' || m.sha256 || '|' || coalesce(m.variants -> 1 ->> 'key', m.variants -> 0 ->> 'key', m.object_key)
            from media m
           where m.id = coalesce(e.cover_media_id,
                   (jsonb_path_query_first(e.write_up, 'strict $.** ? (@.type == "mediaImage").attrs.mediaId'))::text::bigint)
             and m.kind = 'photo' and m.build_id = e.build_id)`.as('cover'),
      ])
      .orderBy('e.published_at', 'desc')
      .orderBy('e.id', 'desc')
      .limit(limit)
      .offset(offset)
      .execute(),
    base.select(sql<number>`count(*)::int`.as('n')).executeTakeFirstOrThrow(),
  ]);
  return { rows, total: count.n };
}
