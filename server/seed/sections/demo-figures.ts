import { sql } from 'kysely';
import type { SeedSection } from '../section';
import { demoFigures } from './demo-figures-data';

/**
 * Figures on several demo episodes: mixed units, one done by hand below the wrench's range, one
 * weaker substitute, one torque-plus-angle. Upserted by position, like the demo chapters.
 */
export const demoFiguresSection: SeedSection = {
  key: 'demo-figures',
  version: 1,
  async run(trx) {
    for (const group of demoFigures) {
      const episode = await trx
        .selectFrom('episodes as e')
        .innerJoin('builds as b', 'b.id', 'e.build_id')
        .innerJoin('users as u', 'u.id', 'b.owner_id')
        .select('e.id')
        .where(sql`lower(u.handle)`, '=', group.owner)
        .where('b.slug', '=', group.buildSlug)
        .where('e.slug', '=', group.episodeSlug)
        .executeTakeFirstOrThrow();
      for (const [position, f] of group.figures.entries()) {
        const columns = {
          fastener: f.fastener,
          thread: f.thread,
          grade_fitted: f.gradeFitted,
          grade_specified: f.gradeSpecified,
          method: f.method,
          value: f.value,
          unit: f.unit,
          angle_stages: JSON.stringify(f.angleStages),
          source: f.source,
          wrench_min: f.wrenchRange?.min ?? null,
          wrench_max: f.wrenchRange?.max ?? null,
          wrench_unit: f.wrenchRange?.unit ?? null,
          system_key: f.systemKey,
          note: f.note,
        };
        await trx
          .insertInto('figures')
          .values({ episode_id: episode.id, position, ...columns })
          .onConflict((oc) => oc.columns(['episode_id', 'position']).doUpdateSet(columns))
          .execute();
      }
    }
  },
};
