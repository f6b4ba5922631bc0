import { formatMinor } from '../../../shared/money';
import type { BuildTotals } from '../../../shared/schemas/parts';

/** The build's money story in one strip: spent against budget (with a gauge), on order, needed, saved, sold. */
export function SpendSummary({ totals }: { totals: BuildTotals }) {
  const t = totals.totals;
  const money = (m: number) => formatMinor(m, t.currency);
  const budget = totals.budgetMinor;
  const share = budget ? Math.min(1, t.spent.grossMinor / budget) : null;
  const over = budget !== null && t.spent.grossMinor > budget;
  return (
    <div className="border border-rule bg-card">
      <dl className="grid grid-cols-2 sm:grid-cols-5">
        <Cell label="Spent" value={money(t.spent.grossMinor)} hint="arrived and fitted, tax included" />
        <Cell label="On order" value={money(t.committedMinor)} tone="text-brass-text" />
        <Cell label="Still needed" value={money(t.plannedMinor)} />
        <Cell label="Saved by reuse" value={money(t.savedByReuseMinor)} tone="text-gauge" />
        <Cell label="Parts sold" value={money(t.salesMinor)} hint={`net spend ${money(totals.netOfSalesMinor)}`} />
      </dl>
      {budget !== null ? (
        <div className="border-t border-rule px-4 py-3">
          <p className="flex flex-wrap justify-between gap-2 text-[15px]">
            <span>
              Spent against the budget of <span className="font-mono">{money(budget)}</span>
            </span>
            <span className={`font-mono ${over ? 'font-semibold text-oxide-2' : 'text-gauge'}`}>
              {Math.round((t.spent.grossMinor / budget) * 100)} %{over ? ' — over budget' : ''}
            </span>
          </p>
          <div
            role="meter"
            aria-label="Spent against budget"
            aria-valuemin={0}
            aria-valuemax={budget}
            aria-valuenow={Math.min(t.spent.grossMinor, budget)}
            aria-valuetext={`${money(t.spent.grossMinor)} of ${money(budget)}`}
            className="mt-2 border border-ink bg-paper"
          >
            {/* An SVG width, not an inline style: the Content-Security-Policy allows no style attributes. */}
            <svg viewBox="0 0 100 10" preserveAspectRatio="none" className="block h-2.5 w-full" aria-hidden="true">
              <rect width={(share ?? 0) * 100} height="10" className={over ? 'fill-oxide-2' : 'fill-gauge'} />
            </svg>
          </div>
        </div>
      ) : null}
      {t.unconverted ? (
        <p className="border-t border-rule px-4 py-2 text-[14px] text-caution">
          {t.unconverted} {t.unconverted === 1 ? 'line is' : 'lines are'} in another currency without a recorded rate and left out of these
          figures.
        </p>
      ) : null}
    </div>
  );
}

function Cell({ label, value, hint, tone = '' }: { label: string; value: string; hint?: string; tone?: string }) {
  return (
    <div className="border-rule px-4 py-3 not-last:border-r max-sm:[&:nth-child(2n)]:border-r-0">
      <dt className="font-condensed text-xs font-semibold tracking-label text-slate uppercase">{label}</dt>
      <dd className={`mt-1 font-mono text-lg ${tone}`}>{value}</dd>
      {hint ? <dd className="text-[13px] text-slate">{hint}</dd> : null}
    </div>
  );
}
