import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { useApi } from '../../../lib/api-context';
import { partKeys } from './keys';

const mergeResult = z.object({ intoId: z.number().int(), lines: z.number().int() });

/** Admins: fold a duplicate supplier into another; its lines move across. */
export function useMergeSuppliers() {
  const api = useApi();
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ fromId, intoId }: { fromId: number; intoId: number }) =>
      api.post(`/api/admin/suppliers/${fromId}/merge`, { intoId }, mergeResult),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: partKeys.all }),
  });
}
