import { Link } from 'react-router';
import { QueryState } from '../components/ui/query-state';
import { PageHeading } from '../components/ui/page-heading';
import { StateMessage } from '../components/ui/state-message';
import { adminPaths } from '../features/admin/paths';
import { adminSponsorsOptions, useAdminSponsors, useCreateSponsor } from '../features/sponsors/api/admin-sponsors';
import { SponsorForm } from '../features/sponsors/components/sponsor-form';
import { requireAccount, rethrowAsRouteError, routeError, type LoaderDeps } from './route-guards';

/** Admins only: anyone else signed in gets the 403 page (the API refuses them too). */
export function adminSponsorsLoader(deps: LoaderDeps) {
  return async ({ request }: { request: Request }) => {
    const account = await requireAccount(deps, request);
    if (!account.isAdmin) routeError(403);
    await deps.queryClient.ensureQueryData(adminSponsorsOptions(deps.api)).catch(rethrowAsRouteError);
    return null;
  };
}

export function AdminSponsorsPage() {
  const { data, error, isFetching, refetch } = useAdminSponsors();
  const create = useCreateSponsor();
  return (
    <>
      <title>Sponsor organisations — Rivet &amp; Reel</title>
      <meta name="robots" content="noindex" />
      <PageHeading label="Admin" title="Sponsor organisations">
        Organisations that give, discount or pay for parts. Each has members, who see where its support appeared, and the suppliers it
        stands behind.
      </PageHeading>
      <section aria-labelledby="sponsors-heading" className="mt-8 max-w-3xl">
        <h2 id="sponsors-heading" className="label-condensed mb-4 border-b-2 border-ink pb-2">
          Organisations
        </h2>
        {data ? (
          data.items.length === 0 ? (
            <StateMessage kind="empty" title="No sponsor organisations yet.">
              <p>Add the first one below.</p>
            </StateMessage>
          ) : (
            <ul className="divide-y divide-rule border-y border-rule bg-card">
              {data.items.map((s) => (
                <li key={s.id} className="flex flex-wrap items-center gap-x-4 gap-y-1 px-4 py-3">
                  {s.logoUrl ? <img src={s.logoUrl} alt="" className="max-h-8 max-w-20 object-contain" /> : null}
                  <Link to={adminPaths.sponsor(s.id)} className="min-w-0 flex-1 font-semibold">
                    {s.name}
                  </Link>
                  <span className="text-[15px] text-slate">
                    <span className="font-mono">{s.members}</span> {s.members === 1 ? 'member' : 'members'} ·{' '}
                    <span className="font-mono">{s.suppliers}</span> {s.suppliers === 1 ? 'supplier' : 'suppliers'}
                    {s.pendingInvitations ? (
                      <>
                        {' '}
                        · <span className="font-mono">{s.pendingInvitations}</span> invited
                      </>
                    ) : null}
                  </span>
                </li>
              ))}
            </ul>
          )
        ) : (
          <QueryState
            showMessage
            error={error}
            isFetching={isFetching}
            refetch={refetch}
            errorTitle="The organisations could not be loaded."
            loadingTitle="Loading the organisations…"
          />
        )}
      </section>
      <section aria-labelledby="new-sponsor-heading" className="mt-12 max-w-3xl">
        <h2 id="new-sponsor-heading" className="label-condensed mb-4 border-b-2 border-ink pb-2">
          Add an organisation
        </h2>
        <SponsorForm submitLabel="Add organisation" pending={create.isPending} onSubmit={(v) => create.mutateAsync(v)} />
      </section>
    </>
  );
}
