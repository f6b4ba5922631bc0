import { sql, type ExpressionBuilder, type SqlBool, type Expression } from 'kysely';
import type { BuildDirectoryQuery } from '../../src/shared/schemas/reading';
import type { Database } from './database';
import type { Db } from './kysely';

/** An episode readers may see: published, its time come, not in the trash. */
export function isPublishedEpisode(eb: ExpressionBuilder<Database & { e: Database['episodes'] }, 'e'>): Expression<SqlBool> {
  return eb.and([eb('e.status', '=', 'published'), eb('e.published_at', '<=', sql<Date>`now()`), eb('e.deleted_at', 'is', null)]);
}

/** The first four-digit year in the free-text vehicle year ("1976", "c. 1968", "1971–73"). */
const vehicleYear = sql<number | null>`substring(b.vehicle_year from '(\\d{4})')::int`;

function publicBuilds(db: Db) {
  return db
    .selectFrom('builds as b')
    .innerJoin('users as u', 'u.id', 'b.owner_id')
    .where('b.visibility', '=', 'public')
    .where('b.deleted_at', 'is', null)
    .where('u.deleted_at', 'is', null);
}

type PublicBuilds = ReturnType<typeof publicBuilds>;

/** Adds a build card's columns, with the count and date of its published episodes. */
export function selectBuildCard(query: PublicBuilds) {
  return query.select((eb) => [
    'b.id',
    'b.slug',
    'b.title',
    'b.vehicle_kind',
    'b.vehicle_make',
    'b.vehicle_model',
    'b.vehicle_year',
    'b.summary',
    'u.handle',
    'u.display_name',
    eb
      .selectFrom('episodes as e')
      .select((eb2) => eb2.fn.countAll<number>().as('n'))
      .whereRef('e.build_id', '=', 'b.id')
      .where(isPublishedEpisode)
      .as('episode_count'),
    eb
      .selectFrom('episodes as e')
      .select((eb2) => eb2.fn.max('e.published_at').as('m'))
      .whereRef('e.build_id', '=', 'b.id')
      .where(isPublishedEpisode)
      .as('last_published_at'),
  ]);
}
export type BuildCardRow = Awaited<ReturnType<ReturnType<typeof selectBuildCard>['executeTakeFirstOrThrow']>>;

/** Public builds of one owner, most recently active first. */
export function listCreatorBuilds(db: Db, ownerId: number) {
  return selectBuildCard(publicBuilds(db).where('b.owner_id', '=', ownerId))
    .orderBy(sql`last_published_at desc nulls last`)
    .orderBy('b.id', 'desc')
    .limit(100)
    .execute();
}

/** The builds directory: public builds filtered by kind, make and decade, most recently active first. */
export async function listBuildDirectory(db: Db, q: BuildDirectoryQuery) {
  let base = publicBuilds(db);
  if (q.kind) base = base.where('b.vehicle_kind', '=', q.kind);
  if (q.make) base = base.where(sql`lower(b.vehicle_make)`, '=', q.make.toLowerCase());
  if (q.decade !== undefined) base = base.where(vehicleYear, '>=', q.decade).where(vehicleYear, '<', q.decade + 10);
  const [rows, count, makes, decades] = await Promise.all([
    selectBuildCard(base)
      .orderBy(sql`last_published_at desc nulls last`)
      .orderBy('b.id', 'desc')
      .limit(q.perPage)
      .offset((q.page - 1) * q.perPage)
      .execute(),
    base.select((eb) => eb.fn.countAll<number>().as('n')).executeTakeFirstOrThrow(),
    publicBuilds(db)
      .select(sql<string>`min(b.vehicle_make)`.as('make'))
      .where('b.vehicle_make', 'is not', null)
      .where('b.vehicle_make', '<>', '')
      .groupBy(sql`lower(b.vehicle_make)`)
      .orderBy(sql`lower(b.vehicle_make)`)
      .execute(),
    publicBuilds(db)
      .select(sql<number>`(${vehicleYear} / 10) * 10`.as('decade'))
      .where(vehicleYear, 'is not', null)
      .groupBy(sql`1`)
      .orderBy(sql`1`)
      .execute(),
  ]);
  return { rows, total: count.n, makes: makes.map((m) => m.make), decades: decades.map((d) => d.decade) };
}
