import { lazy, Suspense, useEffect, useState } from 'react';
import { formatMinor } from '../../../shared/money';
import type { BuildTotals } from '../../../shared/schemas/parts';

// The charts load in their own chunk, after hydration: the figures they draw are in the tables below
// them (the text alternative), which the server renders for everyone.
const SpendChartsDrawing = lazy(() => import('./spend-charts-drawing'));

function useMounted(): boolean {
  const [mounted, setMounted] = useState(false);
  useEffect(() => setMounted(true), []);
  return mounted;
}

/** Spend by system against its budget (bars) and cumulative spend against the build's budget (line), with the same figures as tables. */
export function SpendCharts({ totals }: { totals: BuildTotals }) {
  const mounted = useMounted();
  const currency = totals.totals.currency;
  const money = (m: number | null) => (m === null ? '—' : formatMinor(m, currency));
  const systems = totals.bySystem.filter((s) => s.spentMinor || s.committedMinor || s.plannedMinor || s.budgetMinor);
  return (
    <div className="space-y-6">
      {/* Inert as well as hidden: the figures are in the tables below, and nothing in a drawing takes focus. */}
      <div aria-hidden="true" inert className="min-h-[260px] overflow-hidden border border-rule bg-card p-3">
        {mounted ? (
          <Suspense fallback={null}>
            <SpendChartsDrawing totals={totals} />
          </Suspense>
        ) : null}
      </div>
      {/* Scrolls sideways on a phone: focusable so a keyboard can scroll it (axe "scrollable-region-focusable"). */}
      <div className="overflow-x-auto" tabIndex={0} role="region" aria-label="Spend by system against its budget">
        <table className="w-full min-w-[30rem] border-collapse text-[15px]">
          <caption className="label-condensed pb-2 text-left">Spend by system against its budget</caption>
          <thead>
            <tr className="border-b-2 border-ink text-left font-condensed text-[13px] tracking-[0.1em] text-slate uppercase">
              <th scope="col" className="py-2 pr-2">
                System
              </th>
              <th scope="col" className="py-2 pr-2 text-right">
                Spent
              </th>
              <th scope="col" className="py-2 pr-2 text-right">
                On order
              </th>
              <th scope="col" className="py-2 pr-2 text-right">
                Still needed
              </th>
              <th scope="col" className="py-2 text-right">
                Budget
              </th>
            </tr>
          </thead>
          <tbody>
            {systems.map((s) => {
              const over = s.budgetMinor !== null && s.spentMinor > s.budgetMinor;
              return (
                <tr key={s.key ?? 'none'} className="border-b border-rule">
                  <th scope="row" className="py-2 pr-2 text-left font-normal">
                    {s.name}
                    {over ? (
                      <span className="ml-2 font-condensed text-xs font-semibold tracking-[0.1em] text-oxide-2 uppercase">over budget</span>
                    ) : null}
                  </th>
                  <td className="py-2 pr-2 text-right font-mono">{money(s.spentMinor)}</td>
                  <td className="py-2 pr-2 text-right font-mono text-brass-text">{money(s.committedMinor)}</td>
                  <td className="py-2 pr-2 text-right font-mono">{money(s.plannedMinor)}</td>
                  <td className="py-2 text-right font-mono">{money(s.budgetMinor)}</td>
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
      {totals.byEpisode.length ? (
        <div className="overflow-x-auto" tabIndex={0} role="region" aria-label="Spend by episode, and to date">
          <table className="w-full min-w-[24rem] border-collapse text-[15px]">
            <caption className="label-condensed pb-2 text-left">Spend by episode, and to date</caption>
            <thead>
              <tr className="border-b-2 border-ink text-left font-condensed text-[13px] tracking-[0.1em] text-slate uppercase">
                <th scope="col" className="py-2 pr-2">
                  Episode
                </th>
                <th scope="col" className="py-2 pr-2 text-right">
                  Spent
                </th>
                <th scope="col" className="py-2 text-right">
                  To date
                </th>
              </tr>
            </thead>
            <tbody>
              {totals.byEpisode.map((e) => (
                <tr key={e.episodeId} className="border-b border-rule">
                  <th scope="row" className="py-2 pr-2 text-left font-normal">
                    <span className="font-mono">{e.number}</span> · {e.title}
                  </th>
                  <td className="py-2 pr-2 text-right font-mono">{money(e.spentMinor)}</td>
                  <td className="py-2 text-right font-mono">{money(e.cumulativeMinor)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      ) : null}
    </div>
  );
}
