import { useNavigate } from 'react-router';
import { ButtonLink } from '../components/ui/button';
import { PageHeading } from '../components/ui/page-heading';
import { accountPaths } from '../features/accounts/paths';
import { buildEpisodesOptions } from '../features/builds/api/get-build-episodes';
import { EpisodeList } from '../features/builds/components/episode-list';
import { NewEpisodeForm } from '../features/builds/components/new-episode-form';
import { VisibilityPlate } from '../features/builds/components/status-plates';
import { formatHours } from '../features/builds/lib/hours';
import { workbenchPaths } from '../features/workbench/paths';
import type { Build } from '../shared/schemas/builds';
import type { LoaderDeps } from './route-guards';
import { BuildCrumbs, loadTeamBuild, TeamBuild, useBuildIdParam } from './workbench-build-frame';
import { primeOrRouteError } from './workbench-loading';

export function workbenchBuildLoader(deps: LoaderDeps) {
  return async ({ request, params }: { request: Request; params: { buildId?: string } }) => {
    const { buildId } = await loadTeamBuild(deps, request, params.buildId);
    await primeOrRouteError(deps.queryClient.fetchQuery(buildEpisodesOptions(deps.api, buildId)));
    return null;
  };
}

/** The build team's page of a build: its episodes with their status, and a new one. */
export function WorkbenchBuildPage() {
  const buildId = useBuildIdParam();
  return <TeamBuild buildId={buildId}>{(build) => <BuildScreen build={build} />}</TeamBuild>;
}

function BuildScreen({ build }: { build: Build }) {
  const navigate = useNavigate();
  const owner = build.role === 'owner';
  const vehicle = [build.vehicleMake, build.vehicleModel, build.vehicleYear].filter(Boolean).join(' ');

  return (
    <>
      <title>{`${build.title} — Workbench — Rivet & Reel`}</title>
      <meta name="robots" content="noindex" />
      <BuildCrumbs build={build} />
      <PageHeading label={owner ? 'Your build' : `Build of ${build.owner.displayName}`} title={build.title}>
        {vehicle ? <p>{vehicle}</p> : null}
      </PageHeading>
      <div className="mt-4 flex flex-wrap items-center gap-x-5 gap-y-3">
        <VisibilityPlate visibility={build.visibility} />
        <span className="text-[15px] text-ink-2">
          <span className="font-mono">{build.episodeCount}</span> {build.episodeCount === 1 ? 'episode' : 'episodes'} ·{' '}
          <span className="font-mono">{formatHours(build.hoursWorked)}</span> worked
        </span>
      </div>
      <nav aria-label="Build" className="mt-5 flex flex-wrap gap-3">
        <ButtonLink to={workbenchPaths.buildLedger(build.id)}>Ledger</ButtonLink>
        <ButtonLink to={workbenchPaths.buildSettings(build.id)}>Build settings</ButtonLink>
        <ButtonLink to={accountPaths.team(build.id)}>Build team</ButtonLink>
      </nav>

      <div className="mt-10 max-w-3xl space-y-10">
        <section aria-labelledby="episodes-heading">
          <h2 id="episodes-heading" className="label-condensed mb-4 border-b-2 border-ink pb-2">
            Episodes
          </h2>
          <EpisodeList buildId={build.id} canDelete={owner} editorHref={workbenchPaths.episodeEditor} />
        </section>
        <section aria-labelledby="new-episode-heading">
          <h2 id="new-episode-heading" className="label-condensed mb-4 border-b-2 border-ink pb-2">
            New episode
          </h2>
          <NewEpisodeForm buildId={build.id} onCreated={(episode) => navigate(workbenchPaths.episodeEditor(episode.id))} />
        </section>
      </div>
    </>
  );
}
