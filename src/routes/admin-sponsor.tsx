import { Link, useParams } from 'react-router';
import { Button } from '../components/ui/button';
import { PageHeading } from '../components/ui/page-heading';
import { StateMessage } from '../components/ui/state-message';
import { adminPaths } from '../features/admin/paths';
import { adminSponsorOptions, useAdminSponsor, useUpdateSponsor } from '../features/sponsors/api/admin-sponsors';
import { SponsorForm } from '../features/sponsors/components/sponsor-form';
import { SponsorLogo } from '../features/sponsors/components/sponsor-logo';
import { SponsorMembers } from '../features/sponsors/components/sponsor-members';
import { SponsorSuppliers } from '../features/sponsors/components/sponsor-suppliers';
import type { AdminSponsorDetail } from '../shared/schemas/sponsor-admin';
import { requireAccount, rethrowAsRouteError, routeError, type LoaderDeps } from './route-guards';

function sponsorIdOf(raw: string | undefined): number | null {
  const n = Number(raw);
  return Number.isSafeInteger(n) && n > 0 ? n : null;
}

/** Admins only; an unknown organisation is the 404 page. */
export function adminSponsorLoader(deps: LoaderDeps) {
  return async ({ request, params }: { request: Request; params: { sponsorId?: string } }) => {
    const account = await requireAccount(deps, request);
    if (!account.isAdmin) routeError(403);
    const id = sponsorIdOf(params.sponsorId);
    if (id === null) routeError(404);
    await deps.queryClient.ensureQueryData(adminSponsorOptions(deps.api, id)).catch(rethrowAsRouteError);
    return null;
  };
}

export function AdminSponsorPage() {
  const id = sponsorIdOf(useParams().sponsorId) ?? 0;
  const { data, error, isFetching, refetch } = useAdminSponsor(id);
  if (!data)
    return error ? (
      <StateMessage
        kind="error"
        title="This organisation could not be loaded."
        action={
          <Button onClick={() => void refetch()} disabled={isFetching}>
            {isFetching ? 'Trying again…' : 'Try again'}
          </Button>
        }
      >
        <p>{error.message}</p>
      </StateMessage>
    ) : (
      <StateMessage kind="loading" title="Loading the organisation…" />
    );
  return <SponsorAdmin detail={data} />;
}

function SponsorAdmin({ detail }: { detail: AdminSponsorDetail }) {
  const { sponsor } = detail;
  const update = useUpdateSponsor(sponsor.id);
  const section = (id: string, title: string) => (
    <h2 id={id} className="label-condensed mb-4 border-b-2 border-ink pb-2">
      {title}
    </h2>
  );
  return (
    <>
      <title>{`${sponsor.name} — Sponsor organisations — Rivet & Reel`}</title>
      <meta name="robots" content="noindex" />
      <nav aria-label="Breadcrumbs" className="font-condensed text-sm font-medium tracking-[0.08em] text-slate uppercase">
        <Link to={adminPaths.sponsors()} className="text-slate">
          Sponsor organisations
        </Link>
        <span aria-hidden="true"> / </span>
        <span aria-current="page">{sponsor.name}</span>
      </nav>
      <PageHeading label="Admin · sponsor organisation" title={sponsor.name}>
        Its members read its summary at /sponsors/{sponsor.slug}; admins keep the organisation but do not read the summary.
      </PageHeading>
      <div className="mt-8 grid max-w-3xl gap-12">
        <section aria-labelledby="details-heading">
          {section('details-heading', 'Details')}
          <SponsorForm
            key={`${sponsor.slug}|${sponsor.name}|${sponsor.website ?? ''}`}
            initial={sponsor}
            submitLabel="Save details"
            pending={update.isPending}
            onSubmit={(v) => update.mutateAsync(v)}
          />
        </section>
        <section aria-labelledby="logo-heading">
          {section('logo-heading', 'Logo')}
          <SponsorLogo sponsor={sponsor} />
        </section>
        <section aria-labelledby="suppliers-heading">
          {section('suppliers-heading', 'Linked suppliers')}
          <SponsorSuppliers sponsorId={sponsor.id} sponsorName={sponsor.name} linked={detail.suppliers} />
        </section>
        <section aria-labelledby="members-heading">
          {section('members-heading', 'Members')}
          <SponsorMembers sponsorId={sponsor.id} sponsorName={sponsor.name} members={detail.members} invitations={detail.invitations} />
        </section>
      </div>
    </>
  );
}
