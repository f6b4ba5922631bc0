import { validateChapters } from '../../src/shared/chapters';
import { writeUpImageIds, writeUpText, type WriteUpDoc } from '../../src/shared/write-up';
import type { Db } from '../db/kysely';

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

/** Every picture readers will see needs its words for people who cannot see it (the media issue). */
const picturesHaveAltText: PublishCheck = async (ctx, db) => {
  const ids = writeUpImageIds(ctx.writeUp);
  if (!ids.length) return [];
  const rows = await db.selectFrom('media').select(['id', 'alt_text']).where('id', 'in', ids).execute();
  const alt = new Map(rows.map((r) => [r.id, r.alt_text?.trim() ?? '']));
  const missing = ids.filter((id) => !alt.get(id));
  return missing.length
    ? [
        {
          field: 'writeUp',
          message: `Describe ${missing.length === 1 ? 'the picture' : `${missing.length} pictures`} in the write-up (alt text) before publishing`,
        },
      ]
    : [];
};

/** Every publish rule; later features add theirs here (the sponsors' disclosure rule, for one). */
export const publishChecks: PublishCheck[] = [hasTitle, hasWriteUp, chaptersInOrder, picturesHaveAltText];

/** Runs every rule against the episode as it is stored now. */
export async function runPublishChecks(db: Db, episodeId: number): Promise<PublishProblem[]> {
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
  };
  const problems: PublishProblem[] = [];
  for (const check of publishChecks) problems.push(...(await check(ctx, db)));
  return problems;
}
