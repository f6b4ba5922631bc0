import { Link, useNavigate } from 'react-router';
import { PageHeading } from '../components/ui/page-heading';
import { StateMessage } from '../components/ui/state-message';
import { useSession } from '../features/accounts/api/get-session';
import { useCreateBuild } from '../features/builds/api/build-mutations';
import { BuildForm } from '../features/builds/components/build-form';
import { newBuildValues } from '../features/builds/lib/build-form';
import { workbenchPaths } from '../features/workbench/paths';
import { DEFAULT_SYSTEMS } from '../shared/schemas/builds';
import { SignedOutState } from './signed-out-state';

const DEFAULT_KEYS: ReadonlySet<string> = new Set(DEFAULT_SYSTEMS.map((s) => s.key));

/** Start a build: the person becomes its owner and lands on the build's page. */
export function NewBuildPage() {
  const { data, error } = useSession();
  const create = useCreateBuild();
  const navigate = useNavigate();

  return (
    <>
      <title>Start a build — Rivet &amp; Reel</title>
      <meta name="robots" content="noindex" />
      <p className="mb-4 font-condensed text-sm font-semibold tracking-label text-slate uppercase">
        <Link to={workbenchPaths.home()} className="text-ink-2 underline underline-offset-2">
          Workbench
        </Link>{' '}
        / New build
      </p>
      <PageHeading label="New build" title="Start a build">
        One build for each vehicle you restore. You can change all of this later in the build’s settings.
      </PageHeading>
      <div className="mt-8">
        {data?.account ? (
          <BuildForm
            defaultValues={newBuildValues()}
            lockedKeys={DEFAULT_KEYS}
            guessCurrency
            submitLabel="Start the build"
            pendingLabel="Starting…"
            onSubmit={async (values) => {
              const saved = await create.mutateAsync(values);
              await navigate(workbenchPaths.build(saved.id), {
                state: { notice: `You started ${saved.title}. Add its first episode below.` },
              });
            }}
          />
        ) : data ? (
          <SignedOutState returnTo={workbenchPaths.newBuild()} />
        ) : error ? (
          <StateMessage kind="error" title="Your account could not be loaded.">
            <p>{error.message}</p>
          </StateMessage>
        ) : (
          <StateMessage kind="loading" title="Loading…" />
        )}
      </div>
    </>
  );
}
