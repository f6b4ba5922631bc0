import { Link, useParams } from 'react-router';
import { PageHeading } from '../components/ui/page-heading';
import { buildMembersOptions } from '../features/accounts/api/get-build-members';
import { invitationsOptions } from '../features/accounts/api/get-invitations';
import { useSession } from '../features/accounts/api/get-session';
import { InviteForm } from '../features/accounts/components/invite-form';
import { TeamInvitations } from '../features/accounts/components/team-invitations';
import { TeamMembers } from '../features/accounts/components/team-members';
import { accountPaths } from '../features/accounts/paths';
import { idParam, type Account } from '../shared/schemas/accounts';
import { requireAccount, rethrowAsRouteError, routeError, type LoaderDeps } from './route-guards';
import { NotFound } from './not-found';

function membershipOf(account: Account | null | undefined, buildId: number | null) {
  return buildId === null ? undefined : account?.builds.find((b) => b.buildId === buildId);
}

function parseBuildId(value: string | undefined): number | null {
  const parsed = idParam.safeParse(value);
  return parsed.success ? parsed.data : null;
}

/** Not on the build's team → 404, as for anything hidden; the owner also gets the invitations. */
export function buildTeamLoader(deps: LoaderDeps) {
  return async ({ request, params }: { request: Request; params: { buildId?: string } }) => {
    const account = await requireAccount(deps, request);
    const buildId = parseBuildId(params.buildId);
    const membership = membershipOf(account, buildId);
    if (!membership) routeError(404);
    const { queryClient, api } = deps;
    await Promise.all([
      queryClient.ensureQueryData(buildMembersOptions(api, membership.buildId)),
      membership.role === 'owner' ? queryClient.ensureQueryData(invitationsOptions(api, membership.buildId)) : null,
    ]).catch(rethrowAsRouteError);
    return null;
  };
}

export function BuildTeamPage() {
  const params = useParams();
  const { data } = useSession();
  const membership = membershipOf(data?.account, parseBuildId(params.buildId));
  // The loader has already answered 404; this covers leaving the team (or signing out) while here.
  if (!membership) return <NotFound />;
  const owner = membership.role === 'owner';

  return (
    <>
      <title>{`Build team of ${membership.buildTitle} — Rivet & Reel`}</title>
      <meta name="robots" content="noindex" />
      <p className="mb-4 font-condensed text-sm font-semibold tracking-label text-slate uppercase">
        <Link to={accountPaths.builds()} className="text-ink-2 underline underline-offset-2">
          Build teams
        </Link>{' '}
        / {membership.buildTitle}
      </p>
      <PageHeading label="Build team" title={membership.buildTitle}>
        {owner
          ? 'You own this build. Invite editors to write and publish episodes with you, and remove them when the work is done.'
          : 'You help edit this build. Only its owner can invite or remove editors.'}
      </PageHeading>

      <div className="mt-8 max-w-3xl space-y-10">
        <section aria-labelledby="members-heading">
          <h2 id="members-heading" className="label-condensed mb-4 border-b-2 border-ink pb-2">
            Members
          </h2>
          <TeamMembers buildId={membership.buildId} buildTitle={membership.buildTitle} canManage={owner} />
        </section>
        {owner ? (
          <>
            <section aria-labelledby="invitations-heading">
              <h2 id="invitations-heading" className="label-condensed mb-4 border-b-2 border-ink pb-2">
                Invitations
              </h2>
              <TeamInvitations buildId={membership.buildId} buildTitle={membership.buildTitle} />
            </section>
            <section aria-labelledby="invite-heading">
              <h2 id="invite-heading" className="label-condensed mb-4 border-b-2 border-ink pb-2">
                Invite an editor
              </h2>
              <InviteForm buildId={membership.buildId} />
            </section>
          </>
        ) : null}
      </div>
    </>
  );
}
