import type { AccountDataSection } from './section';

/** Posts, follows, notices and reports. A deleted account's posts stay, shown as by "Former member". */
export const postsSection: AccountDataSection = {
  key: 'followers',
  async export(db, userId) {
    const posts = await db
      .selectFrom('posts')
      .select([
        'id',
        'episode_id',
        'parent_id',
        'kind',
        'state',
        'chapter_start_seconds',
        'at_seconds',
        'body',
        'created_at',
        'edited_at',
        'hidden_at',
      ])
      .where('author_id', '=', userId)
      .orderBy('id')
      .execute();
    const follows = await db.selectFrom('follows').select(['build_id', 'creator_id', 'created_at']).where('user_id', '=', userId).execute();
    const noticePreferences = await db
      .selectFrom('notice_preferences')
      .select(['new_episodes', 'replies', 'state_changes', 'new_posts', 'updated_at'])
      .where('user_id', '=', userId)
      .executeTakeFirst();
    const notifications = await db
      .selectFrom('notifications')
      .select(['kind', 'episode_id', 'post_id', 'created_at', 'read_at'])
      .where('user_id', '=', userId)
      .execute();
    const reports = await db
      .selectFrom('post_reports')
      .select(['post_id', 'reason', 'created_at'])
      .where('reporter_id', '=', userId)
      .execute();
    return { posts, follows, noticePreferences: noticePreferences ?? null, notifications, reports };
  },
  async erase(trx, userId) {
    await trx.deleteFrom('follows').where('user_id', '=', userId).execute();
    await trx.deleteFrom('follows').where('creator_id', '=', userId).execute();
    await trx.deleteFrom('notice_preferences').where('user_id', '=', userId).execute();
    await trx.deleteFrom('notifications').where('user_id', '=', userId).execute();
    await trx.deleteFrom('post_reports').where('reporter_id', '=', userId).execute();
  },
};
