import { Form, useSearchParams } from 'react-router';
import { Button } from '../components/ui/button';
import { PageHeading } from '../components/ui/page-heading';
import { TextField } from '../components/ui/text-field';
import { adminPaths } from '../features/admin/paths';
import { suppliersOptions } from '../features/parts/api/get-suppliers';
import { SupplierMerge } from '../features/parts/components/admin/supplier-merge';
import { requireAccount, rethrowAsRouteError, routeError, type LoaderDeps } from './route-guards';

function supplierSearch(params: URLSearchParams): string {
  return (params.get('q') ?? '').trim().slice(0, 120);
}

/** Admins only: anyone else signed in gets the 403 page (the merge API refuses them too). */
export function adminSuppliersLoader(deps: LoaderDeps) {
  return async ({ request }: { request: Request }) => {
    const account = await requireAccount(deps, request);
    if (!account.isAdmin) routeError(403);
    const q = supplierSearch(new URL(request.url).searchParams);
    await deps.queryClient.ensureQueryData(suppliersOptions(deps.api, q)).catch(rethrowAsRouteError);
    return null;
  };
}

export function AdminSuppliersPage() {
  const [searchParams] = useSearchParams();
  const q = supplierSearch(searchParams);
  return (
    <>
      <title>Suppliers — Rivet &amp; Reel</title>
      <meta name="robots" content="noindex" />
      <PageHeading label="Admin" title="Suppliers">
        Supplier records are shared by every build and created on the fly from the parts tables, so the same shop can turn up twice. Find
        the duplicate, then merge it into the record to keep.
      </PageHeading>
      <Form
        method="get"
        action={adminPaths.suppliers()}
        role="search"
        aria-label="Suppliers"
        className="mt-6 flex max-w-xl flex-wrap items-end gap-3"
      >
        <TextField key={q} label="Search suppliers" name="q" type="search" defaultValue={q} className="min-w-0 flex-1 basis-56" />
        <Button type="submit">Search</Button>
      </Form>
      <section aria-label="Search results" className="mt-8 max-w-3xl">
        <SupplierMerge key={q} q={q} />
      </section>
    </>
  );
}
