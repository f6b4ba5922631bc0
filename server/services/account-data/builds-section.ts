import type { AccountDataSection } from './section';

/**
 * Builds and episodes the account works on. Deletion is refused while it owns builds (see
 * deleteAccount), and episodes belong to their build, not to one author: nothing to erase here;
 * the memberships section removes the account from the teams it edits for.
 */
export const buildsSection: AccountDataSection = {
  key: 'builds',
  async export(db, userId) {
    const builds = await db
      .selectFrom('build_members as m')
      .innerJoin('builds as b', 'b.id', 'm.build_id')
      .select([
        'b.id',
        'b.slug',
        'b.title',
        'b.vehicle_kind',
        'b.vehicle_make',
        'b.vehicle_model',
        'b.vehicle_year',
        'b.summary',
        'b.currency',
        'b.budget_minor',
        'b.visibility',
        'm.role',
        'b.created_at',
        'b.deleted_at',
      ])
      .where('m.user_id', '=', userId)
      .execute();
    const ids = builds.map((b) => b.id);
    const episodes = ids.length
      ? await db
          .selectFrom('episodes')
          .select([
            'id',
            'build_id',
            'number',
            'slug',
            'title',
            'summary',
            'write_up',
            'video_url',
            'duration_seconds',
            'minutes_worked',
            'raised_vehicle',
            'status',
            'publish_at',
            'published_at',
            'created_at',
            'deleted_at',
          ])
          .where('build_id', 'in', ids)
          .orderBy('build_id')
          .orderBy('number')
          .execute()
      : [];
    const episodeIds = episodes.map((e) => e.id);
    const chapters = episodeIds.length
      ? await db
          .selectFrom('chapters')
          .select(['episode_id', 'position', 'start_seconds', 'title', 'system_key', 'notes'])
          .where('episode_id', 'in', episodeIds)
          .execute()
      : [];
    const openItems = ids.length
      ? await db
          .selectFrom('open_items')
          .select(['build_id', 'title', 'note', 'opened_in_episode_id', 'closed_in_episode_id'])
          .where('build_id', 'in', ids)
          .execute()
      : [];
    return builds.map((b) => ({
      ...b,
      episodes: episodes.filter((e) => e.build_id === b.id).map((e) => ({ ...e, chapters: chapters.filter((c) => c.episode_id === e.id) })),
      openItems: openItems.filter((o) => o.build_id === b.id),
    }));
  },
  async erase() {
    /* see above: owned builds block deletion; team membership goes with the memberships section */
  },
};
