import type { Db } from './kysely';

/** Published episodes of public builds, newest first, with their build and creator. */
export async function listLatestEpisodes(db: Db, { limit, offset }: { limit: number; offset: number }) {
  const base = db
    .selectFrom('episodes as e')
    .innerJoin('builds as b', 'b.id', 'e.build_id')
    .innerJoin('users as u', 'u.id', 'b.owner_id')
    .where('e.status', '=', 'published')
    .where('e.published_at', '<=', new Date())
    .where('b.visibility', '=', 'public');
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
        'u.handle',
        'u.display_name',
      ])
      .orderBy('e.published_at', 'desc')
      .orderBy('e.id', 'desc')
      .limit(limit)
      .offset(offset)
      .execute(),
    base.select((eb) => eb.fn.countAll<number>().as('n')).executeTakeFirstOrThrow(),
  ]);
  return { rows, total: count.n };
}
