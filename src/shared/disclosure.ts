import type { SponsorRef, SupportKind } from './schemas/sponsors';

// The disclosure an episode carries when work in it was supported (DESIGN.md "Disclosure").
//
// The rules this follows, in our own words:
// - UK: CAP Code rule 2.1 (marketing must be obviously identifiable as such) and the CAP/ASA/CMA
//   "Influencers' guide to making clear that ads are ads" (2023): a clear label such as "Ad", up
//   front, visible on every device, not buried; gifted items and affiliate links are disclosed too.
// - US: FTC Endorsement Guides, 16 CFR Part 255 (§255.5): a material connection — payment, free or
//   discounted products, commission — is disclosed clearly and conspicuously: hard to miss, easy to
//   understand.
// So: any supported part line, any affiliate link, or publication within a paid sponsorship's dates
// makes a disclosure necessary; it names what kind of support and from whom, in plain sentences, and
// the label says "Ad" whenever money changed hands (a paid sponsorship, a paid line, a commission).

/** Supported lines of one sponsor and kind (sponsor null: not named yet — a draft). */
export interface SupportGroup {
  sponsor: SponsorRef | null;
  kind: SupportKind;
  lines: number;
}

export interface DisclosureFacts {
  support: readonly SupportGroup[];
  /** Lines whose where-to-buy link is an affiliate link. */
  affiliateLinks: number;
  /** The build's paid sponsorships (other kinds are disclosed through their lines). */
  paidSponsorships: ReadonlyArray<{ sponsor: SponsorRef; startsOn: string; endsOn: string | null }>;
  /** The day the episode is (or would be) published, YYYY-MM-DD in UTC. */
  publicationDay: string;
}

export interface Disclosure {
  /** The short label shown first: "Ad", "Gifted", "Discounted" or "Gifted and discounted". */
  label: string;
  /** Plain sentences: what kind of support, from whom. */
  text: string;
  /** Everyone credited, by name. */
  sponsors: SponsorRef[];
  /** Some where-to-buy links are affiliate links. */
  affiliate: boolean;
}

const count = (n: number, one: string, many = `${one}s`) => `${n === 1 ? 'one' : n} ${n === 1 ? one : many}`;

function joinAnd(parts: readonly string[]): string {
  if (parts.length <= 1) return parts[0] ?? '';
  return `${parts.slice(0, -1).join(', ')} and ${parts[parts.length - 1]}`;
}

/** True when a sponsorship running from `startsOn` to `endsOn` (inclusive, open-ended when null) covers `day`. */
export function coversDay(s: { startsOn: string; endsOn: string | null }, day: string): boolean {
  return s.startsOn <= day && (s.endsOn === null || day <= s.endsOn);
}

/** The disclosure an episode needs, or null when nothing in it was supported. */
export function buildDisclosure(facts: DisclosureFacts): Disclosure | null {
  const paid = facts.paidSponsorships.filter((s) => coversDay(s, facts.publicationDay));
  const support = facts.support.filter((g) => g.lines > 0);
  if (!support.length && !paid.length && facts.affiliateLinks <= 0) return null;

  const sponsors = new Map<number, SponsorRef>();
  const sentences: string[] = [];

  const paidNames = [...new Map(paid.map((s) => [s.sponsor.id, s.sponsor])).values()].sort((a, b) => a.name.localeCompare(b.name));
  for (const s of paidNames) sponsors.set(s.id, s);
  if (paidNames.length)
    sentences.push(
      `This episode is sponsored: ${joinAnd(paidNames.map((s) => s.name))} ${paidNames.length === 1 ? 'pays' : 'pay'} for a sponsorship of this build.`,
    );

  // One sentence per sponsor, in name order; lines without a sponsor yet come last.
  const bySponsor = new Map<string, { sponsor: SponsorRef | null; kinds: Record<SupportKind, number> }>();
  for (const g of support) {
    const key = g.sponsor ? `s${g.sponsor.id}` : 'none';
    const entry = bySponsor.get(key) ?? { sponsor: g.sponsor, kinds: { gifted: 0, discounted: 0, paid: 0 } };
    entry.kinds[g.kind] += g.lines;
    bySponsor.set(key, entry);
  }
  const entries = [...bySponsor.values()].sort((a, b) =>
    a.sponsor && b.sponsor ? a.sponsor.name.localeCompare(b.sponsor.name) : a.sponsor ? -1 : b.sponsor ? 1 : 0,
  );
  for (const { sponsor, kinds } of entries) {
    if (sponsor) sponsors.set(sponsor.id, sponsor);
    const what = [
      kinds.gifted ? `gave ${count(kinds.gifted, 'part')} shown here free of charge` : null,
      kinds.discounted ? `sold ${count(kinds.discounted, 'part')} shown here at a discount` : null,
      kinds.paid ? `paid for ${count(kinds.paid, 'part')} to be shown here` : null,
    ].filter((x): x is string => x !== null);
    sentences.push(`${sponsor ? sponsor.name : 'A supplier not yet named'} ${joinAnd(what)}.`);
  }

  if (facts.affiliateLinks > 0)
    sentences.push(
      facts.affiliateLinks === 1
        ? 'One where-to-buy link is an affiliate link: the creator earns a commission on what you buy through it.'
        : `${facts.affiliateLinks} where-to-buy links are affiliate links: the creator earns a commission on what you buy through them.`,
    );

  const total = (k: SupportKind) => support.filter((g) => g.kind === k).reduce((n, g) => n + g.lines, 0);
  const money = paid.length > 0 || total('paid') > 0 || facts.affiliateLinks > 0;
  const label = money ? 'Ad' : total('gifted') && total('discounted') ? 'Gifted and discounted' : total('gifted') ? 'Gifted' : 'Discounted';
  return { label, text: sentences.join(' '), sponsors: [...sponsors.values()], affiliate: facts.affiliateLinks > 0 };
}

/** The disclosure as one line for places with no room for a tag: feeds, share cards, e-mail, the video description. */
export function disclosureLine(d: Pick<Disclosure, 'label' | 'text'>): string {
  return `${d.label}: ${d.text}`;
}

/** A short form for a share card's description, where space is tight: the label and who supported the episode. */
export function disclosureShort(d: Disclosure): string {
  if (!d.sponsors.length) return disclosureLine(d);
  const names = joinAnd(d.sponsors.map((s) => s.name));
  return `${d.label}: supported by ${names}.${d.affiliate ? ' Contains affiliate links.' : ''}`;
}
