import { buildDisclosure, type Disclosure } from '../../src/shared/disclosure';
import type { SupportKind } from '../../src/shared/schemas/sponsors';
import type { Db } from '../db/kysely';
import { presentSponsorRef } from '../presenters/sponsors';
import { findDisclosureFacts, type DisclosureFacts } from '../db/disclosure.queries';

/** The UTC day of a moment, YYYY-MM-DD. */
const utcDay = (d: Date) => d.toISOString().slice(0, 10);

/**
 * The disclosure from its facts: supported lines grouped by sponsor and kind, affiliate links, and
 * the build's paid sponsorships on the day the episode is (or would be) published — the
 * day `at` when the caller is about to schedule it, else the publication time, else the scheduled
 * time, else today.
 */
export function disclosureFromFacts(f: DisclosureFacts, at?: Date): Disclosure | null {
  const refs = new Map(f.sponsors.map((r) => [r.id, presentSponsorRef(r)]));
  const when =
    at ??
    (f.status === 'published' && f.published_at
      ? new Date(f.published_at)
      : f.status === 'scheduled' && f.publish_at
        ? new Date(f.publish_at)
        : new Date());
  return buildDisclosure({
    // A line with a sponsor but no kind yet is not "supported" until its kind is set (the publish check asks for it).
    support: f.groups.map((g) => ({
      sponsor: g.sponsor_id ? (refs.get(g.sponsor_id) ?? null) : null,
      kind: g.kind as SupportKind,
      lines: g.lines,
    })),
    affiliateLinks: f.affiliate,
    paidSponsorships: f.paid.flatMap((p) => {
      const sponsor = refs.get(p.sponsor_id);
      return sponsor ? [{ sponsor, startsOn: p.starts_on, endsOn: p.ends_on }] : [];
    }),
    publicationDay: utcDay(when),
  });
}

/** The disclosure an episode needs (or null), from what is stored now, in one query. */
export async function episodeDisclosure(db: Db, episodeId: number, opts: { at?: Date } = {}): Promise<Disclosure | null> {
  const facts = await findDisclosureFacts(db, episodeId);
  return facts ? disclosureFromFacts(facts, opts.at) : null;
}
