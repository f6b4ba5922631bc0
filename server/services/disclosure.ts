import { sql } from 'kysely';
import { buildDisclosure, type Disclosure } from '../../src/shared/disclosure';
import type { SupportKind } from '../../src/shared/schemas/sponsors';
import type { Db } from '../db/kysely';
import { presentSponsorRef } from '../presenters/sponsors';
import { sponsorRefQuery } from './sponsorships';

/** The UTC day of a moment, YYYY-MM-DD. */
const utcDay = (d: Date) => d.toISOString().slice(0, 10);

/**
 * The disclosure an episode needs (or null), from what is stored now: its supported lines grouped by
 * sponsor and kind, its affiliate links, and the build's paid sponsorships on the day it is (or
 * would be) published — `at` when the caller is about to schedule it, else the publication time,
 * else the scheduled time, else today.
 */
export async function episodeDisclosure(db: Db, episodeId: number, opts: { at?: Date } = {}): Promise<Disclosure | null> {
  const e = await db
    .selectFrom('episodes')
    .select(['build_id', 'status', 'published_at', 'publish_at'])
    .where('id', '=', episodeId)
    .executeTakeFirst();
  if (!e) return null;
  const [groups, affiliate, paid] = await Promise.all([
    db
      .selectFrom('part_lines')
      .select(['sponsor_id', 'support_kind', sql<number>`count(*)::int`.as('lines')])
      .where('episode_id', '=', episodeId)
      .where('support_kind', 'is not', null)
      .groupBy(['sponsor_id', 'support_kind'])
      .execute(),
    db
      .selectFrom('part_lines')
      .select(sql<number>`count(*)::int`.as('n'))
      .where('episode_id', '=', episodeId)
      .where('affiliate', '=', true)
      .where('buy_url', 'is not', null)
      .executeTakeFirstOrThrow(),
    db
      .selectFrom('sponsorships')
      .select(['sponsor_id', 'starts_on', 'ends_on'])
      .where('build_id', '=', e.build_id)
      .where('kind', '=', 'paid')
      .execute(),
  ]);
  // A line with a sponsor but no kind yet is not "supported" until its kind is set (the publish check asks for it).
  const ids = [...new Set([...groups.flatMap((g) => (g.sponsor_id ? [g.sponsor_id] : [])), ...paid.map((p) => p.sponsor_id)])];
  const refs = new Map(
    ids.length ? (await sponsorRefQuery(db).where('sp.id', 'in', ids).execute()).map((r) => [r.id, presentSponsorRef(r)]) : [],
  );
  const when =
    opts.at ??
    (e.status === 'published' && e.published_at ? e.published_at : e.status === 'scheduled' && e.publish_at ? e.publish_at : new Date());
  return buildDisclosure({
    support: groups.map((g) => ({
      sponsor: g.sponsor_id ? (refs.get(g.sponsor_id) ?? null) : null,
      kind: g.support_kind as SupportKind,
      lines: g.lines,
    })),
    affiliateLinks: affiliate.n,
    paidSponsorships: paid.flatMap((p) => {
      const sponsor = refs.get(p.sponsor_id);
      return sponsor ? [{ sponsor, startsOn: p.starts_on, endsOn: p.ends_on }] : [];
    }),
    publicationDay: utcDay(when),
  });
}
