import { sql, type Kysely } from 'kysely';
import { paths } from '../../src/shared/paths';
import type { SupportKind } from '../../src/shared/schemas/sponsors';
import type { Database } from '../db/database';
import { noticeMail } from './notice-mail';
import type { AppDeps } from '../app-deps';
import { noticeRecipients } from './notice-recipients';

type Trx = Kysely<Database>;
type NoticeDeps = Pick<AppDeps, 'outbox' | 'config'>;

/** The facts a disclosure is made of: who supported what, any paid sponsorship running, affiliate links. */
export interface DisclosureFacts {
  supports: Array<{ sponsorName: string; kind: SupportKind }>;
  paidSponsors: string[];
  affiliate: boolean;
}

const KIND_WORDS: Record<SupportKind, string> = { gifted: 'gifted', discounted: 'discounted', paid: 'paid for' };

const list = (names: string[]) =>
  names.length <= 1 ? (names[0] ?? '') : `${names.slice(0, -1).join(', ')} and ${names[names.length - 1]}`;

/**
 * The episode's disclosure line for the notice e-mail. The sponsors issue's shared disclosure module
 * (src/shared/disclosure.ts, built in parallel) is the one wording for every place a disclosure
 * shows; when it is merged, this function's body becomes a call to it with the same facts, so the
 * e-mail and the episode page say the same thing. Until then it states the same facts plainly.
 */
export function disclosureLine(f: DisclosureFacts): string | null {
  const parts: string[] = [];
  for (const kind of ['gifted', 'discounted', 'paid'] as const) {
    const names = [...new Set(f.supports.filter((s) => s.kind === kind).map((s) => s.sponsorName))].sort();
    if (names.length) parts.push(`parts ${KIND_WORDS[kind]} by ${list(names)}`);
  }
  const paid = [...new Set(f.paidSponsors)].sort();
  if (paid.length) parts.push(`a paid sponsorship by ${list(paid)}`);
  if (f.affiliate) parts.push('affiliate links (the creator may earn from purchases made through them)');
  return parts.length ? `Disclosure: this episode includes ${list(parts)}.` : null;
}

/** Reads an episode's disclosure facts as stored. */
export async function episodeDisclosureFacts(trx: Trx, episodeId: number): Promise<DisclosureFacts> {
  const supports = await trx
    .selectFrom('part_lines as pl')
    .innerJoin('sponsors as s', 's.id', 'pl.sponsor_id')
    .select(['s.name', 'pl.support_kind'])
    .distinct()
    .where('pl.episode_id', '=', episodeId)
    .where('pl.support_kind', 'is not', null)
    .execute();
  const affiliate = await trx
    .selectFrom('part_lines')
    .select('id')
    .where('episode_id', '=', episodeId)
    .where('affiliate', '=', true)
    .where('buy_url', 'is not', null)
    .limit(1)
    .executeTakeFirst();
  // A paid sponsorship whose dates hold the episode's publication day (UTC).
  const paid = await trx
    .selectFrom('sponsorships as sp')
    .innerJoin('episodes as e', 'e.build_id', 'sp.build_id')
    .innerJoin('sponsors as s', 's.id', 'sp.sponsor_id')
    .select('s.name')
    .where('e.id', '=', episodeId)
    .where('sp.kind', '=', 'paid')
    .where(sql<boolean>`sp.starts_on <= (coalesce(e.published_at, now()) at time zone 'UTC')::date`)
    .where(sql<boolean>`(sp.ends_on is null or sp.ends_on >= (coalesce(e.published_at, now()) at time zone 'UTC')::date)`)
    .execute();
  return {
    supports: supports.map((r) => ({ sponsorName: r.name, kind: r.support_kind! })),
    paidSponsors: paid.map((p) => p.name),
    affiliate: affiliate !== undefined,
  };
}

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
  const disclosure = disclosureLine(await episodeDisclosureFacts(trx, episodeId));
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
