import Papa from 'papaparse';
import { sql } from 'kysely';
import { formatTime, parseTime } from '../../src/shared/chapters';
import { decimalToMinor, formatScaled, minorToDecimal, parseScaled } from '../../src/shared/money';
import { partLineInput, partLineProblems, type PartLineInput } from '../../src/shared/schemas/parts';
import type { Db } from '../db/kysely';
import { listLines } from '../db/part-lines.queries';
import { presentPartLine } from '../presenters/part-lines';
import { HttpError } from '../http/http-error';
import { lineValues } from './part-lines';

/**
 * The ledger's CSV columns, in order (README "Ledger CSV"). Money is a decimal in the line's own
 * currency ("12.34"), tax_rate a percentage ("20"), at a time in the video ("4:05"), booleans yes/no.
 */
export const LEDGER_CSV_COLUMNS = [
  'episode',
  'kind',
  'description',
  'part_number',
  'supplier',
  'system',
  'at',
  'source',
  'status',
  'quantity',
  'unit',
  'unit_price',
  'currency',
  'tax_rate',
  'tax_included',
  'fx_rate',
  'avoided_cost',
  'buy_url',
  'affiliate',
  'support',
  'sponsor',
  'list_price',
] as const;
type Column = (typeof LEDGER_CSV_COLUMNS)[number];
/** Columns a file may leave out (files written before support was recorded). */
const OPTIONAL_COLUMNS: readonly Column[] = ['support', 'sponsor', 'list_price'];

export const MAX_IMPORT_ROWS = 5000;

/** Every line of the build (drafts included: this is the build team's file), as CSV text. */
export async function exportLedgerCsv(db: Db, buildId: number): Promise<string> {
  const { rows } = await listLines(db, { buildId, includeUnpublished: true }, { sort: 'episode' });
  const data = rows
    .map(presentPartLine)
    .map((l) => [
      String(l.episode.number),
      l.kind,
      l.description,
      l.partNumber ?? '',
      l.supplier?.name ?? '',
      l.systemKey ?? '',
      l.atSeconds === null ? '' : formatTime(l.atSeconds),
      l.source,
      l.status,
      l.quantity,
      l.unit,
      minorToDecimal(l.unitPriceMinor, l.currency),
      l.currency,
      formatScaled(BigInt(l.taxRateBp), 2),
      l.taxIncluded ? 'yes' : 'no',
      l.fxRate ?? '',
      l.avoidedCostMinor === null ? '' : minorToDecimal(l.avoidedCostMinor, l.currency),
      l.buyUrl ?? '',
      l.affiliate ? 'yes' : 'no',
      l.supportKind ?? '',
      l.sponsor?.slug ?? '',
      l.listPriceMinor === null ? '' : minorToDecimal(l.listPriceMinor, l.currency),
    ]);
  // A leading =, +, - or @ would run as a formula in a spreadsheet: such text cells get a quote mark.
  return Papa.unparse({ fields: [...LEDGER_CSV_COLUMNS], data }, { escapeFormulae: true, newline: '\r\n' });
}

export interface ImportRow {
  /** 1-based, counting data rows (the header is row 0). */
  row: number;
  errors: Record<string, string>;
  description: string;
  episode: number | null;
}

interface Parsed {
  rows: ImportRow[];
  lines: Array<{ episodeId: number; line: PartLineInput; supplierName: string | null }>;
}

const yesNo = (v: string): boolean | null => (/^(yes|y|true|1)$/i.test(v) ? true : /^(no|n|false|0|)$/i.test(v) ? false : null);

/** Reads and checks every row without saving; each row lists its own problems by column. */
export async function parseLedgerCsv(db: Db, buildId: number, text: string): Promise<Parsed> {
  const parsed = Papa.parse<Record<string, string>>(text.replace(/^\uFEFF/, ''), { header: true, skipEmptyLines: 'greedy' });
  const header = parsed.meta.fields ?? [];
  const missing = LEDGER_CSV_COLUMNS.filter((c) => !header.includes(c) && !OPTIONAL_COLUMNS.includes(c));
  const unknown = header.filter((c) => !(LEDGER_CSV_COLUMNS as readonly string[]).includes(c));
  if (missing.length || unknown.length)
    throw new HttpError(400, 'invalid_request', 'The CSV does not have the ledger’s columns', {
      csv: [
        [missing.length ? `missing: ${missing.join(', ')}` : '', unknown.length ? `unknown: ${unknown.join(', ')}` : '']
          .filter(Boolean)
          .join('; '),
      ],
    });
  if (parsed.data.length > MAX_IMPORT_ROWS)
    throw new HttpError(400, 'invalid_request', `At most ${MAX_IMPORT_ROWS} rows at a time`, {
      csv: [`more than ${MAX_IMPORT_ROWS} rows`],
    });
  if (!parsed.data.length) throw new HttpError(400, 'invalid_request', 'The CSV has no rows', { csv: ['no rows under the header'] });

  const [build, episodes, systems, sponsors] = await Promise.all([
    db.selectFrom('builds').select('currency').where('id', '=', buildId).executeTakeFirstOrThrow(),
    db.selectFrom('episodes').select(['id', 'number']).where('build_id', '=', buildId).where('deleted_at', 'is', null).execute(),
    db.selectFrom('build_systems').select('key').where('build_id', '=', buildId).execute(),
    db.selectFrom('sponsors').select(['id', 'slug', 'name']).execute(),
  ]);
  // A sponsor is named by its slug (as exported) or its name.
  const sponsorByKey = new Map(sponsors.flatMap((s) => [[s.slug.toLowerCase(), s.id] as const, [s.name.toLowerCase(), s.id] as const]));
  const episodeByNumber = new Map(episodes.map((e) => [e.number, e.id]));
  const systemKeys = new Set(systems.map((s) => s.key));
  const out: Parsed = { rows: [], lines: [] };

  parsed.data.forEach((raw, i) => {
    // Undo the export's formula guard (a leading ' before = + - @), so export → import is exact.
    const cell = (c: Column) => (raw[c] ?? '').trim().replace(/^'(?=[=+\-@\t\r])/, '');
    const errors: Record<string, string> = {};
    const episodeNumber = /^\d{1,6}$/.test(cell('episode')) ? Number(cell('episode')) : null;
    const episodeId = episodeNumber === null ? undefined : episodeByNumber.get(episodeNumber);
    if (episodeId === undefined) errors.episode = 'not an episode number of this build';
    const currency = cell('currency').toUpperCase();
    const money = (c: Column, required: boolean): number | null => {
      if (!cell(c)) {
        if (required) errors[c] = 'needs an amount';
        return null;
      }
      const v = decimalToMinor(cell(c), currency);
      if (v === null || v < 0) errors[c] = `not an amount in ${currency || 'the currency'}`;
      return v;
    };
    const taxBp = cell('tax_rate') ? parseScaled(cell('tax_rate'), 2) : 0n;
    if (taxBp === null || taxBp < 0n || taxBp > 10000n) errors.tax_rate = 'a percentage from 0 to 100, at most two decimals';
    const at = cell('at') ? parseTime(cell('at')) : null;
    if (cell('at') && at === null) errors.at = 'a time such as 4:05 or 1:02:30';
    const taxIncluded = yesNo(cell('tax_included'));
    if (taxIncluded === null) errors.tax_included = 'yes or no';
    const affiliate = yesNo(cell('affiliate'));
    if (affiliate === null) errors.affiliate = 'yes or no';
    const sponsorId = cell('sponsor') ? (sponsorByKey.get(cell('sponsor').toLowerCase()) ?? null) : null;
    if (cell('sponsor') && sponsorId === null) errors.sponsor = 'no such sponsor';
    const candidate = {
      kind: cell('kind'),
      description: cell('description'),
      partNumber: cell('part_number') || null,
      supplierId: null,
      systemKey: cell('system') || null,
      atSeconds: at,
      source: cell('source') || 'new',
      status: cell('status') || 'arrived',
      quantity: cell('quantity') || '1',
      unit: cell('unit') || 'each',
      unitPriceMinor: money('unit_price', true) ?? 0,
      currency,
      taxRateBp: Number(taxBp ?? 0n),
      taxIncluded: taxIncluded ?? true,
      fxRate: cell('fx_rate') || null,
      avoidedCostMinor: money('avoided_cost', false),
      buyUrl: cell('buy_url') || null,
      affiliate: affiliate ?? false,
      openItemId: null,
      supportKind: cell('support') || null,
      sponsorId,
      listPriceMinor: money('list_price', false),
    };
    const checked = partLineInput.safeParse(candidate);
    const toColumn: Record<string, Column> = {
      partNumber: 'part_number',
      systemKey: 'system',
      atSeconds: 'at',
      unitPriceMinor: 'unit_price',
      taxRateBp: 'tax_rate',
      taxIncluded: 'tax_included',
      fxRate: 'fx_rate',
      avoidedCostMinor: 'avoided_cost',
      buyUrl: 'buy_url',
      supportKind: 'support',
      sponsorId: 'sponsor',
      listPriceMinor: 'list_price',
    };
    if (!checked.success) {
      for (const issue of checked.error.issues) {
        const key = String(issue.path[0] ?? 'row');
        errors[toColumn[key] ?? key] ??= issue.message;
      }
    } else {
      for (const [k, msg] of Object.entries(partLineProblems(checked.data, build.currency))) errors[toColumn[k] ?? k] ??= msg;
      if (checked.data.systemKey && !systemKeys.has(checked.data.systemKey)) errors.system ??= 'not one of this build’s systems';
    }
    out.rows.push({ row: i + 1, errors, description: cell('description'), episode: episodeNumber });
    if (checked.success && episodeId !== undefined && !Object.keys(errors).length)
      out.lines.push({ episodeId, line: checked.data, supplierName: cell('supplier') || null });
  });
  return out;
}

/**
 * Saves every row in one transaction, or none: any row with a problem (or any failure while
 * saving) leaves the ledger as it was. Suppliers named in the file are found by name or created.
 */
export async function importLedgerCsv(
  db: Db,
  buildId: number,
  userId: number,
  text: string,
): Promise<{ saved: boolean; imported: number; rows: ImportRow[] }> {
  const parsed = await parseLedgerCsv(db, buildId, text);
  if (parsed.rows.some((r) => Object.keys(r.errors).length)) return { saved: false, imported: 0, rows: parsed.rows };
  await db.transaction().execute(async (trx) => {
    const suppliers = new Map<string, number>();
    const positions = new Map<number, number>();
    for (const { episodeId, line, supplierName } of parsed.lines) {
      let supplierId: number | null = null;
      if (supplierName) {
        const key = supplierName.replace(/\s+/g, ' ').trim().toLowerCase();
        supplierId = suppliers.get(key) ?? null;
        if (supplierId === null) {
          const found = await trx
            .selectFrom('suppliers')
            .select('id')
            .where(sql`lower(btrim(name))`, '=', key)
            .where('merged_into_id', 'is', null)
            .executeTakeFirst();
          supplierId =
            found?.id ??
            (
              await trx
                .insertInto('suppliers')
                .values({ name: supplierName.replace(/\s+/g, ' ').trim(), created_by: userId, website: null })
                .returning('id')
                .executeTakeFirstOrThrow()
            ).id;
          suppliers.set(key, supplierId);
        }
      }
      if (!positions.has(episodeId)) {
        const max = await trx
          .selectFrom('part_lines')
          .select((eb) => eb.fn.max('position').as('p'))
          .where('episode_id', '=', episodeId)
          .executeTakeFirst();
        positions.set(episodeId, Number(max?.p ?? -1) + 1);
      }
      const position = positions.get(episodeId)!;
      positions.set(episodeId, position + 1);
      const values = await lineValues(trx, buildId, { ...line, supplierId });
      await trx
        .insertInto('part_lines')
        .values({ ...values, build_id: buildId, episode_id: episodeId, position })
        .execute();
    }
  });
  return { saved: true, imported: parsed.lines.length, rows: parsed.rows };
}
