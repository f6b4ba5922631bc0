import { useParams, useSearchParams } from 'react-router';
import { PageHeading } from '../components/ui/page-heading';
import { sponsorSummaryOptions, summaryQueryFrom, summarySearch, useSponsorSummary } from '../features/sponsors/api/get-sponsor-summary';
import { SummaryBody } from '../features/sponsors/components/summary-view';
import { sponsorPaths } from '../features/sponsors/paths';
import { requireAccount, type LoaderDeps } from './route-guards';
import { primeOrRouteError } from './workbench-loading';

/** Members only: anyone else (signed in) gets the 404 page, as the API answers. */
export function sponsorSummaryLoader(deps: LoaderDeps) {
  return async ({ request, params }: { request: Request; params: { slug?: string } }) => {
    await requireAccount(deps, request);
    const q = summaryQueryFrom(new URL(request.url).searchParams);
    await primeOrRouteError(deps.queryClient.ensureQueryData(sponsorSummaryOptions(deps.api, params.slug ?? '', q)));
    return null;
  };
}

/** The sponsor's screen: every published line it supported, with totals, a chart, CSV and print. */
export function SponsorSummaryPage() {
  const slug = useParams().slug ?? '';
  const [searchParams] = useSearchParams();
  const query = summaryQueryFrom(searchParams);
  const { data, error, isFetching, refetch } = useSponsorSummary(slug, query);
  const name = data?.sponsor.name ?? 'Sponsor';
  return (
    <>
      <title>{`${name} — sponsor summary — Rivet & Reel`}</title>
      <meta name="robots" content="noindex" />
      <div className="flex flex-wrap items-start gap-4">
        {data?.sponsor.logoUrl ? <img src={data.sponsor.logoUrl} alt="" className="mt-2 max-h-14 max-w-32 object-contain" /> : null}
        <PageHeading label="Sponsor summary" title={name}>
          Every part line {name} supported in a published episode of a public or unlisted build: where and when it was shown, and the value
          given (list price less the price paid). Totals are per currency.
        </PageHeading>
      </div>
      <div className="mt-8">
        <SummaryBody
          data={data}
          error={error}
          busy={isFetching}
          retry={() => void refetch()}
          query={query}
          hrefFor={(q) => sponsorPaths.summary(slug, summarySearch(q))}
          resetHref={sponsorPaths.summary(slug)}
          csvHref={`/api/sponsors/${encodeURIComponent(slug)}/summary.csv?${summarySearch(query, { withPage: false })}`}
          showBuild
        />
      </div>
    </>
  );
}
