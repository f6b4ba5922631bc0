import type { BuildTotals, EpisodeParts } from '../../src/shared/schemas/parts';
import { buildBreakdowns, listLines, partTotals } from '../db/part-lines.queries';
import type { Db } from '../db/kysely';
import { episodeDisclosure } from './disclosure';
import { episodeLines } from './part-lines';

async function buildCurrency(db: Db, buildId: number): Promise<string> {
  return (await db.selectFrom('builds').select('currency').where('id', '=', buildId).executeTakeFirstOrThrow()).currency;
}

/** An episode's parts list with its totals (receipts included: the caller strips them for readers). */
export async function getEpisodeParts(db: Db, episodeId: number): Promise<EpisodeParts> {
  const e = await db.selectFrom('episodes').select('build_id').where('id', '=', episodeId).executeTakeFirstOrThrow();
  // No `await` inside the list: a rejection of the first query while the second waited would go
  // unhandled and end the process (seen under load when the pool timed out).
  const [items, totals, disclosure] = await Promise.all([
    episodeLines(db, episodeId),
    buildCurrency(db, e.build_id).then((currency) => partTotals(db, { episodeId }, currency)),
    episodeDisclosure(db, episodeId),
  ]);
  return { items, totals, disclosure };
}

/** A build's spend: totals, by system against budgets, supplier, kind and episode, and what is on order. */
export async function getBuildTotals(db: Db, buildId: number, includeUnpublished: boolean): Promise<BuildTotals> {
  const scope = { buildId, includeUnpublished };
  const b = await db.selectFrom('builds').select(['currency', 'budget_minor']).where('id', '=', buildId).executeTakeFirstOrThrow();
  const [totals, breakdowns, onOrder] = await Promise.all([
    partTotals(db, scope, b.currency),
    buildBreakdowns(db, scope),
    listLines(db, scope, { status: 'on-order', limit: 20 }),
  ]);
  return {
    totals,
    budgetMinor: b.budget_minor,
    netOfSalesMinor: totals.spent.grossMinor - totals.salesMinor,
    bySystem: breakdowns.bySystem.map((s) => ({
      key: s.key,
      name: s.name,
      budgetMinor: s.budget_minor,
      spentMinor: s.spent,
      committedMinor: s.committed,
      plannedMinor: s.planned,
    })),
    bySupplier: breakdowns.bySupplier.map((s) => ({
      supplierId: s.supplier_id,
      name: s.name ?? 'No supplier',
      spentMinor: s.spent,
      lines: s.lines,
    })),
    byKind: breakdowns.byKind.map((k) => ({ kind: k.kind, spentMinor: k.spent, lines: k.lines })),
    byEpisode: breakdowns.byEpisode.map((e) => ({
      episodeId: e.episode_id,
      number: e.number,
      title: e.title,
      spentMinor: e.spent,
      cumulativeMinor: e.cumulative,
    })),
    onOrder: onOrder.rows.map((l) => ({
      id: l.id,
      description: l.description,
      grossMinor: l.b_gross,
      episode: { number: l.episode_number, slug: l.episode_slug },
      openItemTitle: l.open_item_title,
    })),
    includesUnpublished: includeUnpublished,
  };
}
