import { lazy, Suspense, useEffect, useState } from 'react';
import { QueryState } from '../../../components/ui/query-state';
import { Form, Link } from 'react-router';
import { Button, ButtonLink, buttonClass } from '../../../components/ui/button';
import { Pagination } from '../../../components/ui/pagination';
import { Plate } from '../../../components/ui/plate';
import { SelectField } from '../../../components/ui/select-field';
import { StateMessage } from '../../../components/ui/state-message';
import { TextField } from '../../../components/ui/text-field';
import { formatTime } from '../../../shared/chapters';
import { formatMinor } from '../../../shared/money';
import { SUPPORT_KINDS, type SponsorSummary, type SponsorSummaryLine, type SponsorSummaryQuery } from '../../../shared/schemas/sponsors';

// The chart loads in its own chunk after hydration; its figures are in the month table below it.
const SummaryChartDrawing = lazy(() => import('./summary-chart-drawing'));

const KIND_LABEL: Record<SponsorSummaryLine['kind'], string> = { gifted: 'Gifted', discounted: 'Discounted', paid: 'Paid' };

function useMounted(): boolean {
  const [mounted, setMounted] = useState(false);
  useEffect(() => setMounted(true), []);
  return mounted;
}

const money = (minor: number | null, currency: string) => (minor === null ? '—' : formatMinor(minor, currency));

/** The filter as a GET form: the URL holds it, so a filtered summary can be bookmarked, shared with a colleague and printed. */
export function SummaryFilters({
  query,
  builds,
  resetHref,
  showBuild,
}: {
  query: SponsorSummaryQuery;
  builds: SponsorSummary['builds'];
  resetHref: string;
  showBuild: boolean;
}) {
  const filtered = Boolean(query.from || query.to || query.build || query.kind);
  return (
    <Form
      method="get"
      role="search"
      aria-label="Filter the summary"
      className="grid grid-cols-1 gap-3 sm:grid-cols-2 lg:grid-cols-5 lg:items-end print:hidden"
    >
      <TextField key={`f${query.from ?? ''}`} label="From" name="from" type="date" defaultValue={query.from ?? ''} />
      <TextField key={`t${query.to ?? ''}`} label="To" name="to" type="date" defaultValue={query.to ?? ''} />
      {showBuild ? (
        <SelectField key={`b${query.build ?? ''}`} label="Build" name="build" defaultValue={query.build ?? ''}>
          <option value="">All builds</option>
          {builds.map((b) => (
            <option key={b.id} value={b.id}>
              {b.title}
            </option>
          ))}
        </SelectField>
      ) : null}
      <SelectField key={`k${query.kind ?? ''}`} label="Kind of support" name="kind" defaultValue={query.kind ?? ''}>
        <option value="">All kinds</option>
        {SUPPORT_KINDS.map((k) => (
          <option key={k} value={k}>
            {KIND_LABEL[k]}
          </option>
        ))}
      </SelectField>
      <div className="flex flex-wrap gap-2">
        <Button type="submit">Filter</Button>
        {filtered ? <ButtonLink to={resetHref}>Clear</ButtonLink> : null}
      </div>
    </Form>
  );
}

/** Totals per currency, never added across currencies. */
export function SummaryTotals({ totals }: { totals: SponsorSummary['totals'] }) {
  return (
    <ul className="grid grid-cols-1 gap-4 sm:grid-cols-2" aria-label="Totals per currency">
      {totals.map((t) => (
        <li key={t.currency} className="border border-rule bg-card px-4 py-3">
          <p className="label-condensed">Value given · {t.currency}</p>
          <p className="mt-1 font-mono text-2xl text-ink">{formatMinor(t.valueGivenMinor, t.currency)}</p>
          <p className="mt-1 text-[15px] text-ink-2">
            <span className="font-mono">{t.lines}</span> {t.lines === 1 ? 'line' : 'lines'} in{' '}
            <span className="font-mono">{t.episodes}</span> {t.episodes === 1 ? 'episode' : 'episodes'} of{' '}
            <span className="font-mono">{t.builds}</span> {t.builds === 1 ? 'build' : 'builds'}
          </p>
          {t.firstOn ? (
            <p className="text-[15px] text-slate">
              First shown <span className="font-mono">{t.firstOn}</span>, last <span className="font-mono">{t.lastOn}</span>
            </p>
          ) : null}
        </li>
      ))}
    </ul>
  );
}

/** The chart of value given over time, with the same figures as a table (the chart is decorative). */
export function SummaryChart({ series }: { series: SponsorSummary['series'] }) {
  const mounted = useMounted();
  if (!series.length) return null;
  return (
    <div className="space-y-4">
      <div aria-hidden="true" inert className="min-h-[220px] overflow-hidden border border-rule bg-card p-3 print:hidden">
        {mounted ? (
          <Suspense fallback={null}>
            <SummaryChartDrawing series={series} />
          </Suspense>
        ) : null}
      </div>
      <div className="overflow-x-auto">
        <table className="w-full max-w-md border-collapse text-[15px]">
          <caption className="label-condensed pb-2 text-left">Value given by month</caption>
          <thead>
            <tr className="border-b-2 border-ink text-left font-condensed text-[13px] tracking-[0.1em] text-slate uppercase">
              <th scope="col" className="py-2 pr-2">
                Month
              </th>
              <th scope="col" className="py-2 text-right">
                Value given
              </th>
            </tr>
          </thead>
          <tbody>
            {series.map((p) => (
              <tr key={`${p.month}-${p.currency}`} className="border-b border-rule">
                <th scope="row" className="py-1.5 pr-2 text-left font-mono font-normal">
                  {p.month}
                </th>
                <td className="py-1.5 text-right font-mono">{formatMinor(p.valueGivenMinor, p.currency)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </div>
  );
}

/** Every supported line: where it appeared, a link straight to its moment, its money and its kind. */
export function SummaryLines({ lines, showBuild }: { lines: SponsorSummaryLine[]; showBuild: boolean }) {
  const th = 'py-2 pr-3 font-condensed text-[13px] font-semibold tracking-[0.1em] text-slate uppercase';
  return (
    <div className="overflow-x-auto print:overflow-visible" tabIndex={0} role="region" aria-label="Supported part lines">
      <table className="w-full min-w-[52rem] border-collapse text-[15px] print:min-w-0">
        <thead>
          <tr className="border-b-2 border-ink text-left">
            <th scope="col" className={th}>
              Shown
            </th>
            {showBuild ? (
              <th scope="col" className={th}>
                Build
              </th>
            ) : null}
            <th scope="col" className={th}>
              Episode and moment
            </th>
            <th scope="col" className={th}>
              Part
            </th>
            <th scope="col" className={`${th} text-right`}>
              Qty
            </th>
            <th scope="col" className={`${th} text-right`}>
              List price
            </th>
            <th scope="col" className={`${th} text-right`}>
              Paid
            </th>
            <th scope="col" className={`${th} text-right`}>
              Value given
            </th>
            <th scope="col" className={th}>
              Support
            </th>
          </tr>
        </thead>
        <tbody>
          {lines.map((l) => (
            <tr key={l.lineId} className="border-b border-rule align-top">
              <td className="py-2 pr-3 font-mono whitespace-nowrap">
                {l.unpublished ? <Plate tone="caution">Not yet published</Plate> : l.publishedOn}
              </td>
              {showBuild ? (
                <td className="py-2 pr-3">
                  <Link to={l.build.path}>{l.build.title}</Link>
                </td>
              ) : null}
              <td className="py-2 pr-3">
                <Link to={l.momentPath}>
                  Ep. <span className="font-mono">{l.episode.number}</span> · {l.episode.title}
                  {l.atSeconds !== null ? (
                    <>
                      {' '}
                      at <span className="font-mono text-oxide">{formatTime(l.atSeconds)}</span>
                    </>
                  ) : null}
                </Link>
                {l.chapter ? <span className="block text-sm text-slate">{l.chapter.title}</span> : null}
              </td>
              <td className="py-2 pr-3">{l.description}</td>
              <td className="py-2 pr-3 text-right font-mono">{l.quantity}</td>
              <td className="py-2 pr-3 text-right font-mono">{money(l.listPriceMinor, l.currency)}</td>
              <td className="py-2 pr-3 text-right font-mono">{money(l.unitPriceMinor, l.currency)}</td>
              <td className="py-2 pr-3 text-right font-mono">{money(l.valueGivenMinor, l.currency)}</td>
              <td className="py-2 pr-3">
                <Plate tone="brass">{KIND_LABEL[l.kind]}</Plate>
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

/** The whole summary below its heading: filters, files, totals, chart and the paged lines, with empty, loading and error states. */
export function SummaryBody({
  data,
  error,
  busy,
  retry,
  query,
  hrefFor,
  resetHref,
  csvHref,
  showBuild,
}: {
  data: SponsorSummary | undefined;
  error: Error | null;
  busy: boolean;
  retry: () => void;
  query: SponsorSummaryQuery;
  hrefFor: (q: SponsorSummaryQuery) => string;
  resetHref: string;
  csvHref: string;
  showBuild: boolean;
}) {
  if (!data) {
    return (
      <QueryState
        showMessage
        error={error}
        isFetching={busy}
        refetch={retry}
        errorTitle="The summary could not be loaded."
        loadingTitle="Loading the summary…"
      />
    );
  }
  const filtered = Boolean(query.from || query.to || query.build || query.kind);
  const totalPages = Math.max(1, Math.ceil(data.lines.total / data.lines.perPage));
  return (
    <div className="space-y-10">
      <SummaryFilters query={query} builds={data.builds} resetHref={resetHref} showBuild={showBuild} />
      <nav aria-label="Summary files" className="flex flex-wrap gap-3 print:hidden">
        {/* A plain link: the browser downloads the file the server names. */}
        <a href={csvHref} download className={buttonClass('secondary')}>
          Export CSV
        </a>
        <Button variant="secondary" onClick={() => window.print()}>
          Print
        </Button>
      </nav>
      {data.lines.total === 0 ? (
        <StateMessage
          kind="empty"
          title={filtered ? 'No supported line matches this filter.' : 'No supported lines yet.'}
          action={filtered ? <ButtonLink to={resetHref}>Show everything</ButtonLink> : undefined}
        >
          {!filtered ? <p>Lines appear here once an episode that carries this support is published.</p> : null}
        </StateMessage>
      ) : (
        <>
          <section aria-labelledby="totals-heading">
            <h2 id="totals-heading" className="label-condensed mb-4 border-b-2 border-ink pb-2">
              {filtered ? 'Totals of the filter' : 'Totals'}
            </h2>
            <SummaryTotals totals={data.totals} />
          </section>
          <section aria-labelledby="time-heading" className="print:break-inside-avoid">
            <h2 id="time-heading" className="label-condensed mb-4 border-b-2 border-ink pb-2">
              Over time
            </h2>
            <SummaryChart series={data.series} />
          </section>
          <section aria-labelledby="lines-heading">
            <h2 id="lines-heading" className="label-condensed mb-4 border-b-2 border-ink pb-2">
              Where the support appeared
            </h2>
            <p className="mb-3 text-[15px] text-slate" role="status">
              {data.lines.total === 1 ? 'One line' : `${data.lines.total} lines`}; page {data.lines.page} of {totalPages}.
            </p>
            {data.lines.items.length ? (
              <SummaryLines lines={data.lines.items} showBuild={showBuild} />
            ) : (
              <StateMessage
                kind="empty"
                title={`There is no page ${query.page}.`}
                action={<ButtonLink to={hrefFor({ ...query, page: 1 })}>First page</ButtonLink>}
              />
            )}
            <div className="print:hidden">
              <Pagination
                page={data.lines.page}
                totalPages={totalPages}
                hrefFor={(page) => hrefFor({ ...query, page })}
                label="Pages of the summary"
              />
            </div>
          </section>
        </>
      )}
    </div>
  );
}
