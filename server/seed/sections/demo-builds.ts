import { sql, type Transaction } from 'kysely';
import { DEFAULT_SYSTEMS } from '../../../src/shared/schemas/builds';
import type { WriteUpDoc } from '../../../src/shared/write-up';
import type { Database } from '../../db/database';
import { renderWriteUp } from '../../services/write-up-html';
import type { SeedSection } from '../section';
import { demoBuilds, type DemoEpisode } from './demo-builds-data';

async function userId(trx: Transaction<Database>, handle: string): Promise<number> {
  return (
    await trx
      .selectFrom('users')
      .select('id')
      .where(sql`lower(handle)`, '=', handle)
      .executeTakeFirstOrThrow()
  ).id;
}

function writeUp(paragraphs: string[]): WriteUpDoc {
  return { type: 'doc', content: paragraphs.map((text) => ({ type: 'paragraph', content: [{ type: 'text', text }] })) };
}

/** Publication times relative to the first seeding day, so reruns never reorder the list. */
function timing(e: DemoEpisode) {
  if (e.status === 'published')
    return {
      published_at: sql<Date>`date_trunc('day', now()) - make_interval(days => ${e.daysAgo}) + interval '18 hours'`,
      publish_at: null,
    };
  if (e.status === 'scheduled') return { published_at: null, publish_at: sql<Date>`date_trunc('day', now()) + interval '3 days 18 hours'` };
  return { published_at: null, publish_at: null };
}

/** The invented demo scenario: a small 1970s hatchback and a two-stroke trail bike, episode by episode. */
export const demoBuildsSection: SeedSection = {
  key: 'demo-builds',
  version: 2,
  async run(trx) {
    for (const b of demoBuilds) {
      const ownerId = await userId(trx, b.owner);
      const values = {
        title: b.title,
        vehicle_kind: b.kind,
        vehicle_make: b.make,
        vehicle_model: b.model,
        vehicle_year: b.year,
        summary: b.summary,
        currency: b.currency,
        budget_minor: b.budgetMinor,
        visibility: 'public' as const,
      };
      const build = await trx
        .insertInto('builds')
        .values({ owner_id: ownerId, slug: b.slug, ...values })
        .onConflict((oc) => oc.columns(['owner_id', 'slug']).doUpdateSet(values))
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
      for (const [i, s] of DEFAULT_SYSTEMS.entries()) {
        await trx
          .insertInto('build_systems')
          .values({ build_id: build.id, key: s.key, name: s.name, safety_critical: s.safetyCritical, position: i })
          .onConflict((oc) => oc.columns(['build_id', 'key']).doNothing())
          .execute();
      }
      const episodeIds = new Map<number, number>();
      for (const e of b.episodes) {
        const doc = writeUp(e.paragraphs);
        const fields = {
          title: e.title,
          summary: e.summary,
          write_up: JSON.stringify(doc),
          write_up_html: renderWriteUp(doc),
          video_url: e.videoUrl,
          duration_seconds: e.durationSeconds,
          minutes_worked: e.minutesWorked,
          raised_vehicle: e.raisedVehicle,
        };
        const row = await trx
          .insertInto('episodes')
          .values({ build_id: build.id, number: e.number, slug: e.slug, status: e.status, ...timing(e), ...fields })
          .onConflict((oc) => oc.columns(['build_id', 'slug']).doUpdateSet(fields))
          .returning('id')
          .executeTakeFirstOrThrow();
        episodeIds.set(e.number, row.id);
        // Upsert by position so a rerun keeps the same rows (and ids).
        await trx.deleteFrom('chapters').where('episode_id', '=', row.id).where('position', '>=', e.chapters.length).execute();
        for (const [position, [start, title, system]] of e.chapters.entries()) {
          const chapter = { start_seconds: start, title, system_key: system ?? null, notes: null };
          await trx
            .insertInto('chapters')
            .values({ episode_id: row.id, position, ...chapter })
            .onConflict((oc) => oc.columns(['episode_id', 'position']).doUpdateSet(chapter))
            .execute();
        }
      }
      // Open items are the creator's to change: seed them once, never over their edits.
      const hasItems = await trx.selectFrom('open_items').select('id').where('build_id', '=', build.id).executeTakeFirst();
      for (const o of hasItems ? [] : b.openItems) {
        await trx
          .insertInto('open_items')
          .values({
            build_id: build.id,
            title: o.title,
            note: o.note,
            opened_in_episode_id: episodeIds.get(o.openedIn)!,
            closed_in_episode_id: o.closedIn ? episodeIds.get(o.closedIn)! : null,
          })
          .execute();
      }
    }
  },
};
