import type { Kysely } from 'kysely';
import { disclosureLine } from '../../src/shared/disclosure';
import { paths } from '../../src/shared/paths';
import type { Database } from '../db/database';
import { noticeMail } from './notice-mail';
import type { AppDeps } from '../app-deps';
import { episodeDisclosure } from './disclosure';
import { noticeRecipients } from './notice-recipients';

type Trx = Kysely<Database>;
type NoticeDeps = Pick<AppDeps, 'outbox' | 'config'>;

/**
 * Tells the members of every organisation whose support is on this episode that it is out: an in-app
 * notice and an e-mail through the outbox, once per member and episode (the partial unique index on
 * notifications backs it up, so a re-publish sends nothing new to those already told). Private
 * builds tell no one. Called from `announceEpisode`, inside the publishing transaction.
 */
export async function noticeSponsorMembers(trx: Trx, deps: NoticeDeps, episodeId: number): Promise<number> {
  const e = await trx
    .selectFrom('episodes as e')
    .innerJoin('builds as b', 'b.id', 'e.build_id')
    .innerJoin('users as o', 'o.id', 'b.owner_id')
    .select(['e.id', 'e.number', 'e.title', 'e.slug', 'b.title as build_title', 'b.slug as build_slug', 'b.visibility'])
    .select(['o.handle as owner_handle', 'o.display_name as owner_name'])
    .where('e.id', '=', episodeId)
    .executeTakeFirstOrThrow();
  if (e.visibility === 'private') return 0;
  const sponsors = await trx
    .selectFrom('part_lines as pl')
    .innerJoin('sponsors as s', 's.id', 'pl.sponsor_id')
    .select(['s.id', 's.name', 's.slug'])
    .select((eb) => eb.fn.countAll<number>().as('lines'))
    .where('pl.episode_id', '=', episodeId)
    .where('pl.support_kind', 'is not', null)
    .where('pl.status', '<>', 'returned')
    .groupBy(['s.id', 's.name', 's.slug'])
    .orderBy('s.id')
    .execute();
  if (!sponsors.length) return 0;
  // The one wording of the disclosure, as on the episode page (src/shared/disclosure.ts).
  const found = await episodeDisclosure(trx, episodeId);
  const disclosure = found ? disclosureLine(found) : null;
  const episodePath = paths.episode(e.owner_handle, e.build_slug, e.slug);
  let mailed = 0;
  const told = new Set<number>();
  for (const s of sponsors) {
    const members = await trx.selectFrom('sponsor_members').select('user_id').where('sponsor_id', '=', s.id).execute();
    const ids = members.map((m) => m.user_id).filter((id) => !told.has(id));
    for (const r of await noticeRecipients(trx, ids)) {
      told.add(r.userId);
      const row = await trx
        .insertInto('notifications')
        .values({ user_id: r.userId, kind: 'sponsor-episode', episode_id: episodeId, email: r.address ? 'sent' : 'none' })
        .onConflict((oc) => oc.columns(['user_id', 'episode_id']).where('kind', '=', 'sponsor-episode').doNothing())
        .returning('id')
        .executeTakeFirst();
      if (!row || !r.address) continue;
      const lineWord = Number(s.lines) === 1 ? 'one part line' : `${Number(s.lines)} part lines`;
      await deps.outbox.enqueue(
        trx,
        noticeMail(deps.config, {
          to: r.address,
          userId: r.userId,
          kind: 'notice-sponsor-episode',
          subject: `Your support appears in ${e.build_title}, episode ${e.number}: ${e.title}`,
          paragraphs: [
            `${e.owner_name} published episode ${e.number} of ${e.build_title}, “${e.title}”, with ${lineWord} supported by ${s.name}.`,
            ...(disclosure ? [disclosure] : []),
          ],
          links: [
            { label: 'Read the episode', path: episodePath },
            { label: `The summary of ${s.name}`, path: `/sponsors/${encodeURIComponent(s.slug)}` },
          ],
          reason: `You are a member of ${s.name} on Rivet & Reel; an admin can remove you from it.`,
        }),
      );
      mailed += 1;
    }
  }
  return mailed;
}
