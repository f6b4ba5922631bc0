import { z } from 'zod';
import { SUPPORT_KINDS } from '../constants/sponsors';
import { pagedList, pageQuery } from './common';

// Sponsors (DESIGN.md "Sponsor", "sponsorship", "support", "Disclosure", "Money words"): the API
// contract shared by the server, the client and the benchmarks.

export { SUPPORT_KIND_LABELS, SUPPORT_KINDS } from '../constants/sponsors';
export type { SupportKind } from '../constants/sponsors';

/** A calendar day, YYYY-MM-DD, that exists. */
export const isoDay = z
  .string()
  .regex(/^\d{4}-\d{2}-\d{2}$/, 'a date as YYYY-MM-DD')
  .refine((d) => {
    const t = new Date(`${d}T00:00:00Z`);
    return !Number.isNaN(t.getTime()) && t.toISOString().slice(0, 10) === d;
  }, 'not a real date');

export const sponsorRef = z.object({
  id: z.number().int(),
  slug: z.string(),
  name: z.string(),
  website: z.string().nullable(),
  /** Served logo URL (public), or null. */
  logoUrl: z.string().nullable(),
});
export type SponsorRef = z.infer<typeof sponsorRef>;

/** A sponsor organisation as admins edit it. */
export const sponsorInput = z
  .object({
    name: z.string().trim().min(1, 'needs a name').max(120),
    slug: z
      .string()
      .trim()
      .regex(/^[a-z0-9]+(?:-[a-z0-9]+)*$/, 'lower-case letters, digits and single hyphens')
      .max(60),
    website: z.string().trim().url('a full web address').max(300).nullable(),
  })
  .strict();
export type SponsorInput = z.infer<typeof sponsorInput>;

/** The owner adds a sponsorship to a build. */
export const sponsorshipInput = z
  .object({
    sponsorId: z.number().int().positive(),
    kind: z.enum(SUPPORT_KINDS),
    startsOn: isoDay,
    endsOn: isoDay.nullable(),
  })
  .strict()
  .refine((s) => s.endsOn === null || s.endsOn >= s.startsOn, { message: 'ends before it starts', path: ['endsOn'] });
export type SponsorshipInput = z.infer<typeof sponsorshipInput>;

export const sponsorship = z.object({
  id: z.number().int(),
  buildId: z.number().int(),
  sponsor: sponsorRef,
  kind: z.enum(SUPPORT_KINDS),
  startsOn: z.string(),
  endsOn: z.string().nullable(),
});
export type Sponsorship = z.infer<typeof sponsorship>;

/** Filters of the sponsor summary (the sponsor's screen and the build team's per-sponsor view). */
export const sponsorSummaryQuery = pageQuery.extend({
  from: isoDay.optional(),
  to: isoDay.optional(),
  /** A build's slug path `creator/build` is not needed: builds are filtered by id. */
  build: z.coerce.number().int().positive().optional(),
  kind: z.enum(SUPPORT_KINDS).optional(),
});
export type SponsorSummaryQuery = z.infer<typeof sponsorSummaryQuery>;

/** One supported part line as it appeared (or, for the build team, will appear). */
export const sponsorSummaryLine = z.object({
  lineId: z.number().int(),
  build: z.object({ id: z.number().int(), title: z.string(), path: z.string() }),
  episode: z.object({ id: z.number().int(), number: z.number().int(), title: z.string(), path: z.string() }),
  /** The chapter the line's moment falls in, if any. */
  chapter: z.object({ title: z.string(), startSeconds: z.number().int() }).nullable(),
  atSeconds: z.number().int().nullable(),
  /** Link to the moment in the episode (the episode page with `#at-<seconds>`), or the episode. */
  momentPath: z.string(),
  description: z.string(),
  quantity: z.string(),
  currency: z.string(),
  listPriceMinor: z.number().int().nullable(),
  unitPriceMinor: z.number().int(),
  valueGivenMinor: z.number().int(),
  kind: z.enum(SUPPORT_KINDS),
  /** Publication day of the episode (YYYY-MM-DD), or null while unpublished. */
  publishedOn: z.string().nullable(),
  /** Only in the build team's view: the line is not published yet. */
  unpublished: z.boolean(),
});
export type SponsorSummaryLine = z.infer<typeof sponsorSummaryLine>;

/** Totals per currency — never added across currencies. */
export const sponsorSummaryTotal = z.object({
  currency: z.string(),
  valueGivenMinor: z.number().int(),
  lines: z.number().int(),
  episodes: z.number().int(),
  builds: z.number().int(),
  firstOn: z.string().nullable(),
  lastOn: z.string().nullable(),
});

/** Value given per month and currency, for the chart. */
export const sponsorSummaryPoint = z.object({ month: z.string(), currency: z.string(), valueGivenMinor: z.number().int() });

export const sponsorSummary = z.object({
  sponsor: sponsorRef,
  totals: z.array(sponsorSummaryTotal),
  series: z.array(sponsorSummaryPoint),
  /** Builds that appear in the unfiltered summary, for the build filter. */
  builds: z.array(z.object({ id: z.number().int(), title: z.string() })),
  lines: pagedList(sponsorSummaryLine),
});
export type SponsorSummary = z.infer<typeof sponsorSummary>;

/** Sponsor organisations for pickers (public: their names and logos credit them on pages anyway). */
export const sponsorList = z.object({ items: z.array(sponsorRef) });
export type SponsorList = z.infer<typeof sponsorList>;

export const sponsorshipList = z.object({ items: z.array(sponsorship) });
export type SponsorshipList = z.infer<typeof sponsorshipList>;

/** An episode's disclosure (src/shared/disclosure.ts): a short label, plain sentences, who is credited. */
export const disclosure = z.object({ label: z.string(), text: z.string(), sponsors: z.array(sponsorRef), affiliate: z.boolean() });
export type DisclosureJson = z.infer<typeof disclosure>;
