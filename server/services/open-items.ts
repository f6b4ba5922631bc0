import { sql } from 'kysely';
import type { OpenItem } from '../../src/shared/schemas/episodes';
import type { Db } from '../db/kysely';

function base(db: Db) {
  return db
    .selectFrom('open_items as o')
    .innerJoin('episodes as oe', 'oe.id', 'o.opened_in_episode_id')
    .leftJoin('episodes as ce', 'ce.id', 'o.closed_in_episode_id')
    .select([
      'o.id',
      'o.build_id',
      'o.title',
      'o.note',
      'oe.id as opened_id',
      'oe.number as opened_number',
      'oe.title as opened_title',
      'ce.id as closed_id',
      'ce.number as closed_number',
      'ce.title as closed_title',
    ]);
}

type Row = Awaited<ReturnType<ReturnType<typeof base>['executeTakeFirstOrThrow']>>;

function present(r: Row): OpenItem {
  return {
    id: r.id,
    buildId: r.build_id,
    title: r.title,
    note: r.note,
    openedIn: { episodeId: r.opened_id, number: r.opened_number, title: r.opened_title },
    closedIn: r.closed_id !== null ? { episodeId: r.closed_id, number: r.closed_number!, title: r.closed_title! } : null,
  };
}

/**
 * What the editor of an episode shows: items opened in an earlier episode and still open when this
 * one starts (or closed in this one), plus the items opened in this episode.
 */
export async function openItemsForEpisode(db: Db, buildId: number, episodeId: number | undefined): Promise<OpenItem[]> {
  let q = base(db).where('o.build_id', '=', buildId);
  if (episodeId !== undefined) {
    const ep = await db
      .selectFrom('episodes')
      .select('number')
      .where('id', '=', episodeId)
      .where('build_id', '=', buildId)
      .executeTakeFirst();
    if (!ep) return [];
    q = q.where((eb) =>
      eb.or([
        eb('o.opened_in_episode_id', '=', episodeId),
        eb.and([
          eb('oe.number', '<', ep.number),
          eb.or([eb('o.closed_in_episode_id', 'is', null), eb('o.closed_in_episode_id', '=', episodeId), eb('ce.number', '>=', ep.number)]),
        ]),
      ]),
    );
  } else {
    q = q.where('o.closed_in_episode_id', 'is', null);
  }
  return (await q.orderBy('oe.number').orderBy('o.id').execute()).map(present);
}

export async function getOpenItem(db: Db, id: number): Promise<OpenItem | null> {
  const r = await base(db).where('o.id', '=', id).executeTakeFirst();
  return r ? present(r) : null;
}

export async function createOpenItem(
  db: Db,
  buildId: number,
  input: { title: string; note?: string | null; openedInEpisodeId: number },
): Promise<number> {
  const r = await db
    .insertInto('open_items')
    .values({ build_id: buildId, title: input.title, note: input.note ?? null, opened_in_episode_id: input.openedInEpisodeId })
    .returning('id')
    .executeTakeFirstOrThrow();
  return r.id;
}

export async function updateOpenItem(
  db: Db,
  id: number,
  input: { title?: string; note?: string | null; closedInEpisodeId?: number | null },
): Promise<void> {
  await db
    .updateTable('open_items')
    .set({
      ...(input.title !== undefined ? { title: input.title } : {}),
      ...(input.note !== undefined ? { note: input.note } : {}),
      ...(input.closedInEpisodeId !== undefined ? { closed_in_episode_id: input.closedInEpisodeId } : {}),
      updated_at: sql<Date>`now()`,
    })
    .where('id', '=', id)
    .execute();
}
