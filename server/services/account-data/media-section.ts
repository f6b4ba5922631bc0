import type { AccountDataSection } from './section';

/**
 * Files a person uploaded: listed in their export (kind, type, size, alt text, build). On deletion the
 * files stay with the build they illustrate or document (the build team's record), without their uploader.
 */
export const mediaSection: AccountDataSection = {
  key: 'media',
  async export(db, userId) {
    return db
      .selectFrom('media')
      .select(['id', 'build_id', 'kind', 'content_type', 'size_bytes', 'width', 'height', 'alt_text', 'created_at'])
      .where('created_by', '=', userId)
      .orderBy('id')
      .execute();
  },
  async erase(trx, userId) {
    await trx.updateTable('media').set({ created_by: null }).where('created_by', '=', userId).execute();
  },
};
