import { useParams, useSearchParams } from 'react-router';
import { PageHeading } from '../components/ui/page-heading';
import { summaryQueryFrom, summarySearch, teamSummaryOptions, useTeamSummary } from '../features/sponsors/api/get-sponsor-summary';
import { SummaryBody } from '../features/sponsors/components/summary-view';
import { sponsorPaths } from '../features/sponsors/paths';
import type { Build } from '../shared/schemas/builds';
import type { LoaderDeps } from './route-guards';
import { routeError } from './route-guards';
import { BuildCrumbs, loadTeamBuild, TeamBuild, useBuildIdParam } from './workbench-build-frame';
import { parseId, primeOrRouteError } from './workbench-loading';

/** The build team only (anyone else: the 404 page): one sponsor's summary of the build, unpublished lines included. */
export function teamSponsorSummaryLoader(deps: LoaderDeps) {
  return async ({ request, params }: { request: Request; params: { buildId?: string; sponsorId?: string } }) => {
    const { buildId } = await loadTeamBuild(deps, request, params.buildId);
    const sponsorId = parseId(params.sponsorId);
    if (sponsorId === null) routeError(404);
    const q = summaryQueryFrom(new URL(request.url).searchParams);
    await primeOrRouteError(deps.queryClient.ensureQueryData(teamSummaryOptions(deps.api, buildId, sponsorId, q)));
    return null;
  };
}

export function TeamSponsorSummaryPage() {
  const buildId = useBuildIdParam();
  return <TeamBuild buildId={buildId}>{(build) => <TeamSummary build={build} />}</TeamBuild>;
}

function TeamSummary({ build }: { build: Build }) {
  const sponsorId = parseId(useParams().sponsorId) ?? 0;
  const [searchParams] = useSearchParams();
  const query = summaryQueryFrom(searchParams);
  const { data, error, isFetching, refetch } = useTeamSummary(build.id, sponsorId, query);
  const name = data?.sponsor.name ?? 'Sponsor';
  return (
    <>
      <title>{`${name} on ${build.title} — sponsor summary — Rivet & Reel`}</title>
      <meta name="robots" content="noindex" />
      <BuildCrumbs build={build} here={`Sponsor summary: ${name}`} />
      <PageHeading label="Sponsor summary, build team's view" title={`${name} on ${build.title}`}>
        What {name} will see of this build, with the lines of drafts and scheduled episodes included and marked “Not yet published”, so a
        report can be prepared before publishing. {name} itself sees published lines only.
      </PageHeading>
      <div className="mt-8">
        <SummaryBody
          data={data}
          error={error}
          busy={isFetching}
          retry={() => void refetch()}
          query={query}
          hrefFor={(q) => sponsorPaths.teamSummary(build.id, sponsorId, summarySearch(q))}
          resetHref={sponsorPaths.teamSummary(build.id, sponsorId)}
          csvHref={`/api/builds/${build.id}/sponsors/${sponsorId}/summary.csv?${summarySearch(query, { withPage: false })}`}
          showBuild={false}
        />
      </div>
    </>
  );
}
