import { Link } from 'react-router';
import { PageHeading } from '../components/ui/page-heading';
import { Plate } from '../components/ui/plate';
import { StateMessage } from '../components/ui/state-message';
import { useSession } from '../features/accounts/api/get-session';
import { accountPaths } from '../features/accounts/paths';
import type { Account } from '../shared/schemas/accounts';
import { SignedOutState } from './signed-out-state';

/** The builds whose team the person is on, each with a link to its team page. */
export function AccountBuildsPage() {
  const { data, error } = useSession();
  return (
    <>
      <title>Build teams — Rivet &amp; Reel</title>
      <meta name="robots" content="noindex" />
      <PageHeading label="Account" title="Build teams">
        The builds you own or help edit. Owners invite editors and remove them; editors see who else is on the team.
      </PageHeading>
      <div className="mt-8 max-w-3xl">
        {data?.account ? (
          <BuildList builds={data.account.builds} />
        ) : data ? (
          <SignedOutState returnTo={accountPaths.builds()} />
        ) : error ? (
          <StateMessage kind="error" title="Your build teams could not be loaded.">
            <p>{error.message}</p>
          </StateMessage>
        ) : (
          <StateMessage kind="loading" title="Loading your build teams…" />
        )}
      </div>
    </>
  );
}

function BuildList({ builds }: { builds: Account['builds'] }) {
  if (builds.length === 0) {
    return (
      <StateMessage kind="empty" title="You are not on any build team yet.">
        <p>Start a build and you become its owner; or accept an owner’s invitation to help edit theirs.</p>
      </StateMessage>
    );
  }
  return (
    <ul className="divide-y divide-rule border-y border-rule bg-card">
      {builds.map((b) => (
        <li key={b.buildId} className="flex flex-wrap items-center justify-between gap-x-4 gap-y-2 px-4 py-3">
          <span className="min-w-0">
            <span className="block font-semibold">{b.buildTitle}</span>
            <Plate tone={b.role === 'owner' ? 'oxide' : 'slate'}>{b.role}</Plate>
          </span>
          <Link
            to={accountPaths.team(b.buildId)}
            className="font-semibold underline underline-offset-2"
            aria-label={`Build team of ${b.buildTitle}`}
          >
            Build team
          </Link>
        </li>
      ))}
    </ul>
  );
}
