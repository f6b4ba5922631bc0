import type { ReactNode } from 'react';
import { Button, ButtonLink } from '../components/ui/button';
import { PageHeading } from '../components/ui/page-heading';
import { StateMessage } from '../components/ui/state-message';
import { useSession } from '../features/accounts/api/get-session';
import { useWorkbench, workbenchOptions } from '../features/workbench/api/get-workbench';
import { EpisodeQueue } from '../features/workbench/components/episode-queue';
import { PartsOnOrderPanel, UnansweredPostsPanel } from '../features/workbench/components/later-panels';
import { PendingTransfers } from '../features/workbench/components/pending-transfers';
import { RecentlyDeleted } from '../features/workbench/components/recently-deleted';
import { WorkbenchBuilds } from '../features/workbench/components/workbench-builds';
import { workbenchPaths } from '../features/workbench/paths';
import type { Workbench } from '../shared/schemas/episodes';
import { requireAccount, type LoaderDeps } from './route-guards';
import { SignedOutState } from './signed-out-state';
import { primeOrRouteError } from './workbench-loading';

/**
 * Signed in only. `fetchQuery`, not `ensureQueryData`: after a delete or an undo the cached answer
 * is marked stale, and arriving here must show the fresh one rather than flash the old.
 */
export function workbenchLoader(deps: LoaderDeps) {
  return async ({ request }: { request: Request }) => {
    await requireAccount(deps, request);
    await primeOrRouteError(deps.queryClient.fetchQuery(workbenchOptions(deps.api)));
    return null;
  };
}

export function WorkbenchPage() {
  const { data: session } = useSession();
  const signedOut = session && !session.account;
  return (
    <>
      <title>Workbench — Rivet &amp; Reel</title>
      <meta name="robots" content="noindex" />
      <div className="flex flex-wrap items-end justify-between gap-4">
        <PageHeading label="Workbench" title="Your workbench">
          Your builds, the episodes in progress and what is waiting for you.
        </PageHeading>
        {signedOut ? null : (
          <ButtonLink to={workbenchPaths.newBuild()} variant="primary">
            Start a build
          </ButtonLink>
        )}
      </div>
      <div className="mt-8">{signedOut ? <SignedOutState returnTo={workbenchPaths.home()} /> : <WorkbenchContent />}</div>
    </>
  );
}

function WorkbenchContent() {
  const { data, error, isFetching, refetch } = useWorkbench();
  if (!data) {
    return error ? (
      <StateMessage
        kind="error"
        title="Your workbench could not be loaded."
        action={
          <Button onClick={() => void refetch()} disabled={isFetching}>
            {isFetching ? 'Trying again…' : 'Try again'}
          </Button>
        }
      >
        <p>{error.message}</p>
      </StateMessage>
    ) : (
      <StateMessage kind="loading" title="Loading your workbench…" />
    );
  }
  return <WorkbenchSections data={data} />;
}

function WorkbenchSections({ data }: { data: Workbench }) {
  return (
    <div className="space-y-10">
      {data.pendingTransfers.length > 0 ? (
        <Section id="transfers" title="Builds offered to you">
          <PendingTransfers transfers={data.pendingTransfers} />
        </Section>
      ) : null}
      <Section id="builds" title="Builds">
        <WorkbenchBuilds builds={data.builds} />
      </Section>
      <div className="grid gap-10 lg:grid-cols-2">
        <Section id="drafts" title="Drafts">
          <EpisodeQueue kind="drafts" episodes={data.drafts} />
        </Section>
        <Section id="scheduled" title="Scheduled">
          <EpisodeQueue kind="scheduled" episodes={data.scheduled} />
        </Section>
        <Section id="posts" title="Unanswered posts">
          <UnansweredPostsPanel posts={data.unansweredPosts} openCount={data.openPostCount} />
        </Section>
        <Section id="parts" title="Parts on order">
          <PartsOnOrderPanel lines={data.onOrder} />
        </Section>
      </div>
      {data.deleted.length > 0 ? (
        <Section id="deleted" title="Recently deleted">
          <RecentlyDeleted items={data.deleted} />
        </Section>
      ) : null}
    </div>
  );
}

function Section({ id, title, children }: { id: string; title: string; children: ReactNode }) {
  return (
    <section aria-labelledby={`${id}-heading`} className="min-w-0">
      <h2 id={`${id}-heading`} className="label-condensed mb-4 border-b-2 border-ink pb-2">
        {title}
      </h2>
      {children}
    </section>
  );
}
