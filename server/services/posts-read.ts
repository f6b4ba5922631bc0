import { sql, type ExpressionBuilder } from 'kysely';
import type { EpisodePosts, InboxItem, InboxQuery, InboxResponse, ModerationQueue } from '../../src/shared/schemas/posts';
import type { Actor } from '../auth/actor';
import type { Database } from '../db/database';
import type { Db } from '../db/kysely';
import { POST_COLUMNS, presentThreads, type PostRow } from '../presenters/posts';

type Eb = ExpressionBuilder<Database & { p: Database['posts'] }, 'p'>;

/** Hidden posts show only to their author, the build team and admins. */
const visibleTo = (actor: Actor, buildId: number) => (eb: Eb) =>
  actor?.isAdmin || actor?.builds.has(buildId)
    ? eb.val(true)
    : eb.or([eb('p.hidden_at', 'is', null), ...(actor ? [eb('p.author_id', '=', actor.userId)] : [])]);

function selectPosts(db: Db) {
  return db.selectFrom('posts as p').innerJoin('users as a', 'a.id', 'p.author_id').select(POST_COLUMNS);
}

/** An episode's posts in video order, each with its replies, as the viewer may see them. */
export async function listEpisodePosts(
  db: Db,
  actor: Actor,
  episodeId: number,
  buildId: number,
  published: boolean,
): Promise<EpisodePosts> {
  const rows: PostRow[] = await selectPosts(db)
    .where('p.episode_id', '=', episodeId)
    .where(visibleTo(actor, buildId))
    .orderBy(sql`coalesce(p.at_seconds, p.chapter_start_seconds)`)
    .orderBy('p.created_at')
    .execute();
  const visibleIds = new Set(rows.map((r) => r.id));
  // A reply under a post hidden from the viewer goes with it.
  const kept = rows.filter((r) => r.parent_id === null || visibleIds.has(r.parent_id));
  return {
    items: presentThreads(kept, actor?.userId ?? null),
    canPost: actor !== null && published,
    isTeam: actor?.builds.has(buildId) ?? false,
    signedIn: actor !== null,
    isAdmin: actor?.isAdmin ?? false,
  };
}

async function inboxRows(db: Db, buildIds: number[], q: InboxQuery, limit: number) {
  const answered = sql<boolean>`exists (select 1 from posts r where r.parent_id = p.id and r.by_team)`;
  return selectPosts(db)
    .innerJoin('episodes as e', 'e.id', 'p.episode_id')
    .innerJoin('builds as b', 'b.id', 'p.build_id')
    .innerJoin('users as o', 'o.id', 'b.owner_id')
    .select(['e.number as episode_number', 'e.title as episode_title', 'e.slug as episode_slug', 'p.episode_id', 'p.build_id'])
    .select(['b.title as build_title', 'b.slug as build_slug', 'o.handle as owner_handle', answered.as('answered')])
    .where('p.build_id', 'in', buildIds)
    .where('p.parent_id', 'is', null)
    .where('e.deleted_at', 'is', null)
    .where('b.deleted_at', 'is', null)
    .$if(q.buildId !== undefined, (qb) => qb.where('p.build_id', '=', q.buildId!))
    .$if(q.episodeId !== undefined, (qb) => qb.where('p.episode_id', '=', q.episodeId!))
    .$if(q.kind !== undefined, (qb) => qb.where('p.kind', '=', q.kind!))
    .$if(q.state !== undefined, (qb) => qb.where('p.state', '=', q.state!))
    .$if(q.order === 'unanswered', (qb) => qb.orderBy(answered).orderBy(sql`p.state = 'open'`, 'desc'))
    .orderBy('p.created_at', 'desc')
    .limit(limit)
    .execute();
}

async function withReplies(db: Db, rows: Awaited<ReturnType<typeof inboxRows>>, viewerId: number | null): Promise<InboxItem[]> {
  if (!rows.length) return [];
  const replies: PostRow[] = await selectPosts(db)
    .where(
      'p.parent_id',
      'in',
      rows.map((r) => r.id),
    )
    .orderBy('p.created_at')
    .execute();
  const threads = presentThreads([...rows, ...replies], viewerId);
  return threads.map((t, i) => {
    const r = rows[i]!;
    return {
      ...t,
      episode: { id: r.episode_id, number: r.episode_number, title: r.episode_title, slug: r.episode_slug },
      build: { id: r.build_id, title: r.build_title, slug: r.build_slug, ownerHandle: r.owner_handle },
      unanswered: !r.answered,
    };
  });
}

/** Open top-level posts on the given builds (hidden ones not counted). */
export async function openPostCount(db: Db, buildIds: number[]): Promise<number> {
  if (!buildIds.length) return 0;
  const r = await db
    .selectFrom('posts as p')
    .innerJoin('episodes as e', 'e.id', 'p.episode_id')
    .select((eb) => eb.fn.countAll<number>().as('n'))
    .where('p.build_id', 'in', buildIds)
    .where('p.parent_id', 'is', null)
    .where('p.state', '=', 'open')
    .where('p.hidden_at', 'is', null)
    .where('e.deleted_at', 'is', null)
    .executeTakeFirstOrThrow();
  return Number(r.n);
}

/** The build team's inbox: every post on their builds, filtered, unanswered first by default. */
export async function getInbox(db: Db, userId: number, q: InboxQuery, limit = 200): Promise<InboxResponse> {
  const builds = await db
    .selectFrom('build_members as m')
    .innerJoin('builds as b', 'b.id', 'm.build_id')
    .select(['b.id', 'b.title'])
    .where('m.user_id', '=', userId)
    .where('b.deleted_at', 'is', null)
    .orderBy('b.title')
    .execute();
  const ids = builds.map((b) => b.id);
  if (!ids.length) return { items: [], openCount: 0, builds: [] };
  const rows = await inboxRows(db, ids, q, limit);
  return { items: await withReplies(db, rows, userId), openCount: await openPostCount(db, ids), builds };
}

/** Admins' moderation queue: reported posts not yet settled, and hidden ones (not on private builds). */
export async function getModerationQueue(db: Db, adminId: number): Promise<ModerationQueue> {
  const flagged = await db
    .selectFrom('posts as p')
    .innerJoin('builds as b', 'b.id', 'p.build_id')
    .select('p.id')
    .where('b.visibility', '!=', 'private')
    .where((eb) =>
      eb.or([
        eb('p.hidden_at', 'is not', null),
        eb.exists(eb.selectFrom('post_reports as r').select('r.id').whereRef('r.post_id', '=', 'p.id').where('r.resolved_at', 'is', null)),
      ]),
    )
    .orderBy('p.id', 'desc')
    .limit(100)
    .execute();
  const ids = flagged.map((f) => f.id);
  if (!ids.length) return { items: [] };
  const rows = await inboxRows(
    db,
    (await db.selectFrom('posts').select('build_id').distinct().where('id', 'in', ids).execute()).map((r) => r.build_id),
    { order: 'newest' },
    1000,
  );
  const items = await withReplies(
    db,
    rows.filter((r) => ids.includes(r.id)),
    adminId,
  );
  const reports = await db
    .selectFrom('post_reports as r')
    .innerJoin('users as u', 'u.id', 'r.reporter_id')
    .select(['r.post_id', 'r.reason', 'r.created_at', 'u.display_name'])
    .where('r.post_id', 'in', ids)
    .where('r.resolved_at', 'is', null)
    .orderBy('r.created_at')
    .execute();
  const actions = await db
    .selectFrom('moderation_actions as m')
    .leftJoin('users as u', 'u.id', 'm.actor_id')
    .select(['m.post_id', 'm.action', 'm.reason', 'm.created_at', 'u.display_name'])
    .where('m.post_id', 'in', ids)
    .orderBy('m.created_at')
    .execute();
  return {
    items: items.map((post) => ({
      post,
      reports: reports
        .filter((r) => r.post_id === post.id)
        .map((r) => ({ reason: r.reason, createdAt: r.created_at.toISOString(), reporter: r.display_name })),
      actions: actions
        .filter((a) => a.post_id === post.id)
        .map((a) => ({
          action: a.action,
          reason: a.reason,
          createdAt: a.created_at.toISOString(),
          actor: a.display_name ?? 'Former member',
        })),
    })),
  };
}
