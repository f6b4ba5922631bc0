import { sql } from 'kysely';
import { paths } from '../../src/shared/paths';
import type { FollowingResponse, NotificationsResponse, UnsubscribeScope } from '../../src/shared/schemas/following';
import type { Db } from '../db/kysely';
import { HttpError } from '../http/http-error';
import { setNoticePreferences } from './notice-recipients';
import { openPostCount } from './posts-read';

/** Follows a build (idempotent). */
export async function followBuild(db: Db, userId: number, buildId: number): Promise<void> {
  await sql`insert into follows (user_id, build_id) values (${userId}, ${buildId}) on conflict (user_id, build_id) where build_id is not null do nothing`.execute(
    db,
  );
}

export async function unfollowBuild(db: Db, userId: number, buildId: number): Promise<void> {
  await db.deleteFrom('follows').where('user_id', '=', userId).where('build_id', '=', buildId).execute();
}

async function creatorId(db: Db, handle: string): Promise<number> {
  const u = await db
    .selectFrom('users')
    .select('id')
    .where(sql`lower(handle)`, '=', handle.toLowerCase())
    .where('deleted_at', 'is', null)
    .executeTakeFirst();
  if (!u) throw new HttpError(404, 'not_found', 'Not found');
  return u.id;
}

/** Follows a creator: all their public builds. */
export async function followCreator(db: Db, userId: number, handle: string): Promise<void> {
  const id = await creatorId(db, handle);
  if (id === userId) throw new HttpError(409, 'follow_self', 'You cannot follow yourself');
  await sql`insert into follows (user_id, creator_id) values (${userId}, ${id}) on conflict (user_id, creator_id) where creator_id is not null do nothing`.execute(
    db,
  );
}

export async function unfollowCreator(db: Db, userId: number, handle: string): Promise<void> {
  await db
    .deleteFrom('follows')
    .where('user_id', '=', userId)
    .where('creator_id', '=', await creatorId(db, handle))
    .execute();
}

/** What the person follows, and the latest episodes from it (public builds of creators; followed builds unless private). */
export async function getFollowing(db: Db, userId: number): Promise<FollowingResponse> {
  const builds = await db
    .selectFrom('follows as f')
    .innerJoin('builds as b', 'b.id', 'f.build_id')
    .innerJoin('users as o', 'o.id', 'b.owner_id')
    .select(['b.id', 'b.title', 'b.slug', 'o.handle as owner_handle'])
    .where('f.user_id', '=', userId)
    .where('b.deleted_at', 'is', null)
    .where('b.visibility', '!=', 'private')
    .orderBy('b.title')
    .execute();
  const creators = await db
    .selectFrom('follows as f')
    .innerJoin('users as u', 'u.id', 'f.creator_id')
    .select(['u.id', 'u.handle', 'u.display_name'])
    .where('f.user_id', '=', userId)
    .orderBy('u.display_name')
    .execute();
  const episodes = await db
    .selectFrom('episodes as e')
    .innerJoin('builds as b', 'b.id', 'e.build_id')
    .innerJoin('users as o', 'o.id', 'b.owner_id')
    .select([
      'e.id',
      'e.number',
      'e.title',
      'e.slug',
      'e.summary',
      'e.published_at',
      'b.id as build_id',
      'b.title as build_title',
      'b.slug as build_slug',
    ])
    .select(['o.handle', 'o.display_name'])
    .where('e.status', '=', 'published')
    .where('e.deleted_at', 'is', null)
    .where('b.deleted_at', 'is', null)
    .where('b.visibility', '!=', 'private')
    .where((eb) =>
      eb.or([
        eb.exists(eb.selectFrom('follows as f').select('f.id').where('f.user_id', '=', userId).whereRef('f.build_id', '=', 'b.id')),
        eb.and([
          eb('b.visibility', '=', 'public'),
          eb.exists(
            eb.selectFrom('follows as f').select('f.id').where('f.user_id', '=', userId).whereRef('f.creator_id', '=', 'b.owner_id'),
          ),
        ]),
      ]),
    )
    .orderBy('e.published_at', 'desc')
    .limit(30)
    .execute();
  return {
    builds: builds.map((b) => ({ id: b.id, title: b.title, slug: b.slug, ownerHandle: b.owner_handle })),
    creators: creators.map((c) => ({ id: c.id, handle: c.handle, displayName: c.display_name })),
    episodes: episodes.map((e) => ({
      id: e.id,
      number: e.number,
      title: e.title,
      slug: e.slug,
      summary: e.summary,
      publishedAt: (e.published_at ?? new Date()).toISOString(),
      build: { id: e.build_id, title: e.build_title, slug: e.build_slug },
      owner: { handle: e.handle, displayName: e.display_name },
    })),
  };
}

const KIND_TEXT = {
  'new-episode': (n: Row) => `New episode of ${n.build_title}: Ep. ${n.number}, ${n.title}`,
  reply: (n: Row) => `A reply to your ${n.post_kind ?? 'post'} on ${n.build_title}, Ep. ${n.number}`,
  'state-change': (n: Row) =>
    `Your ${n.post_kind ?? 'post'} on ${n.build_title}, Ep. ${n.number} is now ${(n.post_state ?? 'open').replace('-', ' ')}`,
  'new-post': (n: Row) => `New ${n.post_kind ?? 'post'} on ${n.build_title}, Ep. ${n.number}`,
  'sponsor-episode': (n: Row) => `Your support appears in ${n.build_title}, Ep. ${n.number}: ${n.title}`,
} as const;
type Row = { build_title: string; number: number; title: string; post_kind: string | null; post_state: string | null };

/** The person's latest notifications, the unread count, and (for build teams) open posts. */
export async function getNotifications(db: Db, userId: number, teamBuildIds: number[]): Promise<NotificationsResponse> {
  const rows = await db
    .selectFrom('notifications as n')
    .innerJoin('episodes as e', 'e.id', 'n.episode_id')
    .innerJoin('builds as b', 'b.id', 'e.build_id')
    .innerJoin('users as o', 'o.id', 'b.owner_id')
    .leftJoin('posts as p', 'p.id', 'n.post_id')
    .select([
      'n.id',
      'n.kind',
      'n.post_id',
      'n.created_at',
      'n.read_at',
      'e.number',
      'e.title',
      'e.slug',
      'b.title as build_title',
      'b.slug as build_slug',
    ])
    .select(['o.handle', 'p.kind as post_kind', 'p.state as post_state'])
    .where('n.user_id', '=', userId)
    .orderBy('n.created_at', 'desc')
    .orderBy('n.id', 'desc')
    .limit(50)
    .execute();
  const unread = await db
    .selectFrom('notifications')
    .select((eb) => eb.fn.countAll<number>().as('n'))
    .where('user_id', '=', userId)
    .where('read_at', 'is', null)
    .executeTakeFirstOrThrow();
  return {
    items: rows.map((n) => ({
      id: n.id,
      kind: n.kind,
      text: KIND_TEXT[n.kind](n),
      path: n.kind === 'new-post' ? '/inbox' : `${paths.episode(n.handle, n.build_slug, n.slug)}${n.post_id ? `#post-${n.post_id}` : ''}`,
      createdAt: n.created_at.toISOString(),
      read: n.read_at !== null,
    })),
    unreadCount: Number(unread.n),
    openPostCount: await openPostCount(db, teamBuildIds),
  };
}

export async function markNotificationsRead(db: Db, userId: number, ids: number[] | 'all'): Promise<void> {
  await db
    .updateTable('notifications')
    .set({ read_at: sql<Date>`now()` })
    .where('user_id', '=', userId)
    .where('read_at', 'is', null)
    .$if(ids !== 'all', (q) => q.where('id', 'in', ids as number[]))
    .execute();
}

const SCOPE_CHANGE = {
  'new-episodes': { newEpisodes: 'none' },
  replies: { replies: false },
  'state-changes': { stateChanges: false },
  'new-posts': { newPosts: 'none' },
} as const;

/** Turns one kind of e-mail notice off (the token was checked by the caller). */
export async function unsubscribe(db: Db, userId: number, scope: UnsubscribeScope): Promise<void> {
  const exists = await db.selectFrom('users').select('id').where('id', '=', userId).where('deleted_at', 'is', null).executeTakeFirst();
  if (!exists) throw new HttpError(404, 'not_found', 'Not found');
  await setNoticePreferences(db, userId, SCOPE_CHANGE[scope]);
}
