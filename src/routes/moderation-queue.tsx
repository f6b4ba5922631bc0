import { PageHeading } from '../components/ui/page-heading';
import { QueryState } from '../components/ui/query-state';
import { moderationQueueOptions, useModerationQueue } from '../features/posts/api/get-moderation-queue';
import { ModerationList } from '../features/posts/components/moderation-list';
import { requireAccount, rethrowAsRouteError, routeError, type LoaderDeps } from './route-guards';

export function moderationQueueLoader(deps: LoaderDeps) {
  return async ({ request }: { request: Request }) => {
    const account = await requireAccount(deps, request);
    if (!account.isAdmin) routeError(403);
    await deps.queryClient.ensureQueryData(moderationQueueOptions(deps.api)).catch(rethrowAsRouteError);
    return null;
  };
}

/** Admins: reported and hidden posts; hide or restore with a recorded reason. */
export function ModerationQueuePage() {
  const { data, error, refetch, isFetching } = useModerationQueue();
  return (
    <>
      <title>Moderation queue — Rivet &amp; Reel</title>
      <meta name="robots" content="noindex" />
      <PageHeading label="Admin" title="Moderation queue">
        Posts people reported, and posts that are hidden. Hidden posts vanish for everyone but their author, the build team and admins.
      </PageHeading>
      {data ? (
        <ModerationList queue={data} />
      ) : (
        <QueryState
          error={error}
          isFetching={isFetching}
          refetch={refetch}
          errorTitle="The queue could not be loaded."
          loadingTitle="Loading the queue…"
        />
      )}
    </>
  );
}
