import type { Insertable } from 'kysely';
import type { BuildsTable, EpisodesTable, UsersTable } from '../../server/db/database';
import type { Db } from '../../server/db/kysely';

let seq = 0;
const next = () => `${Date.now().toString(36)}-${(seq += 1)}`;

/** Inserts a user; every field can be overridden. */
export async function createUser(db: Db, overrides: Partial<Insertable<UsersTable>> = {}) {
  const id = next();
  return db
    .insertInto('users')
    .values({ handle: `person-${id}`, display_name: `Test Person ${id}`, email: `person-${id}@example.test`, ...overrides })
    .returningAll()
    .executeTakeFirstOrThrow();
}

/** Inserts a build (public unless overridden), creating its owner when none is given. */
export async function createBuild(db: Db, overrides: Partial<Insertable<BuildsTable>> = {}) {
  const ownerId = overrides.owner_id ?? (await createUser(db)).id;
  const id = next();
  return db
    .insertInto('builds')
    .values({ slug: `build-${id}`, title: `Test build ${id}`, visibility: 'public', ...overrides, owner_id: ownerId })
    .returningAll()
    .executeTakeFirstOrThrow();
}

/** Inserts an episode (published an hour ago unless overridden), creating its build when none is given. */
export async function createEpisode(db: Db, overrides: Partial<Insertable<EpisodesTable>> = {}) {
  const buildId = overrides.build_id ?? (await createBuild(db)).id;
  const id = next();
  const count = await db
    .selectFrom('episodes')
    .where('build_id', '=', buildId)
    .select((eb) => eb.fn.countAll<number>().as('n'))
    .executeTakeFirstOrThrow();
  return db
    .insertInto('episodes')
    .values({
      number: count.n + 1,
      slug: `episode-${id}`,
      title: `Test episode ${id}`,
      summary: 'What happened in the garage this time.',
      status: 'published',
      published_at: new Date(Date.now() - 3_600_000),
      ...overrides,
      build_id: buildId,
    })
    .returningAll()
    .executeTakeFirstOrThrow();
}
