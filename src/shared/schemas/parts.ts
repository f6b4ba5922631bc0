import { z } from 'zod';
import { currencyExponent, parseScaled, QUANTITY_SCALE, RATE_SCALE } from '../money';
import { pagedList, pageQuery } from './common';
import { SUPPORT_KINDS } from './sponsors';

// The parts list of DESIGN.md ("Part line", "Ledger", "Money words"): the API contract.

export const PART_KINDS = ['part', 'consumable', 'tool', 'service', 'sale'] as const;
export const PART_SOURCES = ['new', 'used', 'reconditioned', 'reused', 'made'] as const;
export const PART_STATUSES = ['needed', 'on-order', 'arrived', 'fitted', 'returned'] as const;
export const PART_UNITS = ['each', 'pair', 'set', 'pack', 'litre', 'millilitre', 'metre', 'kilogram', 'gram', 'hour'] as const;
export type PartKind = (typeof PART_KINDS)[number];
export type PartSource = (typeof PART_SOURCES)[number];
export type PartStatus = (typeof PART_STATUSES)[number];

/** An ISO 4217 code with a minor unit in the reference data (currency-codes). */
export const isoCurrency = z
  .string()
  .trim()
  .transform((c) => c.toUpperCase())
  .refine((c) => /^[A-Z]{3}$/.test(c) && currencyExponent(c) !== null, 'not an ISO 4217 currency code');

/** A quantity as a decimal string: more than zero, at most three decimal places. */
export const quantityText = z
  .string()
  .trim()
  .refine((q) => {
    const v = parseScaled(q, QUANTITY_SCALE);
    return v !== null && v > 0n && v < 10n ** 12n;
  }, 'a number above zero with at most three decimals');

/** An exchange rate as a decimal string: build-currency units per one unit of the line's currency. */
export const rateText = z
  .string()
  .trim()
  .refine((r) => {
    const v = parseScaled(r, RATE_SCALE);
    return v !== null && v > 0n && v < 10n ** 18n;
  }, 'a rate above zero with at most eight decimals');

const minor = z.number().int().min(0).max(1e13);

const partLineFields = {
  kind: z.enum(PART_KINDS),
  description: z.string().trim().min(1, 'needs a description').max(200),
  partNumber: z.string().trim().max(60).nullable(),
  supplierId: z.number().int().positive().nullable(),
  systemKey: z.string().max(40).nullable(),
  /** The moment in the video (the chapter's start when chosen by chapter); the chapter follows from it. */
  atSeconds: z
    .number()
    .int()
    .min(0)
    .max(48 * 3600)
    .nullable(),
  source: z.enum(PART_SOURCES),
  status: z.enum(PART_STATUSES),
  quantity: quantityText,
  unit: z.enum(PART_UNITS),
  unitPriceMinor: minor,
  currency: isoCurrency,
  /** Basis points: 2000 = 20 %. */
  taxRateBp: z.number().int().min(0).max(10_000),
  taxIncluded: z.boolean(),
  /** Needed when the line's currency differs from the build's. */
  fxRate: rateText.nullable(),
  /** What buying it would have cost, for reused and made lines only (a total for the line). */
  avoidedCostMinor: minor.nullable(),
  buyUrl: z
    .url({ protocol: /^https?$/, message: 'an http(s) link' })
    .max(500)
    .nullable(),
  affiliate: z.boolean(),
  /** Lines still needed or on order may point at the open item they wait for. */
  openItemId: z.number().int().positive().nullable(),
  /** A receipt (image or PDF) uploaded to the build's media as kind "receipt". */
  receiptMediaId: z.number().int().positive().nullable(),
  /** Support on the line (DESIGN.md "support"): its kind and the sponsor organisation that gave it. */
  supportKind: z.enum(SUPPORT_KINDS).nullable(),
  sponsorId: z.number().int().positive().nullable(),
  /** The unit price without support, in the line's currency (value given = quantity × (list − paid)). */
  listPriceMinor: minor.nullable(),
};

/** A new line: what the creator typed, with the usual defaults for what they left out. */
export const partLineInput = z.object({
  ...partLineFields,
  partNumber: partLineFields.partNumber.default(null),
  supplierId: partLineFields.supplierId.default(null),
  systemKey: partLineFields.systemKey.default(null),
  atSeconds: partLineFields.atSeconds.default(null),
  source: partLineFields.source.default('new'),
  status: partLineFields.status.default('arrived'),
  quantity: partLineFields.quantity.default('1'),
  unit: partLineFields.unit.default('each'),
  taxRateBp: partLineFields.taxRateBp.default(0),
  taxIncluded: partLineFields.taxIncluded.default(true),
  fxRate: partLineFields.fxRate.default(null),
  avoidedCostMinor: partLineFields.avoidedCostMinor.default(null),
  buyUrl: partLineFields.buyUrl.default(null),
  affiliate: partLineFields.affiliate.default(false),
  openItemId: partLineFields.openItemId.default(null),
  receiptMediaId: partLineFields.receiptMediaId.default(null),
  supportKind: partLineFields.supportKind.default(null),
  sponsorId: partLineFields.sponsorId.default(null),
  listPriceMinor: partLineFields.listPriceMinor.default(null),
});
export type PartLineInput = z.infer<typeof partLineInput>;
export type PartLineInputRaw = z.input<typeof partLineInput>;

/** Same-shaped rules that need several fields; the server applies them and names the field. */
export function partLineProblems(line: PartLineInput, buildCurrency: string): Record<string, string> {
  const problems: Record<string, string> = {};
  if (line.currency !== buildCurrency && !line.fxRate) problems.fxRate = `needs the rate you used to ${buildCurrency}`;
  if (line.currency === buildCurrency && line.fxRate) problems.fxRate = 'only for a line in another currency';
  if (line.avoidedCostMinor !== null && line.source !== 'reused' && line.source !== 'made')
    problems.avoidedCostMinor = 'only for reused or made lines';
  if (line.openItemId !== null && line.status !== 'needed' && line.status !== 'on-order')
    problems.openItemId = 'only for lines still needed or on order';
  if (line.affiliate && !line.buyUrl) problems.affiliate = 'needs the where-to-buy link';
  Object.assign(problems, supportProblems(line));
  return problems;
}

/**
 * Support rules (common practice for gifted and discounted goods; DESIGN.md "Money words"): a sale
 * carries no support; a list price belongs to a supported line and is never below the price paid;
 * a discounted line's list price is above it; a gifted line was paid nothing. Sponsor and kind may
 * be filled in one at a time on a draft — the publish check asks for both.
 */
export function supportProblems(
  line: Pick<PartLineInput, 'kind' | 'supportKind' | 'sponsorId' | 'listPriceMinor' | 'unitPriceMinor'>,
): Record<string, string> {
  const problems: Record<string, string> = {};
  const supported = line.supportKind !== null || line.sponsorId !== null;
  if (line.kind === 'sale' && supported) problems.supportKind = 'a sale line carries no support';
  if (line.listPriceMinor !== null && !supported) problems.listPriceMinor = 'only for a supported line';
  else if (line.listPriceMinor !== null && line.listPriceMinor < line.unitPriceMinor)
    problems.listPriceMinor = 'the list price cannot be below the price paid';
  else if (line.supportKind === 'discounted' && line.listPriceMinor !== null && line.listPriceMinor === line.unitPriceMinor)
    problems.listPriceMinor = 'a discounted line’s list price is above the price paid';
  if (line.supportKind === 'gifted' && line.unitPriceMinor > 0)
    problems.unitPriceMinor = 'a gifted part was paid nothing: set the price to 0';
  return problems;
}

/** An edit: only the fields sent change (no defaults fill the rest). */
export const partLineUpdate = z
  .object(partLineFields)
  .partial()
  .refine((v) => Object.keys(v).length > 0, { message: 'nothing to change', path: ['description'] });

const amounts = z.object({ netMinor: z.number().int(), taxMinor: z.number().int(), grossMinor: z.number().int() });

export const partLine = z.object({
  id: z.number().int(),
  buildId: z.number().int(),
  episodeId: z.number().int(),
  position: z.number().int(),
  kind: z.enum(PART_KINDS),
  description: z.string(),
  partNumber: z.string().nullable(),
  supplier: z.object({ id: z.number().int(), name: z.string() }).nullable(),
  systemKey: z.string().nullable(),
  atSeconds: z.number().int().nullable(),
  source: z.enum(PART_SOURCES),
  status: z.enum(PART_STATUSES),
  quantity: z.string(),
  unit: z.enum(PART_UNITS),
  unitPriceMinor: z.number().int(),
  currency: z.string(),
  taxRateBp: z.number().int(),
  taxIncluded: z.boolean(),
  fxRate: z.string().nullable(),
  avoidedCostMinor: z.number().int().nullable(),
  buyUrl: z.string().nullable(),
  affiliate: z.boolean(),
  openItem: z.object({ id: z.number().int(), title: z.string() }).nullable(),
  /** The receipt's id and type; the file is the build team's alone (GET /api/media/:id/download). */
  receipt: z.object({ id: z.number().int(), contentType: z.string() }).nullable(),
  supportKind: z.enum(SUPPORT_KINDS).nullable(),
  sponsor: z.object({ id: z.number().int(), slug: z.string(), name: z.string() }).nullable(),
  listPriceMinor: z.number().int().nullable(),
  /** round(quantity × list) − round(quantity × paid), in the line's currency; 0 without support. */
  valueGivenMinor: z.number().int(),
  /** The sponsor that stands behind the line's supplier, offered to the creator (never set by itself). */
  suggestedSponsor: z.object({ id: z.number().int(), slug: z.string(), name: z.string() }).nullable(),
  /** In the line's own currency, computed by PostgreSQL. */
  amounts,
  /** In the build's currency; null when the line's currency differs and no rate is recorded. */
  buildAmounts: amounts.extend({ avoidedMinor: z.number().int().nullable() }).nullable(),
  episode: z.object({ number: z.number().int(), title: z.string(), slug: z.string() }),
});
export type PartLine = z.infer<typeof partLine>;

const money3 = z.object({ netMinor: z.number().int(), taxMinor: z.number().int(), grossMinor: z.number().int() });

/** Totals of a set of lines in the build's currency (DESIGN.md "Money words"). */
export const partTotals = z.object({
  currency: z.string(),
  /** Arrived and fitted lines (not sales). */
  spent: money3,
  /** On order. */
  committedMinor: z.number().int(),
  /** Still needed. */
  plannedMinor: z.number().int(),
  /** Avoided cost of reused and made lines (not returned). */
  savedByReuseMinor: z.number().int(),
  /** Sale lines not returned: income. */
  salesMinor: z.number().int(),
  /** Lines in another currency without a recorded rate: left out of every figure. */
  unconverted: z.number().int(),
  lines: z.number().int(),
});
export type PartTotals = z.infer<typeof partTotals>;

export const episodeParts = z.object({ items: z.array(partLine), totals: partTotals });
export type EpisodeParts = z.infer<typeof episodeParts>;

export const buildTotals = z.object({
  totals: partTotals,
  budgetMinor: z.number().int().nullable(),
  netOfSalesMinor: z.number().int(),
  bySystem: z.array(
    z.object({
      key: z.string().nullable(),
      name: z.string(),
      budgetMinor: z.number().int().nullable(),
      spentMinor: z.number().int(),
      committedMinor: z.number().int(),
      plannedMinor: z.number().int(),
    }),
  ),
  bySupplier: z.array(
    z.object({ supplierId: z.number().int().nullable(), name: z.string(), spentMinor: z.number().int(), lines: z.number().int() }),
  ),
  byKind: z.array(z.object({ kind: z.enum(PART_KINDS), spentMinor: z.number().int(), lines: z.number().int() })),
  byEpisode: z.array(
    z.object({
      episodeId: z.number().int(),
      number: z.number().int(),
      title: z.string(),
      spentMinor: z.number().int(),
      cumulativeMinor: z.number().int(),
    }),
  ),
  /** Lines on order (at most 20), in the build's currency, with the open item each holds up. */
  onOrder: z.array(
    z.object({
      id: z.number().int(),
      description: z.string(),
      grossMinor: z.number().int().nullable(),
      episode: z.object({ number: z.number().int(), slug: z.string() }),
      openItemTitle: z.string().nullable(),
    }),
  ),
  /** True when lines of unpublished episodes are included (the build team's view). */
  includesUnpublished: z.boolean(),
});
export type BuildTotals = z.infer<typeof buildTotals>;

export const LEDGER_SORTS = ['episode', 'description', 'supplier', 'system', 'kind', 'status', 'gross'] as const;
const blank = (v: unknown) => (v === '' ? undefined : v);
export const ledgerQuery = pageQuery.extend({
  episodeId: z.preprocess(blank, z.coerce.number().int().positive().optional()),
  systemKey: z.preprocess(blank, z.string().max(40).optional()),
  supplierId: z.preprocess(blank, z.coerce.number().int().positive().optional()),
  kind: z.preprocess(blank, z.enum(PART_KINDS).optional()),
  status: z.preprocess(blank, z.enum(PART_STATUSES).optional()),
  /** "missing": lines without a receipt; "attached": lines with one. */
  receipt: z.preprocess(blank, z.enum(['missing', 'attached']).optional()),
  sort: z.enum(LEDGER_SORTS).default('episode'),
  dir: z.enum(['asc', 'desc']).default('asc'),
});
export type LedgerQuery = z.infer<typeof ledgerQuery>;
export const ledgerResponse = pagedList(partLine).extend({ totals: partTotals });
export type LedgerResponse = z.infer<typeof ledgerResponse>;

export const supplier = z.object({
  id: z.number().int(),
  name: z.string(),
  website: z.string().nullable(),
  usedInBuild: z.boolean(),
  /** The sponsor organisation that stands behind this supplier, if any (a suggestion for its lines). */
  sponsor: z.object({ id: z.number().int(), slug: z.string(), name: z.string() }).nullable(),
});
export const supplierList = z.object({ items: z.array(supplier) });
export const supplierCreate = z.object({
  name: z.string().trim().min(1, 'needs a name').max(120),
  website: z
    .url({ protocol: /^https?$/, message: 'an http(s) link' })
    .max(300)
    .nullable()
    .default(null),
});
export const supplierMerge = z.object({ intoId: z.number().int().positive() });
