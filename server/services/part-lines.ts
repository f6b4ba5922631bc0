import { sql, type Kysely } from 'kysely';
import { partLineProblems, type PartLine, type PartLineInput } from '../../src/shared/schemas/parts';
import type { Database } from '../db/database';
import type { Db } from '../db/kysely';
import { listLines, type LineScope } from '../db/part-lines.queries';
import { HttpError } from '../http/http-error';
import { presentPartLine } from '../presenters/part-lines';

type Trx = Kysely<Database>;

const invalid = (fields: Record<string, string>, prefix = '') =>
  new HttpError(
    400,
    'invalid_request',
    `Check ${Object.keys(fields).join(', ')}`,
    Object.fromEntries(Object.entries(fields).map(([k, v]) => [`${prefix}${k}`, [v]])),
  );

/** A supplier id as stored: a merged record stands for the one it was merged into. */
async function liveSupplier(trx: Trx, id: number): Promise<number | null> {
  let current: number | null = id;
  for (let hops = 0; current !== null && hops < 10; hops += 1) {
    const s = await trx.selectFrom('suppliers').select(['id', 'merged_into_id']).where('id', '=', current).executeTakeFirst();
    if (!s) return null;
    if (s.merged_into_id === null) return s.id;
    current = s.merged_into_id;
  }
  return null;
}

/**
 * Checks a line against its build (currency and rate, systems, supplier, open item) and returns the
 * column values; a problem answers 400 naming the field (with `prefix`, e.g. "rows.3.").
 */
export async function lineValues(trx: Trx, buildId: number, line: PartLineInput, prefix = '') {
  const build = await trx.selectFrom('builds').select(['currency']).where('id', '=', buildId).executeTakeFirstOrThrow();
  const problems = partLineProblems(line, build.currency);
  if (line.systemKey !== null) {
    const s = await trx
      .selectFrom('build_systems')
      .select('id')
      .where('build_id', '=', buildId)
      .where('key', '=', line.systemKey)
      .executeTakeFirst();
    if (!s) problems.systemKey = 'not one of this build’s systems';
  }
  let supplierId: number | null = null;
  if (line.supplierId !== null) {
    supplierId = await liveSupplier(trx, line.supplierId);
    if (supplierId === null) problems.supplierId = 'no such supplier';
  }
  if (line.openItemId !== null) {
    const o = await trx
      .selectFrom('open_items')
      .select('id')
      .where('id', '=', line.openItemId)
      .where('build_id', '=', buildId)
      .executeTakeFirst();
    if (!o) problems.openItemId = 'not an open item of this build';
  }
  if (line.receiptMediaId !== null) {
    const r = await trx
      .selectFrom('media')
      .select('id')
      .where('id', '=', line.receiptMediaId)
      .where('build_id', '=', buildId)
      .where('kind', '=', 'receipt')
      .executeTakeFirst();
    if (!r) problems.receiptMediaId = 'not a receipt of this build';
  }
  if (line.sponsorId !== null) {
    const sp = await trx.selectFrom('sponsors').select('id').where('id', '=', line.sponsorId).executeTakeFirst();
    if (!sp) problems.sponsorId = 'no such sponsor';
  }
  if (Object.keys(problems).length) throw invalid(problems, prefix);
  return {
    kind: line.kind,
    description: line.description,
    part_number: line.partNumber,
    supplier_id: supplierId,
    system_key: line.systemKey,
    at_seconds: line.atSeconds,
    source: line.source,
    status: line.status,
    quantity: line.quantity,
    unit: line.unit,
    unit_price_minor: line.unitPriceMinor,
    currency: line.currency,
    tax_rate_bp: line.taxRateBp,
    tax_included: line.taxIncluded,
    fx_rate: line.fxRate,
    avoided_cost_minor: line.avoidedCostMinor,
    buy_url: line.buyUrl,
    affiliate: line.affiliate,
    open_item_id: line.openItemId,
    receipt_media_id: line.receiptMediaId,
    support_kind: line.supportKind,
    sponsor_id: line.sponsorId,
    list_price_minor: line.listPriceMinor,
  };
}

/** One line as the API shows it. */
export async function getPartLine(db: Db | Trx, lineId: number): Promise<PartLine | null> {
  const row = await db.selectFrom('part_lines').select(['episode_id']).where('id', '=', lineId).executeTakeFirst();
  if (!row) return null;
  const { rows } = await listLines(db as Db, { episodeId: row.episode_id }, {});
  const found = rows.find((r) => r.id === lineId);
  return found ? presentPartLine(found) : null;
}

/** Lines of an episode in their order, with the episode's totals. */
export async function episodeLines(db: Db, episodeId: number) {
  const { rows } = await listLines(db, { episodeId } satisfies LineScope, { sort: 'episode' });
  return rows.map(presentPartLine);
}

/** Adds a line at the end of the episode's list (or at `position`, for undoing a delete). */
export async function createPartLine(db: Db, episodeId: number, line: PartLineInput, position?: number): Promise<number> {
  return db.transaction().execute(async (trx) => {
    const e = await trx.selectFrom('episodes').select(['build_id']).where('id', '=', episodeId).forUpdate().executeTakeFirstOrThrow();
    const values = await lineValues(trx, e.build_id, line);
    const max = await trx
      .selectFrom('part_lines')
      .select((eb) => eb.fn.max('position').as('p'))
      .where('episode_id', '=', episodeId)
      .executeTakeFirst();
    const row = await trx
      .insertInto('part_lines')
      .values({ ...values, build_id: e.build_id, episode_id: episodeId, position: position ?? Number(max?.p ?? -1) + 1 })
      .returning('id')
      .executeTakeFirstOrThrow();
    return row.id;
  });
}

/** Changes the fields sent; the whole line is checked again as it will be stored. */
export async function updatePartLine(db: Db, lineId: number, changes: Partial<PartLineInput>): Promise<void> {
  await db.transaction().execute(async (trx) => {
    const current = await trx.selectFrom('part_lines').selectAll().where('id', '=', lineId).forUpdate().executeTakeFirstOrThrow();
    const merged: PartLineInput = {
      kind: current.kind,
      description: current.description,
      partNumber: current.part_number,
      supplierId: current.supplier_id,
      systemKey: current.system_key,
      atSeconds: current.at_seconds,
      source: current.source,
      status: current.status,
      quantity: current.quantity,
      unit: current.unit as PartLineInput['unit'],
      unitPriceMinor: current.unit_price_minor,
      currency: current.currency,
      taxRateBp: current.tax_rate_bp,
      taxIncluded: current.tax_included,
      fxRate: current.fx_rate,
      avoidedCostMinor: current.avoided_cost_minor,
      buyUrl: current.buy_url,
      affiliate: current.affiliate,
      openItemId: current.open_item_id,
      receiptMediaId: current.receipt_media_id,
      supportKind: current.support_kind,
      sponsorId: current.sponsor_id,
      listPriceMinor: current.list_price_minor,
      ...changes,
    };
    // A line moved into the build's own currency drops its rate, and out of it needs one.
    const values = await lineValues(trx, current.build_id, merged);
    await trx
      .updateTable('part_lines')
      .set({ ...values, updated_at: sql<Date>`now()` })
      .where('id', '=', lineId)
      .execute();
  });
}

export async function deletePartLine(db: Db, lineId: number): Promise<void> {
  await db.deleteFrom('part_lines').where('id', '=', lineId).execute();
}
