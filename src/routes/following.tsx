import { PageHeading } from '../components/ui/page-heading';
import { QueryState } from '../components/ui/query-state';
import { followingOptions, useFollowing } from '../features/following/api/queries';
import { FollowingList } from '../features/following/components/following-list';
import { requireAccount, rethrowAsRouteError, type LoaderDeps } from './route-guards';

export function followingLoader(deps: LoaderDeps) {
  return async ({ request }: { request: Request }) => {
    await requireAccount(deps, request);
    await deps.queryClient.ensureQueryData(followingOptions(deps.api)).catch(rethrowAsRouteError);
    return null;
  };
}

/** New episodes of the builds and creators this person follows. */
export function FollowingPage() {
  const { data, error, refetch, isFetching } = useFollowing();
  return (
    <>
      <title>Following — Rivet &amp; Reel</title>
      <meta name="robots" content="noindex" />
      <PageHeading label="Your reading" title="Following" />
      {data ? (
        <FollowingList data={data} />
      ) : (
        <QueryState
          error={error}
          isFetching={isFetching}
          refetch={refetch}
          errorTitle="This list could not be loaded."
          loadingTitle="Loading…"
        />
      )}
    </>
  );
}
