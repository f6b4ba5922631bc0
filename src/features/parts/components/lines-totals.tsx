import { useId } from 'react';
import { formatMinor } from '../../../shared/money';
import type { PartTotals } from '../../../shared/schemas/parts';

/**
 * Totals of a set of part lines in the build's currency (an episode's, or the ledger's filter);
 * `live` when a row still being typed is counted in.
 */
export function LinesTotals({ totals, title, live = false }: { totals: PartTotals; title: string; live?: boolean }) {
  const headingId = useId();
  const money = (m: number) => formatMinor(m, totals.currency);
  const cells: Array<{ label: string; value: string; tone?: string }> = [
    { label: 'Spent, net', value: money(totals.spent.netMinor) },
    { label: 'Tax', value: money(totals.spent.taxMinor) },
    { label: 'Spent', value: money(totals.spent.grossMinor) },
    { label: 'On order', value: money(totals.committedMinor), tone: 'text-brass-text' },
    { label: 'Still needed', value: money(totals.plannedMinor) },
    { label: 'Saved by reuse', value: money(totals.savedByReuseMinor), tone: 'text-gauge' },
    { label: 'Parts sold', value: money(totals.salesMinor) },
  ];
  return (
    <div className="mt-4 border border-rule bg-card">
      <h3 id={headingId} className="sr-only">
        {title}
      </h3>
      <dl aria-labelledby={headingId} aria-live="polite" className="grid grid-cols-2 sm:grid-cols-4 lg:grid-cols-7">
        {cells.map((c) => (
          <div key={c.label} className="border-b border-rule px-3 py-2 sm:border-r">
            <dt className="font-condensed text-xs font-semibold tracking-label text-slate uppercase">{c.label}</dt>
            <dd className={`font-mono text-base ${c.tone ?? ''}`}>{c.value}</dd>
          </div>
        ))}
      </dl>
      <p className="px-3 py-2 text-[13px] text-slate">
        In {totals.currency}; spent counts arrived and fitted lines, tax included.
        {live ? ' Includes the line being typed (not saved yet).' : ''}
        {totals.unconverted ? ` ${totals.unconverted} line(s) in another currency have no rate and are left out.` : ''}
      </p>
    </div>
  );
}
