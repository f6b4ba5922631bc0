import type { ReactNode } from 'react';
import { Link, useParams } from 'react-router';
import { Button, ButtonLink } from '../components/ui/button';
import { StateMessage } from '../components/ui/state-message';
import { buildOptions, useBuild } from '../features/builds/api/get-build';
import { workbenchPaths } from '../features/workbench/paths';
import type { Build } from '../shared/schemas/builds';
import { NotFound } from './not-found';
import { requireAccount, routeError, type LoaderDeps } from './route-guards';
import { parseId, primeOrRouteError } from './workbench-loading';

/**
 * Loads a build for its team's screens: signed in, and on the build team — anyone else gets the
 * 404 page, as for anything hidden. Returns the build (or null when it failed softly) and the id.
 */
export async function loadTeamBuild(
  deps: LoaderDeps,
  request: Request,
  rawId: string | undefined,
): Promise<{ buildId: number; build: Build | null }> {
  await requireAccount(deps, request);
  const buildId = parseId(rawId);
  if (buildId === null) routeError(404);
  const build = await primeOrRouteError(deps.queryClient.fetchQuery(buildOptions(deps.api, buildId)));
  if (build && build.role === null) routeError(404);
  return { buildId, build };
}

/** The build id of the current path, or null for a malformed one. */
export function useBuildIdParam(): number | null {
  return parseId(useParams().buildId);
}

/** Reads the build for a team screen and shows its loading, error, hidden and deleted states; renders `children` for a live build. */
export function TeamBuild({ buildId, children }: { buildId: number | null; children: (build: Build) => ReactNode }) {
  if (buildId === null) return <NotFound />;
  return <TeamBuildById buildId={buildId}>{children}</TeamBuildById>;
}

function TeamBuildById({ buildId, children }: { buildId: number; children: (build: Build) => ReactNode }) {
  const { data, error, isFetching, refetch } = useBuild(buildId);
  if (!data) {
    return error ? (
      <StateMessage
        kind="error"
        title="The build could not be loaded."
        action={
          <Button onClick={() => void refetch()} disabled={isFetching}>
            {isFetching ? 'Trying again…' : 'Try again'}
          </Button>
        }
      >
        <p>{error.message}</p>
      </StateMessage>
    ) : (
      <StateMessage kind="loading" title="Loading the build…" />
    );
  }
  // Left the team while here (the loader answered 404 otherwise).
  if (data.role === null) return <NotFound />;
  if (data.deletedAt) {
    return (
      <StateMessage
        kind="empty"
        title={`${data.title} is deleted.`}
        action={<ButtonLink to={workbenchPaths.home()}>Go to the Workbench</ButtonLink>}
      >
        <p>Its owner can undo the deletion from the Workbench for 30 days.</p>
      </StateMessage>
    );
  }
  return <>{children(data)}</>;
}

/** "Workbench / Build title / Settings" above a build's screens. */
export function BuildCrumbs({ build, here }: { build: Build; here?: string }) {
  return (
    <p className="mb-4 font-condensed text-sm font-semibold tracking-label text-slate uppercase">
      <Link to={workbenchPaths.home()} className="text-ink-2 underline underline-offset-2">
        Workbench
      </Link>{' '}
      /{' '}
      {here ? (
        <>
          <Link to={workbenchPaths.build(build.id)} className="text-ink-2 underline underline-offset-2">
            {build.title}
          </Link>{' '}
          / {here}
        </>
      ) : (
        build.title
      )}
    </p>
  );
}
