import { validateChapters } from '../../src/shared/chapters';
import { writeUpImageIds, writeUpText, type WriteUpDoc } from '../../src/shared/write-up';
import type { Db } from '../db/kysely';
import { disclosureLine } from '../../src/shared/disclosure';
import { episodeDisclosure } from './disclosure';

export interface PublishProblem {
  field: string;
  message: string;
}

export interface PublishContext {
  episodeId: number;
  buildId: number;
  title: string;
  writeUp: WriteUpDoc;
  durationSeconds: number | null;
  chapters: Array<{ startSeconds: number; title: string }>;
  /** When it is to go out, if not now (scheduling): a paid sponsorship is judged on that day. */
  publishAt?: Date;
}

/** One rule an episode must pass to go public; run at "publish now" and again when a schedule fires. */
export type PublishCheck = (ctx: PublishContext, db: Db) => Promise<PublishProblem[]> | PublishProblem[];

const hasTitle: PublishCheck = (ctx) => (ctx.title.trim() ? [] : [{ field: 'title', message: 'Give the episode a title' }]);

const hasWriteUp: PublishCheck = (ctx) =>
  writeUpText(ctx.writeUp).trim() ? [] : [{ field: 'writeUp', message: 'Write something about the session before publishing' }];

const chaptersInOrder: PublishCheck = (ctx) =>
  validateChapters(ctx.chapters, { durationSeconds: ctx.durationSeconds }).map((p) => ({
    field: `chapters.${p.index}.${p.field}`,
    message: p.message,
  }));

/** Every picture readers will see — in the write-up, as the cover, in the gallery — needs its words for people who cannot see it. */
const picturesHaveAltText: PublishCheck = async (ctx, db) => {
  const inText = writeUpImageIds(ctx.writeUp);
  const around = await db
    .selectFrom('media as m')
    .leftJoin('episode_gallery as g', (j) => j.onRef('g.media_id', '=', 'm.id').on('g.episode_id', '=', ctx.episodeId))
    .leftJoin('episodes as e', (j) => j.onRef('e.cover_media_id', '=', 'm.id').on('e.id', '=', ctx.episodeId))
    .select(['m.id', 'm.alt_text', 'g.position', 'e.id as cover_of'])
    .where((eb) =>
      eb.or([eb('g.episode_id', 'is not', null), eb('e.id', 'is not', null), ...(inText.length ? [eb('m.id', 'in', inText)] : [])]),
    )
    .execute();
  const undescribed = new Set(around.filter((r) => !r.alt_text?.trim()).map((r) => r.id));
  const problems: PublishProblem[] = [];
  const inWriteUp = inText.filter((id) => undescribed.has(id) || !around.some((r) => r.id === id));
  if (inWriteUp.length)
    problems.push({
      field: 'writeUp',
      message: `Describe ${inWriteUp.length === 1 ? 'the picture' : `${inWriteUp.length} pictures`} in the write-up (alt text) before publishing`,
    });
  if (around.some((r) => r.cover_of !== null && undescribed.has(r.id)))
    problems.push({ field: 'cover', message: 'Describe the cover picture (alt text) before publishing' });
  const gallery = around.filter((r) => r.position !== null && undescribed.has(r.id)).length;
  if (gallery)
    problems.push({
      field: 'gallery',
      message: `Describe ${gallery === 1 ? 'the gallery picture' : `${gallery} gallery pictures`} (alt text) before publishing`,
    });
  return problems;
};

/** A supported line names both its sponsor and the kind of support (the disclosure says who gave what). */
const supportComplete: PublishCheck = async (ctx, db) => {
  const lines = await db
    .selectFrom('part_lines')
    .select(['id', 'position', 'description', 'support_kind', 'sponsor_id'])
    .where('episode_id', '=', ctx.episodeId)
    .where((eb) => eb.or([eb('support_kind', 'is not', null), eb('sponsor_id', 'is not', null)]))
    .orderBy('position')
    .execute();
  const all = await db
    .selectFrom('part_lines')
    .select(['id'])
    .where('episode_id', '=', ctx.episodeId)
    .orderBy('position')
    .orderBy('id')
    .execute();
  const number = new Map(all.map((l, i) => [l.id, i + 1]));
  return lines.flatMap((l): PublishProblem[] => {
    const name = `Part line ${number.get(l.id)} “${l.description}”`;
    if (l.sponsor_id === null)
      return [{ field: `partLines.${l.id}.sponsorId`, message: `${name} is marked ${l.support_kind}: name its sponsor` }];
    if (l.support_kind === null)
      return [{ field: `partLines.${l.id}.supportKind`, message: `${name} names a sponsor: say what kind of support it was` }];
    return [];
  });
};

/**
 * A supported episode needs the creator's word that the video itself discloses the support too
 * (UK CAP Code / ASA influencers' guide: the ad is identifiable wherever it is seen; US FTC
 * Endorsement Guides, 16 CFR Part 255: the disclosure is in the video, not only beside it).
 */
const videoDisclosureConfirmed: PublishCheck = async (ctx, db) => {
  const d = await episodeDisclosure(db, ctx.episodeId, { at: ctx.publishAt });
  if (!d) return [];
  const e = await db.selectFrom('episodes').select('video_disclosure_confirmed').where('id', '=', ctx.episodeId).executeTakeFirstOrThrow();
  return e.video_disclosure_confirmed
    ? []
    : [{ field: 'videoDisclosureConfirmed', message: `Confirm that the video discloses this too: “${disclosureLine(d)}”` }];
};

/** Every publish rule; later features add theirs here. */
export const publishChecks: PublishCheck[] = [
  hasTitle,
  hasWriteUp,
  chaptersInOrder,
  picturesHaveAltText,
  supportComplete,
  videoDisclosureConfirmed,
];

/** Runs every rule against the episode as it is stored now. */
export async function runPublishChecks(db: Db, episodeId: number, publishAt?: Date): Promise<PublishProblem[]> {
  const e = await db
    .selectFrom('episodes')
    .select(['id', 'build_id', 'title', 'write_up', 'duration_seconds'])
    .where('id', '=', episodeId)
    .executeTakeFirstOrThrow();
  const chapters = await db
    .selectFrom('chapters')
    .select(['start_seconds', 'title'])
    .where('episode_id', '=', episodeId)
    .orderBy('position')
    .execute();
  const ctx: PublishContext = {
    episodeId: e.id,
    buildId: e.build_id,
    title: e.title,
    writeUp: e.write_up as WriteUpDoc,
    durationSeconds: e.duration_seconds,
    chapters: chapters.map((c) => ({ startSeconds: c.start_seconds, title: c.title })),
    publishAt,
  };
  const problems: PublishProblem[] = [];
  for (const check of publishChecks) problems.push(...(await check(ctx, db)));
  return problems;
}
