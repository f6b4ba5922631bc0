import { SupportTag } from './support-tag';
import { useState } from 'react';
import { Plate } from '../../../components/ui/plate';
import { formatTime } from '../../../shared/chapters';
import { formatMinor } from '../../../shared/money-format';
import type { BuildTotals, EpisodeParts, PartLine } from '../../../shared/schemas/parts';

type Grouping = 'chapter' | 'system';
interface ChapterRef {
  startSeconds: number;
  title: string;
}
interface SystemRef {
  key: string;
  name: string;
  safetyCritical: boolean;
}

const SOURCE_LABEL: Record<PartLine['source'], string> = {
  new: 'New',
  used: 'Used',
  reconditioned: 'Reconditioned',
  reused: 'Reused',
  made: 'Made',
};
const STATUS_LABEL: Record<PartLine['status'], string> = {
  needed: 'Still needed',
  'on-order': 'On order',
  arrived: 'Arrived',
  fitted: 'Fitted',
  returned: 'Returned',
};

/** The chapter that holds a moment: the last one starting at or before it. */
function chapterOf(chapters: readonly ChapterRef[], at: number | null): ChapterRef | null {
  if (at === null) return null;
  let found: ChapterRef | null = null;
  for (const c of chapters) if (c.startSeconds <= at) found = c;
  return found;
}

/**
 * The episode's parts list for readers (LOOK.md "Parts table"): grouped by chapter or by system, at
 * the reader's choice; totals in the footer and a strip with the episode, reuse, system and build
 * figures. On a phone the rows stack.
 */
export function PublicPartsTable({
  parts,
  chapters,
  systems,
  buildTotals,
}: {
  parts: EpisodeParts;
  chapters: readonly ChapterRef[];
  systems: readonly SystemRef[];
  buildTotals: BuildTotals | undefined;
}) {
  const [grouping, setGrouping] = useState<Grouping>('chapter');
  const currency = parts.totals.currency;
  const money = (m: number, c = currency) => formatMinor(m, c);
  const systemByKey = new Map(systems.map((s) => [s.key, s]));
  const groups = new Map<string, { label: string; order: number; lines: PartLine[] }>();
  for (const line of parts.items) {
    let key: string;
    let label: string;
    // Groups follow the video (chapters) or the build's own order (systems); the rest come last.
    let order = Number.MAX_SAFE_INTEGER;
    if (grouping === 'chapter') {
      const c = chapterOf(chapters, line.atSeconds);
      key = c ? `c${c.startSeconds}` : 'none';
      label = c ? `${formatTime(c.startSeconds)} · ${c.title}` : 'Not tied to a chapter';
      if (c) order = c.startSeconds;
    } else {
      const s = line.systemKey ? systemByKey.get(line.systemKey) : undefined;
      key = s ? `s${s.key}` : 'none';
      label = s ? s.name : 'No system';
      if (s) order = systems.indexOf(s);
    }
    if (!groups.has(key)) groups.set(key, { label, order, lines: [] });
    groups.get(key)!.lines.push(line);
  }
  // The system this episode spent most on, for the "system to date" figure.
  const spentBySystem = new Map<string, number>();
  for (const l of parts.items)
    if (l.systemKey && l.kind !== 'sale' && (l.status === 'arrived' || l.status === 'fitted'))
      spentBySystem.set(l.systemKey, (spentBySystem.get(l.systemKey) ?? 0) + (l.buildAmounts?.grossMinor ?? 0));
  const mainKey = [...spentBySystem.entries()].sort((a, b) => b[1] - a[1])[0]?.[0];
  const mainSystem = mainKey ? buildTotals?.bySystem.find((s) => s.key === mainKey) : undefined;

  return (
    <section aria-labelledby="parts-heading" className="mt-10">
      <div className="flex flex-wrap items-end justify-between gap-3 border-b-2 border-ink pb-2">
        <h2 id="parts-heading" className="label-condensed">
          Parts in this episode
        </h2>
        <div role="group" aria-label="Group the parts" className="flex gap-1">
          {(['chapter', 'system'] as const).map((g) => (
            <button
              key={g}
              type="button"
              aria-pressed={grouping === g}
              onClick={() => setGrouping(g)}
              className={`min-h-9 border px-2.5 font-condensed text-[13px] font-semibold tracking-[0.1em] uppercase ${grouping === g ? 'border-ink bg-ink text-paper' : 'border-rule bg-card text-ink-2 hover:border-ink'}`}
            >
              By {g}
            </button>
          ))}
        </div>
      </div>
      <table className="w-full border-collapse text-[15px] max-sm:block">
        <thead className="max-sm:sr-only">
          <tr className="border-b border-rule text-left font-condensed text-[13px] tracking-[0.1em] text-slate uppercase">
            <th scope="col" className="py-2 pr-2 font-semibold">
              Part
            </th>
            <th scope="col" className="py-2 pr-2 font-semibold">
              System
            </th>
            <th scope="col" className="py-2 pr-2 font-semibold">
              Source
            </th>
            <th scope="col" className="py-2 pr-2 text-right font-semibold">
              Qty
            </th>
            <th scope="col" className="py-2 pr-2 text-right font-semibold">
              Unit
            </th>
            <th scope="col" className="py-2 text-right font-semibold">
              Total
            </th>
          </tr>
        </thead>
        {[...groups.values()]
          .sort((a, b) => a.order - b.order)
          .map((g) => (
            <tbody key={g.label} className="max-sm:block">
              <tr className="max-sm:block">
                <th
                  colSpan={6}
                  scope="colgroup"
                  className="pt-4 pb-1 text-left font-condensed text-sm font-semibold tracking-[0.08em] text-oxide-2 uppercase max-sm:block"
                >
                  {g.label}
                </th>
              </tr>
              {g.lines.map((l) => (
                <Row
                  key={l.id}
                  line={l}
                  system={l.systemKey ? systemByKey.get(l.systemKey) : undefined}
                  money={money}
                  buildCurrency={currency}
                />
              ))}
            </tbody>
          ))}
        <tfoot className="max-sm:block">
          <tr className="border-t-2 border-ink font-semibold max-sm:flex max-sm:justify-between">
            <td colSpan={5} className="py-2 pr-2">
              Spent (arrived and fitted), tax included
              <span className="block text-[13px] font-normal text-slate">
                net {money(parts.totals.spent.netMinor)} + tax {money(parts.totals.spent.taxMinor)}
              </span>
            </td>
            <td className="py-2 text-right font-mono">{money(parts.totals.spent.grossMinor)}</td>
          </tr>
          {parts.totals.committedMinor ? (
            <tr className="max-sm:flex max-sm:justify-between">
              <td colSpan={5} className="py-1 pr-2">
                On order
              </td>
              <td className="py-1 text-right font-mono text-brass-text">{money(parts.totals.committedMinor)}</td>
            </tr>
          ) : null}
          {parts.totals.plannedMinor ? (
            <tr className="max-sm:flex max-sm:justify-between">
              <td colSpan={5} className="py-1 pr-2">
                Still needed
              </td>
              <td className="py-1 text-right font-mono">{money(parts.totals.plannedMinor)}</td>
            </tr>
          ) : null}
          {parts.totals.salesMinor ? (
            <tr className="max-sm:flex max-sm:justify-between">
              <td colSpan={5} className="py-1 pr-2">
                Parts sold
              </td>
              <td className="py-1 text-right font-mono text-gauge">{money(parts.totals.salesMinor)}</td>
            </tr>
          ) : null}
        </tfoot>
      </table>
      <dl className="mt-3.5 grid grid-cols-2 border border-rule bg-card sm:grid-cols-4">
        <Strip label="Episode spent" value={money(parts.totals.spent.grossMinor)} />
        <Strip label="Saved by reuse" value={money(parts.totals.savedByReuseMinor)} tone="text-gauge" />
        {mainSystem ? (
          <Strip
            label={`${mainSystem.name} to date`}
            value={money(mainSystem.spentMinor)}
            extra={mainSystem.budgetMinor !== null ? `of ${money(mainSystem.budgetMinor)} budget` : undefined}
            tone={mainSystem.budgetMinor !== null && mainSystem.spentMinor > mainSystem.budgetMinor ? 'text-oxide-2' : ''}
          />
        ) : (
          <Strip label="System to date" value="—" />
        )}
        <Strip label="Build to date" value={buildTotals ? money(buildTotals.totals.spent.grossMinor) : '—'} />
      </dl>
      <p className="mt-2 text-[13px] text-slate">
        Prices as the creator paid them; a line bought in another currency is converted at the rate they recorded. Totals count arrived and
        fitted parts; returned ones count for nothing.
      </p>
    </section>
  );
}

function Row({
  line: l,
  system,
  money,
  buildCurrency,
}: {
  line: PartLine;
  system: SystemRef | undefined;
  money: (m: number, c?: string) => string;
  buildCurrency: string;
}) {
  return (
    <tr className="border-b border-rule align-top max-sm:grid max-sm:grid-cols-[1fr_auto] max-sm:gap-x-3 max-sm:py-2">
      <td className="py-2 pr-2 max-sm:col-start-1 max-sm:p-0">
        {l.description}
        {l.status === 'returned' ? <span className="ml-2 text-[13px] text-slate">(returned)</span> : null}
        <span className="block font-mono text-xs text-slate">
          {[l.supplier?.name, l.partNumber].filter(Boolean).join(' · ')}
          {l.buyUrl ? (
            <>
              {l.supplier || l.partNumber ? ' · ' : ''}
              <a href={l.buyUrl} rel={l.affiliate ? 'sponsored noopener noreferrer' : 'noopener noreferrer'} className="font-sans">
                where to buy{l.affiliate ? ' (affiliate link)' : ''}
              </a>
            </>
          ) : null}
        </span>
      </td>
      <td className="py-2 pr-2 max-sm:col-start-1 max-sm:inline max-sm:p-0">
        {system ? <Plate tone={system.safetyCritical ? 'oxide' : 'ink'}>{system.name}</Plate> : null}
      </td>
      <td className="py-2 pr-2 max-sm:col-start-1 max-sm:p-0">
        <span
          className={`font-condensed text-xs font-medium tracking-[0.08em] uppercase ${l.status === 'on-order' ? 'text-brass-text' : l.source === 'reused' || l.source === 'made' ? 'text-gauge' : 'text-ink-2'}`}
        >
          {l.status === 'on-order' || l.status === 'needed' ? STATUS_LABEL[l.status] : SOURCE_LABEL[l.source]}
        </span>
        {l.kind === 'sale' ? <span className="ml-1 font-condensed text-xs tracking-[0.08em] text-gauge uppercase">· sold</span> : null}
        {l.supportKind ? (
          <span className="mt-1 block">
            <SupportTag line={l} />
          </span>
        ) : null}
      </td>
      <td className="py-2 pr-2 text-right font-mono max-sm:hidden">
        {l.quantity}
        {l.unit !== 'each' ? <span className="text-xs text-slate"> {l.unit}</span> : null}
      </td>
      <td className="py-2 pr-2 text-right font-mono max-sm:hidden">{money(l.unitPriceMinor, l.currency)}</td>
      <td className="py-2 text-right font-mono max-sm:col-start-2 max-sm:row-start-1 max-sm:p-0">
        {money(l.amounts.grossMinor, l.currency)}
        {l.currency !== buildCurrency && l.buildAmounts ? (
          <span className="block text-xs text-slate">
            {money(l.buildAmounts.grossMinor)} at {l.fxRate}
          </span>
        ) : null}
      </td>
    </tr>
  );
}

function Strip({ label, value, extra, tone = '' }: { label: string; value: string; extra?: string; tone?: string }) {
  return (
    <div className="border-rule px-3.5 py-3 not-last:border-r max-sm:[&:nth-child(2n)]:border-r-0">
      <dt className="font-condensed text-xs font-semibold tracking-label text-slate uppercase">{label}</dt>
      <dd className={`mt-1 font-mono text-lg ${tone}`}>{value}</dd>
      {extra ? <dd className="text-[13px] text-slate">{extra}</dd> : null}
    </div>
  );
}
