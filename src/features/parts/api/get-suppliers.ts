import { keepPreviousData, queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import type { ApiClient } from '../../../lib/api-client';
import { useApi } from '../../../lib/api-context';
import { supplier, supplierList, type supplierCreate } from '../../../shared/schemas/parts';
import { partKeys } from './keys';

export type Supplier = z.infer<typeof supplier>;

/** Suppliers whose name matches `q`; with a build, the ones its lines already use come first. */
export function suppliersOptions(api: ApiClient, q: string, buildId?: number) {
  const params = new URLSearchParams({ q });
  if (buildId !== undefined) params.set('buildId', String(buildId));
  return queryOptions({
    queryKey: partKeys.suppliers(q, buildId),
    queryFn: ({ signal }) => api.get(`/api/suppliers?${params.toString()}`, supplierList, signal),
    staleTime: 30_000,
  });
}

export function useSuppliers(q: string, buildId?: number, enabled = true) {
  return useQuery({ ...suppliersOptions(useApi(), q, buildId), enabled, placeholderData: keepPreviousData });
}

/** Creates a supplier record (or gets the existing one of that name). */
export function useCreateSupplier() {
  const api = useApi();
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: z.input<typeof supplierCreate>) => api.post('/api/suppliers', body, supplier),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: [...partKeys.all, 'suppliers'] }),
  });
}
