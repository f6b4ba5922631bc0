import { useCallback } from 'react';
import { QueryState } from '../components/ui/query-state';
import { useSearchParams } from 'react-router';
import { buttonClass } from '../components/ui/button';
import { PageHeading } from '../components/ui/page-heading';
import { Pagination } from '../components/ui/pagination';
import { StateMessage } from '../components/ui/state-message';
import { buildEpisodesOptions, useBuildEpisodes } from '../features/builds/api/get-build-episodes';
import { buildTotalsOptions, useBuildTotals } from '../features/parts/api/get-build-totals';
import { ledgerOptions, ledgerQueryFrom, ledgerSearch, useLedger } from '../features/parts/api/get-ledger';
import { LedgerFilters } from '../features/parts/components/ledger/ledger-filters';
import { LedgerImport } from '../features/parts/components/ledger/ledger-import';
import { LedgerTable } from '../features/parts/components/ledger/ledger-table';
import { LinesTotals } from '../features/parts/components/lines-totals';
import { SpendCharts } from '../features/parts/components/spend-charts';
import { SpendSummary } from '../features/parts/components/spend-summary';
import { workbenchPaths } from '../features/workbench/paths';
import type { Build } from '../shared/schemas/builds';
import type { LedgerQuery } from '../shared/schemas/parts';
import type { LoaderDeps } from './route-guards';
import { BuildCrumbs, loadTeamBuild, TeamBuild, useBuildIdParam } from './workbench-build-frame';
import { primeOrRouteError } from './workbench-loading';

/** Build team only: one page of the ledger for the URL's filter, the build's totals (drafts included) and its episodes. */
export function buildLedgerLoader(deps: LoaderDeps) {
  return async ({ request, params }: { request: Request; params: { buildId?: string } }) => {
    const { buildId } = await loadTeamBuild(deps, request, params.buildId);
    const q = ledgerQueryFrom(new URL(request.url).searchParams);
    await Promise.all([
      primeOrRouteError(deps.queryClient.ensureQueryData(ledgerOptions(deps.api, buildId, q))),
      primeOrRouteError(deps.queryClient.ensureQueryData(buildTotalsOptions(deps.api, buildId, 'all'))),
      primeOrRouteError(deps.queryClient.ensureQueryData(buildEpisodesOptions(deps.api, buildId))),
    ]);
    return null;
  };
}

export function BuildLedgerPage() {
  const buildId = useBuildIdParam();
  return <TeamBuild buildId={buildId}>{(build) => <LedgerScreen build={build} />}</TeamBuild>;
}

function LedgerScreen({ build }: { build: Build }) {
  const [searchParams] = useSearchParams();
  const query = ledgerQueryFrom(searchParams);
  const totals = useBuildTotals(build.id, 'all');
  const episodes = useBuildEpisodes(build.id);
  const systemName = useCallback((key: string | null) => build.systems.find((s) => s.key === key)?.name ?? key, [build.systems]);
  const href = (q: LedgerQuery) => workbenchPaths.buildLedger(build.id, ledgerSearch(q));

  return (
    <>
      <title>{`Ledger of ${build.title} — Rivet & Reel`}</title>
      <meta name="robots" content="noindex" />
      <BuildCrumbs build={build} here="Ledger" />
      <PageHeading label="Build ledger" title={build.title}>
        Every part line of every episode, drafts included, with the build’s totals in {build.currency}.
      </PageHeading>
      <nav aria-label="Ledger files" className="mt-5 flex flex-wrap gap-3">
        {/* A plain link: the browser downloads the file the server names. */}
        <a href={`/api/builds/${build.id}/ledger.csv`} download className={buttonClass('secondary')}>
          Export CSV
        </a>
        <a href="#import-heading" className={buttonClass('secondary')}>
          Import CSV
        </a>
      </nav>

      <section aria-labelledby="spend-heading" className="mt-10">
        <h2 id="spend-heading" className="label-condensed mb-4 border-b-2 border-ink pb-2">
          Spend of the build
        </h2>
        {totals.data ? (
          <div className="space-y-6">
            <SpendSummary totals={totals.data} />
            <SpendCharts totals={totals.data} />
          </div>
        ) : (
          <Loading error={totals.error} what="The build’s totals" retry={() => void totals.refetch()} busy={totals.isFetching} />
        )}
      </section>

      <section aria-labelledby="lines-heading" className="mt-12">
        <h2 id="lines-heading" className="label-condensed mb-4 border-b-2 border-ink pb-2">
          Part lines
        </h2>
        <LedgerFilters
          query={query}
          resetHref={workbenchPaths.buildLedger(build.id)}
          options={{ episodes: episodes.data?.items ?? [], systems: build.systems, suppliers: totals.data?.bySupplier ?? [] }}
        />
        <div className="mt-6">
          <LedgerLines build={build} query={query} href={href} systemName={systemName} />
        </div>
      </section>

      <section aria-labelledby="import-heading" className="mt-12 max-w-3xl">
        <h2 id="import-heading" className="label-condensed mb-4 border-b-2 border-ink pb-2">
          Import CSV
        </h2>
        <LedgerImport buildId={build.id} />
      </section>
    </>
  );
}

function LedgerLines({
  build,
  query,
  href,
  systemName,
}: {
  build: Build;
  query: LedgerQuery;
  href: (q: LedgerQuery) => string;
  systemName: (key: string | null) => string | null;
}) {
  const { data, error, isFetching, refetch, isPlaceholderData } = useLedger(build.id, query);
  if (!data) return <Loading error={error} what="The ledger" retry={() => void refetch()} busy={isFetching} />;
  const filtered = Boolean(query.episodeId || query.systemKey || query.supplierId || query.kind || query.status);
  const totalPages = Math.max(1, Math.ceil(data.total / data.perPage));
  if (data.items.length === 0) {
    return (
      <StateMessage
        kind="empty"
        title={filtered ? 'No part line matches this filter.' : data.total > 0 ? `There is no page ${query.page}.` : 'No part lines yet.'}
      >
        {!filtered && data.total === 0 ? <p>Lines added in the episode editor, or imported below, appear here.</p> : null}
      </StateMessage>
    );
  }
  return (
    <div aria-busy={isPlaceholderData || undefined}>
      <p className="mb-3 text-[15px] text-slate" role="status">
        {filtered
          ? data.total === 1
            ? 'One line matches the filter'
            : `${data.total} lines match the filter`
          : data.total === 1
            ? 'One line'
            : `${data.total} lines`}
        ; {isPlaceholderData ? 'loading…' : `page ${data.page} of ${totalPages}.`}
      </p>
      <LedgerTable
        lines={data.items}
        query={query}
        currency={build.currency}
        systemName={systemName}
        editorHref={workbenchPaths.episodeEditor}
        sortHref={(sort, dir) => href({ ...query, sort, dir, page: 1 })}
      />
      <Pagination page={data.page} totalPages={totalPages} hrefFor={(page) => href({ ...query, page })} label="Pages of the ledger" />
      <LinesTotals totals={data.totals} title={filtered ? 'Totals of the filter' : 'Totals of every line'} />
    </div>
  );
}

function Loading({ error, what, retry, busy }: { error: Error | null; what: string; retry: () => void; busy: boolean }) {
  return (
    <QueryState
      showMessage
      error={error}
      isFetching={busy}
      refetch={retry}
      errorTitle={`${what} could not be loaded.`}
      loadingTitle={`Loading… ${what.toLowerCase()}`}
    />
  );
}
