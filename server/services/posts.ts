import { sql } from 'kysely';
import { formatTime } from '../../src/shared/chapters';
import { EDIT_WINDOW_MINUTES, STATES_BY_KIND, type PostCreate, type PostStateChange } from '../../src/shared/schemas/posts';
import type { SignedIn } from '../auth/actor';
import type { Db } from '../db/kysely';
import { HttpError } from '../http/http-error';
import { noticeNewPost, noticeReply, noticeStateChange, type NoticeDeps } from './notices';

type Deps = NoticeDeps & { db: Db };

const invalid = (field: string, message: string) => new HttpError(400, 'invalid_request', message, { [field]: [message] });

/** A new question or suggestion on a published episode, anchored to a chapter (by its start) and a moment inside it. */
export async function createPost(deps: Deps, actor: SignedIn, episodeId: number, input: PostCreate): Promise<number> {
  return deps.db.transaction().execute(async (trx) => {
    const e = await trx
      .selectFrom('episodes')
      .select(['id', 'build_id', 'status', 'duration_seconds'])
      .where('id', '=', episodeId)
      .executeTakeFirstOrThrow();
    if (e.status !== 'published') throw new HttpError(409, 'not_published', 'Posts open when the episode is published');
    const starts = (
      await trx.selectFrom('chapters').select('start_seconds').where('episode_id', '=', episodeId).orderBy('start_seconds').execute()
    ).map((c) => c.start_seconds);
    const i = starts.indexOf(input.chapterStartSeconds);
    if (i < 0) throw invalid('chapterStartSeconds', 'not the start of one of this episode’s chapters');
    const end = starts[i + 1] ?? e.duration_seconds ?? null;
    const at = input.atSeconds ?? null;
    if (at !== null && (at < input.chapterStartSeconds || (end !== null && at >= end)))
      throw invalid(
        'atSeconds',
        `must lie within the chapter (${formatTime(input.chapterStartSeconds)}${end !== null ? `–${formatTime(end)}` : ' onwards'})`,
      );
    const row = await trx
      .insertInto('posts')
      .values({
        episode_id: episodeId,
        build_id: e.build_id,
        author_id: actor.userId,
        kind: input.kind,
        state: 'open',
        chapter_start_seconds: input.chapterStartSeconds,
        at_seconds: at,
        body: input.body,
        by_team: actor.builds.has(e.build_id),
      })
      .returning('id')
      .executeTakeFirstOrThrow();
    await noticeNewPost(trx, deps, row.id);
    return row.id;
  });
}

/** A reply to a question or suggestion (replies nest one level). */
export async function createReply(deps: Deps, actor: SignedIn, parentId: number, body: string): Promise<number> {
  return deps.db.transaction().execute(async (trx) => {
    const parent = await trx
      .selectFrom('posts')
      .select(['id', 'episode_id', 'build_id', 'parent_id'])
      .where('id', '=', parentId)
      .executeTakeFirstOrThrow();
    if (parent.parent_id !== null)
      throw new HttpError(409, 'reply_depth', 'Reply to the question or suggestion itself: replies nest one level');
    const row = await trx
      .insertInto('posts')
      .values({
        episode_id: parent.episode_id,
        build_id: parent.build_id,
        author_id: actor.userId,
        parent_id: parent.id,
        kind: 'reply',
        body,
        by_team: actor.builds.has(parent.build_id),
      })
      .returning('id')
      .executeTakeFirstOrThrow();
    await noticeReply(trx, deps, row.id);
    return row.id;
  });
}

/** The author's edit, within the edit window; marked as edited. */
export async function editPost(db: Db, postId: number, body: string): Promise<void> {
  const r = await db
    .updateTable('posts')
    .set({ body, edited_at: sql<Date>`now()`, updated_at: sql<Date>`now()` })
    .where('id', '=', postId)
    .where('created_at', '>', sql<Date>`now() - make_interval(mins => ${EDIT_WINDOW_MINUTES})`)
    .executeTakeFirst();
  if (!r.numUpdatedRows)
    throw new HttpError(409, 'edit_window_closed', `Posts can be edited for ${EDIT_WINDOW_MINUTES} minutes after posting`);
}

export async function deletePost(db: Db, postId: number): Promise<void> {
  await db.deleteFrom('posts').where('id', '=', postId).execute();
}

/** The build team sets a state the post's kind allows; adopting records what changed. */
export async function setPostState(deps: Deps, actor: SignedIn, postId: number, change: PostStateChange): Promise<void> {
  await deps.db.transaction().execute(async (trx) => {
    const p = await trx.selectFrom('posts').select(['kind', 'state']).where('id', '=', postId).forUpdate().executeTakeFirstOrThrow();
    if (p.kind === 'reply') throw invalid('state', 'replies have no state');
    if (!STATES_BY_KIND[p.kind].includes(change.state)) throw invalid('state', `a ${p.kind} can be ${STATES_BY_KIND[p.kind].join(', ')}`);
    await trx
      .updateTable('posts')
      .set({
        state: change.state,
        adopted_note: change.state === 'adopted' ? (change.note ?? null) : null,
        state_changed_at: sql<Date>`now()`,
        updated_at: sql<Date>`now()`,
      })
      .where('id', '=', postId)
      .execute();
    if (p.state !== change.state) await noticeStateChange(trx, deps, postId, actor.userId);
  });
}

/** A report; one per person per post (a second one updates the reason and reopens it). */
export async function reportPost(db: Db, actor: SignedIn, postId: number, reason: string): Promise<void> {
  await db
    .insertInto('post_reports')
    .values({ post_id: postId, reporter_id: actor.userId, reason })
    .onConflict((oc) => oc.columns(['post_id', 'reporter_id']).doUpdateSet({ reason, resolved_at: null, created_at: sql<Date>`now()` }))
    .execute();
}

/** Hides or restores a post with a recorded reason; settles its open reports. */
export async function moderatePost(db: Db, actor: SignedIn, postId: number, hidden: boolean, reason: string): Promise<void> {
  await db.transaction().execute(async (trx) => {
    await trx
      .updateTable('posts')
      .set({ hidden_at: hidden ? sql<Date>`now()` : null, hidden_reason: hidden ? reason : null, updated_at: sql<Date>`now()` })
      .where('id', '=', postId)
      .execute();
    await trx
      .insertInto('moderation_actions')
      .values({ post_id: postId, actor_id: actor.userId, action: hidden ? 'hide' : 'restore', reason })
      .execute();
    await trx
      .updateTable('post_reports')
      .set({ resolved_at: sql<Date>`now()` })
      .where('post_id', '=', postId)
      .where('resolved_at', 'is', null)
      .execute();
  });
}
