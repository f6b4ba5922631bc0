import { Form, useSearchParams } from 'react-router';
import { QueryState } from '../components/ui/query-state';
import { Button, ButtonLink } from '../components/ui/button';
import { PageHeading } from '../components/ui/page-heading';
import { StateMessage } from '../components/ui/state-message';
import { TextField } from '../components/ui/text-field';
import { useSession } from '../features/accounts/api/get-session';
import {
  adminAccountsOptions,
  adminAccountsQueryFrom,
  useAdminAccounts,
  type AdminAccountsQuery,
} from '../features/admin/api/get-admin-accounts';
import { AccountsTable } from '../features/admin/components/accounts-table';
import { adminPaths } from '../features/admin/paths';
import { requireAccount, rethrowAsRouteError, routeError, type LoaderDeps } from './route-guards';

/** Admins only: anyone else signed in gets the 403 page (the API refuses them too). */
export function adminAccountsLoader(deps: LoaderDeps) {
  return async ({ request }: { request: Request }) => {
    const account = await requireAccount(deps, request);
    if (!account.isAdmin) routeError(403);
    const q = adminAccountsQueryFrom(new URL(request.url).searchParams);
    await deps.queryClient.ensureQueryData(adminAccountsOptions(deps.api, q)).catch(rethrowAsRouteError);
    return null;
  };
}

export function AdminAccountsPage() {
  const [searchParams] = useSearchParams();
  const query = adminAccountsQueryFrom(searchParams);
  const { data, error, isFetching, refetch } = useAdminAccounts(query);
  const { data: session } = useSession();

  return (
    <>
      <title>Accounts — Rivet &amp; Reel</title>
      <meta name="robots" content="noindex" />
      <PageHeading label="Admin" title="Accounts">
        Find an account by handle, name or e-mail address. Suspending signs the person out everywhere; every change is recorded with who
        made it and when.
      </PageHeading>

      <Form method="get" role="search" aria-label="Accounts" className="mt-6 flex max-w-xl flex-wrap items-end gap-3">
        {/* Keyed by the search so the box follows the URL on back and forward. */}
        <TextField
          key={query.q ?? ''}
          label="Search accounts"
          name="q"
          type="search"
          defaultValue={query.q ?? ''}
          className="min-w-0 flex-1 basis-56"
        />
        <Button type="submit">Search</Button>
      </Form>

      <section aria-label="Search results" className="mt-8">
        {data ? (
          data.items.length === 0 ? (
            <StateMessage
              kind="empty"
              title={
                query.q
                  ? `No account matches “${query.q}”.`
                  : data.total > 0
                    ? `There is no page ${data.page}.`
                    : 'There are no accounts yet.'
              }
              action={query.q || data.total > 0 ? <ButtonLink to={adminPaths.accounts()}>Show all accounts</ButtonLink> : undefined}
            />
          ) : (
            <>
              <p className="mb-3 text-[15px] text-slate">
                {data.total === 1 ? 'One account' : `${data.total} accounts`}
                {query.q ? ` match “${query.q}”` : ''}.
              </p>
              <AccountsTable items={data.items} currentUserId={session?.account?.id ?? -1} />
              <Pages query={query} total={data.total} />
            </>
          )
        ) : (
          <QueryState
            showMessage
            error={error}
            isFetching={isFetching}
            refetch={refetch}
            errorTitle="The accounts could not be loaded."
            loadingTitle="Loading accounts…"
          />
        )}
      </section>
    </>
  );
}

function Pages({ query, total }: { query: AdminAccountsQuery; total: number }) {
  const totalPages = Math.max(1, Math.ceil(total / query.perPage));
  if (totalPages <= 1) return null;
  const { page, q } = query;
  return (
    <nav aria-label="Pages of accounts" className="mt-6 flex flex-wrap items-center justify-between gap-3">
      {page > 1 ? (
        <ButtonLink to={adminPaths.accounts({ q, page: page - 1 })} rel="prev">
          ← Previous page
        </ButtonLink>
      ) : (
        <span />
      )}
      <p className="font-condensed text-sm font-semibold tracking-label text-slate uppercase">
        Page <span className="font-mono">{page}</span> of <span className="font-mono">{totalPages}</span>
      </p>
      {page < totalPages ? (
        <ButtonLink to={adminPaths.accounts({ q, page: page + 1 })} rel="next">
          Next page →
        </ButtonLink>
      ) : (
        <span />
      )}
    </nav>
  );
}
