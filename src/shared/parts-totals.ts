// Totals of part lines in the build's currency, by the rules of DESIGN.md ("Money words") and the
// rounding rule of ./money.ts. The server computes the same figures in SQL; tests check one against
// the other, and the editor uses this to show totals while a line is still being typed.
import { convertMinor, lineAmounts, type LineMoneyInput } from './money';
import type { PartKind, PartSource, PartStatus, PartTotals } from './schemas/parts';

export interface TotalsLine extends LineMoneyInput {
  kind: PartKind;
  source: PartSource;
  status: PartStatus;
  currency: string;
  fxRate: string | null;
  avoidedCostMinor: number | null;
}

/** A line's amounts in the build's currency, or null when it needs a rate it does not have. */
export function lineInBuildCurrency(line: TotalsLine, buildCurrency: string) {
  const own = lineAmounts(line);
  if (line.currency === buildCurrency) return { ...own, avoidedMinor: line.avoidedCostMinor };
  if (!line.fxRate) return null;
  const conv = (m: number) => convertMinor(m, line.fxRate!, line.currency, buildCurrency);
  const net = conv(own.netMinor);
  const tax = conv(own.taxMinor);
  const gross = conv(own.grossMinor);
  return {
    netMinor: net,
    taxMinor: tax,
    grossMinor: gross,
    avoidedMinor: line.avoidedCostMinor === null ? null : conv(line.avoidedCostMinor),
  };
}

/**
 * spent = arrived + fitted, committed = on order, planned = needed (sales excluded from all three);
 * sales = sale lines not returned; saved by reuse = avoided cost of reused and made lines not
 * returned; returned lines count for nothing. Each converted amount is rounded on its own line.
 */
export function computeTotals(lines: readonly TotalsLine[], buildCurrency: string): PartTotals {
  const t: PartTotals = {
    currency: buildCurrency,
    spent: { netMinor: 0, taxMinor: 0, grossMinor: 0 },
    committedMinor: 0,
    plannedMinor: 0,
    savedByReuseMinor: 0,
    salesMinor: 0,
    unconverted: 0,
    lines: lines.length,
  };
  for (const line of lines) {
    const a = lineInBuildCurrency(line, buildCurrency);
    if (!a) {
      t.unconverted += 1;
      continue;
    }
    if (line.status === 'returned') continue;
    if ((line.source === 'reused' || line.source === 'made') && a.avoidedMinor !== null) t.savedByReuseMinor += a.avoidedMinor;
    if (line.kind === 'sale') {
      t.salesMinor += a.grossMinor;
      continue;
    }
    if (line.status === 'arrived' || line.status === 'fitted') {
      t.spent.netMinor += a.netMinor;
      t.spent.taxMinor += a.taxMinor;
      t.spent.grossMinor += a.grossMinor;
    } else if (line.status === 'on-order') t.committedMinor += a.grossMinor;
    else if (line.status === 'needed') t.plannedMinor += a.grossMinor;
  }
  return t;
}
