// The disclosure rules (src/shared/disclosure.ts). Sources for what needs disclosing and how it is
// labelled: CAP/ASA/CMA "Influencers' guide to making clear that ads are ads" (2023 edition) —
// gifts and affiliate links need disclosure, paid promotion is labelled "Ad"; FTC Endorsement
// Guides, 16 CFR Part 255, §255.5 — payment, free or discounted products are material connections.
// The wording itself is our own; the expected sentences below were written out by hand.
import { describe, expect, it } from 'vitest';
import { buildDisclosure, coversDay, disclosureLine, disclosureShort, type DisclosureFacts } from '../../src/shared/disclosure';

const larch = { id: 1, slug: 'larchmere-spares', name: 'Larchmere Spares', website: null, logoUrl: null };
const tolland = { id: 2, slug: 'tolland-tools', name: 'Tolland Tools', website: 'https://tolland.example', logoUrl: null };
const none: DisclosureFacts = { support: [], affiliateLinks: 0, paidSponsorships: [], publicationDay: '2026-12-03' };

describe('buildDisclosure', () => {
  it('needs none when nothing was supported', () => {
    expect(buildDisclosure(none)).toBeNull();
    // A paid sponsorship that ended before the publication day does not count (ASA: the ad relationship must be current).
    expect(buildDisclosure({ ...none, paidSponsorships: [{ sponsor: tolland, startsOn: '2026-01-01', endsOn: '2026-12-02' }] })).toBeNull();
    expect(buildDisclosure({ ...none, support: [{ sponsor: larch, kind: 'gifted', lines: 0 }] })).toBeNull();
  });

  it('names a gift and who gave it, labelled "Gifted" (gifts need disclosure too — CAP/ASA guide)', () => {
    const d = buildDisclosure({ ...none, support: [{ sponsor: larch, kind: 'gifted', lines: 2 }] });
    expect(d).toEqual({
      label: 'Gifted',
      text: 'Larchmere Spares gave 2 parts shown here free of charge.',
      sponsors: [larch],
      affiliate: false,
    });
  });

  it('groups a sponsor’s gifted and discounted lines into one sentence', () => {
    const d = buildDisclosure({
      ...none,
      support: [
        { sponsor: larch, kind: 'discounted', lines: 1 },
        { sponsor: larch, kind: 'gifted', lines: 3 },
      ],
    });
    expect(d?.label).toBe('Gifted and discounted');
    expect(d?.text).toBe('Larchmere Spares gave 3 parts shown here free of charge and sold one part shown here at a discount.');
  });

  it('labels a paid sponsorship covering the day "Ad" and names every sponsor in name order', () => {
    const d = buildDisclosure({
      ...none,
      support: [{ sponsor: larch, kind: 'discounted', lines: 1 }],
      paidSponsorships: [{ sponsor: tolland, startsOn: '2026-11-01', endsOn: null }],
    });
    expect(d?.label).toBe('Ad');
    expect(d?.text).toBe(
      'This episode is sponsored: Tolland Tools pays for a sponsorship of this build. Larchmere Spares sold one part shown here at a discount.',
    );
    expect(d?.sponsors.map((s) => s.name)).toEqual(['Tolland Tools', 'Larchmere Spares']);
  });

  it('discloses affiliate links as advertising (a commission is a material connection — FTC §255.5)', () => {
    expect(buildDisclosure({ ...none, affiliateLinks: 1 })).toEqual({
      label: 'Ad',
      text: 'One where-to-buy link is an affiliate link: the creator earns a commission on what you buy through it.',
      sponsors: [],
      affiliate: true,
    });
    expect(buildDisclosure({ ...none, affiliateLinks: 3 })?.text).toMatch(/^3 where-to-buy links are affiliate links/);
  });

  it('still discloses a supported line whose sponsor is not named yet (a draft)', () => {
    const d = buildDisclosure({ ...none, support: [{ sponsor: null, kind: 'discounted', lines: 1 }] });
    expect(d?.label).toBe('Discounted');
    expect(d?.text).toBe('A supplier not yet named sold one part shown here at a discount.');
  });

  it('makes a short form for share cards naming the sponsors', () => {
    const d = buildDisclosure({
      ...none,
      affiliateLinks: 1,
      support: [
        { sponsor: tolland, kind: 'gifted', lines: 1 },
        { sponsor: larch, kind: 'gifted', lines: 1 },
      ],
    })!;
    expect(disclosureShort(d)).toBe('Ad: supported by Larchmere Spares and Tolland Tools. Contains affiliate links.');
    expect(disclosureShort(buildDisclosure({ ...none, affiliateLinks: 1 })!)).toBe(
      'Ad: One where-to-buy link is an affiliate link: the creator earns a commission on what you buy through it.',
    );
  });

  it('makes one line for feeds, share cards, e-mail and the video description', () => {
    expect(disclosureLine({ label: 'Ad', text: 'Tolland Tools pays.' })).toBe('Ad: Tolland Tools pays.');
  });
});

describe('coversDay', () => {
  it('includes both ends and is open-ended without an end date (common practice for contract dates)', () => {
    expect(coversDay({ startsOn: '2026-11-01', endsOn: '2026-11-30' }, '2026-11-01')).toBe(true);
    expect(coversDay({ startsOn: '2026-11-01', endsOn: '2026-11-30' }, '2026-11-30')).toBe(true);
    expect(coversDay({ startsOn: '2026-11-01', endsOn: '2026-11-30' }, '2026-12-01')).toBe(false);
    expect(coversDay({ startsOn: '2026-11-01', endsOn: null }, '2030-01-01')).toBe(true);
    expect(coversDay({ startsOn: '2026-11-01', endsOn: null }, '2026-10-31')).toBe(false);
  });
});
