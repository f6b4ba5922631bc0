import { z } from 'zod';
import { decimalToMinor, formatScaled, minorToDecimal, parseScaled } from '../../../shared/money';
import type { TotalsLine } from '../../../shared/parts-totals';
import type { SupportKind } from '../../../shared/schemas/sponsors';
import {
  type PART_KINDS,
  type PART_SOURCES,
  type PART_STATUSES,
  type PART_UNITS,
  partLineInput,
  partLineProblems,
  type PartLine,
  type PartLineInput,
} from '../../../shared/schemas/parts';

/** What the row's inputs hold: text as typed, turned into a `PartLineInput` only when sent. */
export interface PartLineFormValues {
  kind: (typeof PART_KINDS)[number];
  description: string;
  partNumber: string;
  /** The chosen supplier's id as text ('' for none), with its name for the autocomplete box. */
  supplierId: string;
  supplierName: string;
  systemKey: string;
  /** The chosen chapter's start in seconds as text, or '' (keeps `atSeconds` of a line that has no matching chapter). */
  chapter: string;
  source: (typeof PART_SOURCES)[number];
  status: (typeof PART_STATUSES)[number];
  quantity: string;
  unit: (typeof PART_UNITS)[number];
  /** A decimal in the line's currency ("14.40"). */
  unitPrice: string;
  currency: string;
  /** Percent ("20", "5.5"). */
  taxRate: string;
  taxIncluded: boolean;
  fxRate: string;
  avoidedCost: string;
  buyUrl: string;
  affiliate: boolean;
  openItemId: string;
  /** Carried through edits unchanged: a receipt is attached from its own control, not typed. */
  receiptMediaId: string;
  /** '' for no support, or one of SUPPORT_KINDS. */
  supportKind: '' | SupportKind;
  /** The crediting sponsor's id as text ('' for none). */
  sponsorId: string;
  /** The unit list price as a decimal in the line's currency ('' for none). */
  listPrice: string;
  /** The sponsor behind the chosen supplier, as a suggestion only (never sent). */
  suggestedSponsorId: string;
  suggestedSponsorName: string;
}
export type PartFormField = keyof PartLineFormValues;

/** Which form field shows an error the API or the schema names by its input key. */
const fieldOfInputKey: Record<string, PartFormField> = {
  supplierId: 'supplierName',
  atSeconds: 'chapter',
  unitPriceMinor: 'unitPrice',
  taxRateBp: 'taxRate',
  avoidedCostMinor: 'avoidedCost',
  listPriceMinor: 'listPrice',
};
export function formFieldOf(inputKey: string): PartFormField {
  return fieldOfInputKey[inputKey] ?? (inputKey as PartFormField);
}

export function emptyPartLineValues(currency: string, carry: Partial<PartLineFormValues> = {}): PartLineFormValues {
  return {
    kind: 'part',
    description: '',
    partNumber: '',
    supplierId: '',
    supplierName: '',
    systemKey: '',
    chapter: '',
    source: 'new',
    status: 'arrived',
    quantity: '1',
    unit: 'each',
    unitPrice: '',
    currency,
    taxRate: '0',
    taxIncluded: true,
    fxRate: '',
    avoidedCost: '',
    buyUrl: '',
    affiliate: false,
    openItemId: '',
    receiptMediaId: '',
    supportKind: '',
    sponsorId: '',
    listPrice: '',
    suggestedSponsorId: '',
    suggestedSponsorName: '',
    ...carry,
  };
}

/** The start of the chapter a moment falls in (the last one starting at or before it). */
export function chapterStartFor(atSeconds: number | null, chapterStarts: readonly number[]): number | null {
  if (atSeconds === null) return null;
  let found: number | null = null;
  for (const start of chapterStarts) if (start <= atSeconds && (found === null || start > found)) found = start;
  return found;
}

export function lineToValues(line: PartLine, chapterStarts: readonly number[]): PartLineFormValues {
  const chapter = chapterStartFor(line.atSeconds, chapterStarts);
  return {
    kind: line.kind,
    description: line.description,
    partNumber: line.partNumber ?? '',
    supplierId: line.supplier ? String(line.supplier.id) : '',
    supplierName: line.supplier?.name ?? '',
    systemKey: line.systemKey ?? '',
    chapter: chapter === null ? '' : String(chapter),
    source: line.source,
    status: line.status,
    quantity: line.quantity,
    unit: line.unit,
    unitPrice: minorToDecimal(line.unitPriceMinor, line.currency),
    currency: line.currency,
    taxRate: formatScaled(BigInt(line.taxRateBp), 2),
    taxIncluded: line.taxIncluded,
    fxRate: line.fxRate ?? '',
    avoidedCost: line.avoidedCostMinor === null ? '' : minorToDecimal(line.avoidedCostMinor, line.currency),
    buyUrl: line.buyUrl ?? '',
    affiliate: line.affiliate,
    openItemId: line.openItem ? String(line.openItem.id) : '',
    receiptMediaId: line.receipt ? String(line.receipt.id) : '',
    supportKind: line.supportKind ?? '',
    sponsorId: line.sponsor ? String(line.sponsor.id) : '',
    listPrice: line.listPriceMinor === null ? '' : minorToDecimal(line.listPriceMinor, line.currency),
    suggestedSponsorId: line.suggestedSponsor ? String(line.suggestedSponsor.id) : '',
    suggestedSponsorName: line.suggestedSponsor?.name ?? '',
  };
}

/** A saved line as the body that re-creates it (undo of a delete). */
export function lineToInput(line: PartLine): PartLineInput {
  return {
    kind: line.kind,
    description: line.description,
    partNumber: line.partNumber,
    supplierId: line.supplier?.id ?? null,
    systemKey: line.systemKey,
    atSeconds: line.atSeconds,
    source: line.source,
    status: line.status,
    quantity: line.quantity,
    unit: line.unit,
    unitPriceMinor: line.unitPriceMinor,
    currency: line.currency,
    taxRateBp: line.taxRateBp,
    taxIncluded: line.taxIncluded,
    fxRate: line.fxRate,
    avoidedCostMinor: line.avoidedCostMinor,
    buyUrl: line.buyUrl,
    affiliate: line.affiliate,
    openItemId: line.openItem?.id ?? null,
    receiptMediaId: line.receipt?.id ?? null,
    supportKind: line.supportKind,
    sponsorId: line.sponsor?.id ?? null,
    listPriceMinor: line.listPriceMinor,
  };
}

const blank = (s: string) => (s.trim() === '' ? null : s.trim());
const idOrNull = (s: string) => (s === '' ? null : Number(s));

export type ConvertResult = { ok: true; input: PartLineInput } | { ok: false; errors: Partial<Record<PartFormField, string>> };

/**
 * The typed row as the API's `PartLineInput`: money to minor units in the line's currency, the
 * tax percent to basis points, the chapter to its start — then the shared schema and the
 * cross-field rules the server applies, with each message on the field that shows it.
 */
export function valuesToInput(v: PartLineFormValues, buildCurrency: string, keepAtSeconds: number | null = null): ConvertResult {
  const errors: Partial<Record<PartFormField, string>> = {};
  const currency = v.currency.trim().toUpperCase();
  const unitPriceMinor = v.unitPrice.trim() === '' ? 0 : decimalToMinor(v.unitPrice, currency);
  if (unitPriceMinor === null || unitPriceMinor < 0) errors.unitPrice = `a price in ${currency || 'the currency'}, e.g. 14.40`;
  const bp = parseScaled(v.taxRate.trim() === '' ? '0' : v.taxRate.replace('%', ''), 2);
  if (bp === null || bp < 0n || bp > 10_000n) errors.taxRate = 'a percent from 0 to 100, e.g. 20';
  const avoided = v.avoidedCost.trim() === '' ? null : decimalToMinor(v.avoidedCost, currency);
  if (v.avoidedCost.trim() !== '' && (avoided === null || avoided < 0)) errors.avoidedCost = `an amount in ${currency}`;
  const listPrice = v.listPrice.trim() === '' ? null : decimalToMinor(v.listPrice, currency);
  if (v.listPrice.trim() !== '' && (listPrice === null || listPrice < 0))
    errors.listPrice = `a price in ${currency || 'the currency'}, e.g. 14.40`;
  // Said at once with the other problems, not only once the rest parses.
  if (currency !== buildCurrency && v.fxRate.trim() === '') errors.fxRate = `needs the rate you used to ${buildCurrency}`;
  // A typed name that was never picked would be dropped without a word: ask for the choice.
  if (v.supplierName.trim() !== '' && v.supplierId === '') errors.supplierName = 'pick a supplier from the list, or “Create supplier …”';
  const raw = {
    kind: v.kind,
    description: v.description,
    partNumber: blank(v.partNumber),
    supplierId: idOrNull(v.supplierId),
    systemKey: v.systemKey || null,
    atSeconds: v.chapter === '' ? keepAtSeconds : Number(v.chapter),
    source: v.source,
    status: v.status,
    quantity: v.quantity,
    unit: v.unit,
    unitPriceMinor: unitPriceMinor ?? 0,
    currency,
    taxRateBp: bp === null ? 0 : Number(bp),
    taxIncluded: v.taxIncluded,
    fxRate: currency === buildCurrency ? null : blank(v.fxRate),
    avoidedCostMinor: v.source === 'reused' || v.source === 'made' ? avoided : null,
    buyUrl: blank(v.buyUrl),
    affiliate: v.affiliate,
    openItemId: v.status === 'needed' || v.status === 'on-order' ? idOrNull(v.openItemId) : null,
    receiptMediaId: idOrNull(v.receiptMediaId),
    supportKind: v.supportKind === '' ? null : v.supportKind,
    sponsorId: idOrNull(v.sponsorId),
    listPriceMinor: listPrice,
  };
  const parsed = partLineInput.safeParse(raw);
  if (!parsed.success) {
    for (const issue of parsed.error.issues) {
      const field = formFieldOf(String(issue.path[0] ?? 'description'));
      errors[field] ??= issue.message;
    }
  } else {
    for (const [key, message] of Object.entries(partLineProblems(parsed.data, buildCurrency))) errors[formFieldOf(key)] ??= message;
  }
  if (Object.keys(errors).length || !parsed.success) return { ok: false, errors };
  return { ok: true, input: parsed.data };
}

/** react-hook-form's schema: the form's values in, a `PartLineInput` out, messages on the fields. */
export function partLineFormSchema(buildCurrency: string, keepAtSeconds: number | null = null) {
  return z.custom<PartLineFormValues>().transform((values, ctx) => {
    const result = valuesToInput(values, buildCurrency, keepAtSeconds);
    if (result.ok) return result.input;
    for (const [path, message] of Object.entries(result.errors)) ctx.addIssue({ code: 'custom', path: [path], message });
    return z.NEVER;
  });
}

/** Only what changed, for the PATCH: a changed currency re-sends the amounts it scales. */
export function changedInput(before: PartLineInput, after: PartLineInput): Partial<PartLineInput> {
  const out: Record<string, unknown> = {};
  for (const key of Object.keys(after) as Array<keyof PartLineInput>) {
    if (after[key] !== before[key]) out[key] = after[key];
  }
  return out as Partial<PartLineInput>;
}

/** What the totals need of a line, saved or being typed. */
export function totalsLineOf(input: PartLineInput): TotalsLine {
  return {
    kind: input.kind,
    source: input.source,
    status: input.status,
    quantity: input.quantity,
    unitPriceMinor: input.unitPriceMinor,
    taxRateBp: input.taxRateBp,
    taxIncluded: input.taxIncluded,
    currency: input.currency,
    fxRate: input.fxRate,
    avoidedCostMinor: input.avoidedCostMinor,
  };
}
