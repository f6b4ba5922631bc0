import { sql, type Kysely } from 'kysely';
import type { AppDeps } from '../app-deps';
import type { Database } from '../db/database';
import type { PublishProblem } from './publish-checks';

const escapeHtml = (s: string) =>
  s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

/**
 * Tells the build's owner that a scheduled episode did not go out because it failed its publish
 * checks at that moment (it is back to draft). Not a notice one can turn off: it goes through the
 * outbox in the transaction that sends the episode back to draft.
 */
export async function mailOwnerPublishFailed(
  trx: Kysely<Database>,
  deps: Pick<AppDeps, 'outbox' | 'config'>,
  episodeId: number,
  problems: readonly PublishProblem[],
): Promise<boolean> {
  const e = await trx
    .selectFrom('episodes as e')
    .innerJoin('builds as b', 'b.id', 'e.build_id')
    .innerJoin('users as o', 'o.id', 'b.owner_id')
    .select(['e.number', 'e.title', 'b.title as build_title', sql<string | null>`coalesce(o.notice_email, o.email)`.as('address')])
    .select(['o.deleted_at'])
    .where('e.id', '=', episodeId)
    .executeTakeFirst();
  if (!e?.address || e.deleted_at) return false;
  // The editor's address (src/features/workbench/paths.ts, which the server may not import).
  const link = `${deps.config.PUBLIC_URL.replace(/\/$/, '')}/workbench/episodes/${episodeId}/edit`;
  const intro = `Episode ${e.number} of ${e.build_title}, “${e.title}”, was scheduled to publish now, but it did not pass the publish checks, so it is back to draft and readers cannot see it.`;
  const fix = 'Fix these, then publish or schedule it again:';
  await deps.outbox.enqueue(trx, {
    to: e.address,
    subject: `Not published: ${e.build_title}, episode ${e.number}`,
    kind: 'publish-failed',
    text: [intro, fix, ...problems.map((p) => `- ${p.message}`), `Open the episode: ${link}`].join('\n\n'),
    html: [
      `<p>${escapeHtml(intro)}</p>`,
      `<p>${escapeHtml(fix)}</p>`,
      `<ul>${problems.map((p) => `<li>${escapeHtml(p.message)}</li>`).join('')}</ul>`,
      `<p><a href="${escapeHtml(link)}">Open the episode</a></p>`,
    ].join('\n'),
  });
  return true;
}
