import { disclosureShort } from '../../src/shared/disclosure';
import { episodeDisclosure } from '../services/disclosure';
import { paths } from '../../src/shared/paths';
import type { AppDeps } from '../app-deps';
import { noticeMail } from '../services/notice-mail';
import { noticeRecipients } from '../services/notice-recipients';

export const WEEKLY_DIGEST_JOB = 'notices.weekly-digest';
export const DAILY_DIGEST_JOB = 'notices.daily-digest';

/**
 * Sends one digest per person for the notices that waited for it (`email = 'digest'`): new
 * episodes weekly, new posts on one's builds daily. Rows are locked and marked in the same
 * transaction as the outbox row, so two processes never send the same digest.
 */
export async function sendDigests(deps: AppDeps, kind: 'new-episode' | 'new-post'): Promise<number> {
  const people = await deps.db
    .selectFrom('notifications')
    .select('user_id')
    .distinct()
    .where('email', '=', 'digest')
    .where('kind', '=', kind)
    .execute();
  let sent = 0;
  for (const { user_id } of people) {
    await deps.db.transaction().execute(async (trx) => {
      const items = await trx
        .selectFrom('notifications as n')
        .innerJoin('episodes as e', 'e.id', 'n.episode_id')
        .innerJoin('builds as b', 'b.id', 'e.build_id')
        .innerJoin('users as o', 'o.id', 'b.owner_id')
        .select([
          'n.id',
          'e.id as episode_id',
          'e.number',
          'e.title',
          'e.slug',
          'b.title as build_title',
          'b.slug as build_slug',
          'o.handle',
        ])
        .where('n.user_id', '=', user_id)
        .where('n.kind', '=', kind)
        .where('n.email', '=', 'digest')
        .orderBy('n.id')
        .forUpdate('n')
        .skipLocked()
        .execute();
      if (!items.length) return;
      await trx
        .updateTable('notifications')
        .set({ email: 'digested' })
        .where(
          'id',
          'in',
          items.map((i) => i.id),
        )
        .execute();
      const [r] = await noticeRecipients(trx, [user_id]);
      if (!r?.address) return;
      const weekly = kind === 'new-episode';
      // A supported episode carries its disclosure into the digest too (short form beside its link).
      const disclosures = weekly ? await Promise.all(items.map((i) => episodeDisclosure(trx, i.episode_id))) : [];
      await deps.outbox.enqueue(
        trx,
        noticeMail(deps.config, {
          to: r.address,
          userId: user_id,
          scope: weekly ? 'new-episodes' : 'new-posts',
          kind: weekly ? 'digest-new-episodes' : 'digest-new-posts',
          subject: weekly
            ? `This week on Rivet & Reel: ${items.length} new episode${items.length === 1 ? '' : 's'}`
            : `${items.length} new post${items.length === 1 ? '' : 's'} on your builds`,
          paragraphs: [weekly ? 'New episodes from what you follow:' : 'New questions and suggestions on your builds:'],
          links: items.map((i, k) => ({
            label: `${i.build_title} · Ep. ${i.number}: ${i.title}${disclosures[k] ? ` (${disclosureShort(disclosures[k])})` : ''}`,
            path: paths.episode(i.handle, i.build_slug, i.slug),
          })),
          reason: weekly ? 'You asked for a weekly digest of new episodes.' : 'You asked for a daily digest of new posts.',
        }),
      );
      sent += 1;
    });
  }
  return sent;
}

export function registerNoticeJobs(deps: AppDeps): void {
  deps.queue.define({
    name: WEEKLY_DIGEST_JOB,
    cron: '0 7 * * 1',
    retryLimit: 3,
    handler: async () => void (await sendDigests(deps, 'new-episode')),
  });
  deps.queue.define({
    name: DAILY_DIGEST_JOB,
    cron: '0 7 * * *',
    retryLimit: 3,
    handler: async () => void (await sendDigests(deps, 'new-post')),
  });
}
