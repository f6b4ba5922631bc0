import { useMemo } from 'react';
import { Link, useNavigate } from 'react-router';
import { ButtonLink } from '../components/ui/button';
import { Notice } from '../components/ui/notice';
import { PageHeading } from '../components/ui/page-heading';
import { buildMembersOptions, useBuildMembers } from '../features/accounts/api/get-build-members';
import { accountPaths } from '../features/accounts/paths';
import { useUpdateBuild } from '../features/builds/api/build-mutations';
import { BuildForm } from '../features/builds/components/build-form';
import { BuildSettingsSummary } from '../features/builds/components/build-settings-summary';
import { DeleteBuildSection } from '../features/builds/components/delete-build-section';
import { TransferSection } from '../features/builds/components/transfer-section';
import { buildValues, changedFields } from '../features/builds/lib/build-form';
import { BuildCoverControl } from '../features/media/components/build-cover-control';
import { BuildSponsorSummaries } from '../features/sponsors/components/build-sponsor-summaries';
import { workbenchPaths } from '../features/workbench/paths';
import { SponsorshipsSection } from '../features/sponsors/components/sponsorships-section';
import { DEFAULT_SYSTEMS, type Build } from '../shared/schemas/builds';
import type { LoaderDeps } from './route-guards';
import { BuildCrumbs, loadTeamBuild, TeamBuild, useBuildIdParam } from './workbench-build-frame';
import { primeOrRouteError } from './workbench-loading';

/** Team members only; the owner's page also needs the team, to choose whom to hand the build to. */
export function buildSettingsLoader(deps: LoaderDeps) {
  return async ({ request, params }: { request: Request; params: { buildId?: string } }) => {
    const { buildId, build } = await loadTeamBuild(deps, request, params.buildId);
    if (build?.role === 'owner') await primeOrRouteError(deps.queryClient.ensureQueryData(buildMembersOptions(deps.api, buildId)));
    return null;
  };
}

export function BuildSettingsPage() {
  const buildId = useBuildIdParam();
  return <TeamBuild buildId={buildId}>{(build) => <SettingsScreen build={build} />}</TeamBuild>;
}

function SettingsScreen({ build }: { build: Build }) {
  const owner = build.role === 'owner';
  return (
    <>
      <title>{`Settings of ${build.title} — Rivet & Reel`}</title>
      <meta name="robots" content="noindex" />
      <BuildCrumbs build={build} here="Settings" />
      <PageHeading label="Build settings" title={build.title}>
        {owner ? (
          'The vehicle, money, readers, video links and vehicle systems of this build; handing it over; deleting it.'
        ) : (
          <>
            Only the build’s owner, {build.owner.displayName}, can change these settings. Ask them, or see the team on the Build team page.
          </>
        )}
      </PageHeading>
      <nav aria-label="Build" className="mt-5 flex flex-wrap gap-3">
        <ButtonLink to={workbenchPaths.buildLedger(build.id)}>Ledger</ButtonLink>
        <ButtonLink to={accountPaths.team(build.id)}>Build team</ButtonLink>
      </nav>
      <div className="mt-8 space-y-12">
        {owner ? <OwnerSettings build={build} /> : <BuildSettingsSummary build={build} />}
        {/* Owner and editors alike read each sponsor's summary of the build. */}
        <BuildSponsorSummaries buildId={build.id} />
      </div>
    </>
  );
}

function OwnerSettings({ build }: { build: Build }) {
  const update = useUpdateBuild(build.id);
  const navigate = useNavigate();
  const members = useBuildMembers(build.id);
  const defaults = useMemo(() => buildValues(build), [build]);
  const lockedKeys = useMemo(() => new Set([...DEFAULT_SYSTEMS.map((s) => s.key), ...build.systems.map((s) => s.key)]), [build.systems]);
  const editors = members.data ? members.data.items.filter((m) => m.role === 'editor') : null;

  return (
    <>
      <section aria-labelledby="settings-heading">
        <h2 id="settings-heading" className="sr-only">
          Settings
        </h2>
        {/* Keyed by the saved version, so the fields start again from what the server now holds. */}
        <BuildForm
          key={build.updatedAt}
          defaultValues={defaults}
          lockedKeys={lockedKeys}
          saved={{ title: build.title, systems: build.systems }}
          submitLabel="Save settings"
          pendingLabel="Saving…"
          status={update.isSuccess ? <Notice kind="success">The settings are saved.</Notice> : null}
          onSubmit={async (values) => {
            const patch = changedFields(build, values);
            if (Object.keys(patch).length === 0) return;
            await update.mutateAsync(patch);
          }}
        />
      </section>

      <BuildCoverControl buildId={build.id} />

      <SponsorshipsSection buildId={build.id} />

      <section aria-labelledby="transfer-heading" className="max-w-2xl">
        <h2 id="transfer-heading" className="label-condensed mb-4 border-b-2 border-ink pb-2">
          Hand the build to an editor
        </h2>
        <TransferSection
          build={build}
          editors={editors}
          editorsError={members.error ? members.error.message : null}
          teamHref={accountPaths.team(build.id)}
        />
      </section>

      <div className="max-w-2xl">
        <DeleteBuildSection
          build={build}
          onDeleted={() =>
            navigate(workbenchPaths.home(), {
              state: { notice: `${build.title} is deleted. Undo it under “Recently deleted” within 30 days.` },
            })
          }
        />
      </div>
      <p className="text-[15px] text-slate">
        Editors are invited and removed on the{' '}
        <Link to={accountPaths.team(build.id)} className="underline underline-offset-2">
          Build team page
        </Link>
        .
      </p>
    </>
  );
}
