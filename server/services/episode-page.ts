import type { Logger } from 'pino';
import type { EpisodePage } from '../../src/shared/schemas/episode-page';
import { canSee, type Actor } from '../auth/policy';
import type { Db } from '../db/kysely';
import { listFigures } from './figures';
import { getBuildTotals, getEpisodeParts } from './part-totals';
import { listEpisodePosts } from './posts-read';
import { getEpisodeReading } from './reading';

export interface EpisodeBySlug {
  id: number;
  slug: string;
  status: 'draft' | 'scheduled' | 'published';
  /** The slug asked for was a former one. */
  moved: boolean;
}

/** The episode of a build by its slug or a former one; null when there is none the actor may see. */
export async function findEpisodeBySlug(db: Db, actor: Actor, buildId: number, slug: string): Promise<EpisodeBySlug | null> {
  const columns = ['id', 'slug', 'status', 'deleted_at'] as const;
  let e = await db.selectFrom('episodes').select(columns).where('build_id', '=', buildId).where('slug', '=', slug).executeTakeFirst();
  let moved = false;
  if (!e) {
    const former = await db
      .selectFrom('episode_slugs')
      .select('episode_id')
      .where('build_id', '=', buildId)
      .where('slug', '=', slug)
      .executeTakeFirst();
    if (former) e = await db.selectFrom('episodes').select(columns).where('id', '=', former.episode_id).executeTakeFirst();
    moved = e !== undefined;
  }
  if (!e) return null;
  const build = await db.selectFrom('builds').select(['visibility']).where('id', '=', buildId).executeTakeFirstOrThrow();
  const visible = canSee(actor, {
    kind: 'episode',
    id: e.id,
    buildId,
    visibility: build.visibility,
    status: e.status,
    deleted: e.deleted_at !== null,
  });
  return visible ? { id: e.id, slug: e.slug, status: e.status, moved } : null;
}

/** A section of the page; its failure is logged and leaves it null, never the whole page. */
async function section<T>(logger: Logger, name: string, work: () => Promise<T>): Promise<T | null> {
  try {
    return await work();
  } catch (err) {
    logger.error({ err, section: name }, 'episode page section failed');
    return null;
  }
}

/**
 * The episode page in one response: what the page's loader used to fetch in five requests (reading,
 * parts, build totals, figures, posts), each section read exactly as its own endpoint reads it.
 */
export async function getEpisodePage(
  deps: { db: Db; logger: Logger },
  actor: Actor,
  buildId: number,
  episode: EpisodeBySlug,
  askedSlug: string,
): Promise<EpisodePage | null> {
  const { db, logger } = deps;
  const team = actor?.builds.has(buildId) === true;
  const [reading, parts, totals, figures, posts] = await Promise.all([
    getEpisodeReading(db, episode.id),
    section(logger, 'parts', async () => {
      const p = await getEpisodeParts(db, episode.id);
      // Receipts are the build team's: readers do not even learn that one exists.
      return team ? p : { ...p, items: p.items.map((l) => ({ ...l, receipt: null })) };
    }),
    section(logger, 'totals', () => getBuildTotals(db, buildId, false)),
    section(logger, 'figures', async () => ({ items: await listFigures(db, episode.id) })),
    section(logger, 'posts', () => listEpisodePosts(db, actor, episode.id, buildId, episode.status === 'published')),
  ]);
  if (!reading) return null;
  return { episodeId: episode.id, slug: episode.slug, movedFrom: episode.moved ? askedSlug : null, reading, parts, totals, figures, posts };
}
