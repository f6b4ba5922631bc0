import { sql, type Transaction } from 'kysely';
import type { Database } from '../../db/database';
import type { SeedSection } from '../section';

/** The invented demo scenario: a small 1970s hatchback and a two-stroke trail bike. */
const builds = [
  {
    owner: 'marta-kettleby',
    slug: 'marlowe-pipit-1976',
    title: '1976 Marlowe Pipit hatchback',
    editors: ['jun-halloway'],
    episodes: [
      {
        number: 1,
        slug: 'dragging-it-home',
        title: 'Dragging it home',
        summary: 'Twenty years in a barn: first look, seized brakes and a list of what it needs.',
        daysAgo: 21,
      },
      {
        number: 2,
        slug: 'front-brakes-apart',
        title: 'Front brakes apart',
        summary: 'Calipers off, a piston that would not move, and new flexible hoses on order.',
        daysAgo: 14,
      },
      {
        number: 3,
        slug: 'cooling-system-flush',
        title: 'Cooling system flush',
        summary: 'Rusty coolant out, a new thermostat in, and the radiator cap that caused it all.',
        daysAgo: 7,
      },
    ],
  },
  {
    owner: 'ossie-brandt',
    slug: 'vantel-125-trail',
    title: '1971 Vantel 125 trail bike',
    editors: [],
    episodes: [
      {
        number: 1,
        slug: 'top-end-teardown',
        title: 'Top-end teardown',
        summary: 'Barrel off a two-stroke single: scored piston, stuck rings and a measured bore.',
        daysAgo: 10,
      },
    ],
  },
];

async function userId(trx: Transaction<Database>, handle: string): Promise<number> {
  const u = await trx
    .selectFrom('users')
    .select('id')
    .where(sql`lower(handle)`, '=', handle)
    .executeTakeFirstOrThrow();
  return u.id;
}

export const demoBuildsSection: SeedSection = {
  key: 'demo-builds',
  version: 1,
  async run(trx) {
    for (const b of builds) {
      const ownerId = await userId(trx, b.owner);
      const build = await trx
        .insertInto('builds')
        .values({ owner_id: ownerId, slug: b.slug, title: b.title, visibility: 'public' })
        .onConflict((oc) => oc.columns(['owner_id', 'slug']).doUpdateSet({ title: b.title }))
        .returning('id')
        .executeTakeFirstOrThrow();
      await trx
        .insertInto('build_members')
        .values({ build_id: build.id, user_id: ownerId, role: 'owner' })
        .onConflict((oc) => oc.columns(['build_id', 'user_id']).doNothing())
        .execute();
      for (const handle of b.editors) {
        await trx
          .insertInto('build_members')
          .values({ build_id: build.id, user_id: await userId(trx, handle), role: 'editor' })
          .onConflict((oc) => oc.columns(['build_id', 'user_id']).doNothing())
          .execute();
      }
      for (const e of b.episodes) {
        // A fixed publication date relative to the first seeding keeps reruns from reordering the list.
        await trx
          .insertInto('episodes')
          .values({
            build_id: build.id,
            number: e.number,
            slug: e.slug,
            title: e.title,
            summary: e.summary,
            status: 'published',
            published_at: sql<Date>`date_trunc('day', now()) - make_interval(days => ${e.daysAgo}) + interval '18 hours'`,
          })
          .onConflict((oc) => oc.columns(['build_id', 'slug']).doUpdateSet({ title: e.title, summary: e.summary }))
          .execute();
      }
    }
  },
};
