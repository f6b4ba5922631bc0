import type { Db } from '../../db/kysely';
import { HttpError } from '../../http/http-error';
import { buildsSection } from './builds-section';
import { mediaSection } from './media-section';
import { postsSection } from './posts-section';
import type { AccountDataSection } from './section';
import { accountSection, membershipsSection } from './sections';

/** Every section of an account's data; later features append theirs. Erased in reverse order. */
export const accountDataSections: readonly AccountDataSection[] = [
  accountSection,
  membershipsSection,
  buildsSection,
  mediaSection,
  postsSection,
];

/** "Download my data": one JSON document with a part per section. */
export async function exportAccountData(db: Db, userId: number): Promise<Record<string, unknown>> {
  const out: Record<string, unknown> = { exportedAt: new Date().toISOString(), format: 'rivet-reel-account-export/1' };
  for (const section of accountDataSections) out[section.key] = await section.export(db, userId);
  return out;
}

/** "Delete my account": refused while it owns builds; otherwise every section erases its part. */
export async function deleteAccount(db: Db, userId: number): Promise<void> {
  await db.transaction().execute(async (trx) => {
    const owned = await trx
      .selectFrom('build_members')
      .select('build_id')
      .where('user_id', '=', userId)
      .where('role', '=', 'owner')
      .execute();
    if (owned.length) {
      throw new HttpError(
        409,
        'owns_builds',
        `You still own ${owned.length} build${owned.length === 1 ? '' : 's'}: transfer or delete ${owned.length === 1 ? 'it' : 'them'} first`,
      );
    }
    for (const section of [...accountDataSections].reverse()) await section.erase(trx, userId);
  });
}
