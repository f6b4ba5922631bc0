import { sql, type Kysely } from 'kysely';
import { DEFAULT_NOTICE_PREFERENCES, type NoticePreferences } from '../../src/shared/schemas/following';
import type { Database } from '../db/database';

export interface NoticeRecipient {
  userId: number;
  /** Where notices go (the notice address, else the sign-in address); null when none or refused. */
  address: string | null;
  prefs: NoticePreferences;
}

/** The people, with their preferences and usable address; deleted and suspended accounts left out. */
export async function noticeRecipients(db: Kysely<Database>, userIds: readonly number[]): Promise<NoticeRecipient[]> {
  if (!userIds.length) return [];
  const rows = await db
    .selectFrom('users as u')
    .leftJoin('notice_preferences as p', 'p.user_id', 'u.id')
    .select([
      'u.id',
      sql<string | null>`coalesce(u.notice_email, u.email)`.as('address'),
      sql<boolean>`exists (select 1 from mail_suppressions s where s.address = lower(coalesce(u.notice_email, u.email)))`.as('suppressed'),
      'p.new_episodes',
      'p.replies',
      'p.state_changes',
      'p.new_posts',
    ])
    .where('u.id', 'in', [...userIds])
    .where('u.deleted_at', 'is', null)
    .where('u.suspended_at', 'is', null)
    .orderBy('u.id')
    .execute();
  const d = DEFAULT_NOTICE_PREFERENCES;
  return rows.map((r) => ({
    userId: r.id,
    address: r.suppressed ? null : r.address,
    prefs: {
      newEpisodes: r.new_episodes ?? d.newEpisodes,
      replies: r.replies ?? d.replies,
      stateChanges: r.state_changes ?? d.stateChanges,
      newPosts: r.new_posts ?? d.newPosts,
    },
  }));
}

/** One person's preferences (the defaults when they never changed them). */
export async function getNoticePreferences(db: Kysely<Database>, userId: number): Promise<NoticePreferences> {
  const p = await db.selectFrom('notice_preferences').selectAll().where('user_id', '=', userId).executeTakeFirst();
  return p
    ? { newEpisodes: p.new_episodes, replies: p.replies, stateChanges: p.state_changes, newPosts: p.new_posts }
    : DEFAULT_NOTICE_PREFERENCES;
}

/** Stores preferences, merging a partial change into what is stored. */
export async function setNoticePreferences(
  db: Kysely<Database>,
  userId: number,
  change: Partial<NoticePreferences>,
): Promise<NoticePreferences> {
  const next = { ...(await getNoticePreferences(db, userId)), ...change };
  const values = {
    new_episodes: next.newEpisodes,
    replies: next.replies,
    state_changes: next.stateChanges,
    new_posts: next.newPosts,
    updated_at: sql<Date>`now()`,
  };
  await db
    .insertInto('notice_preferences')
    .values({ user_id: userId, ...values })
    .onConflict((oc) => oc.column('user_id').doUpdateSet(values))
    .execute();
  return next;
}
