import { useMutation, useQueryClient } from '@tanstack/react-query';
import { noContent } from '../../../lib/api-client';
import { useApi } from '../../../lib/api-context';
import { partLine, type PartLineInput } from '../../../shared/schemas/parts';
import { partKeys } from './keys';

/** A line change moves the episode's list, the build's totals and the ledger: refresh all of parts. */
function useRefreshParts() {
  const queryClient = useQueryClient();
  return () => queryClient.invalidateQueries({ queryKey: partKeys.all });
}

export function useCreatePartLine(episodeId: number) {
  const api = useApi();
  const onSuccess = useRefreshParts();
  return useMutation({
    /** `position` puts an undone delete back where it was. */
    mutationFn: (body: PartLineInput & { position?: number }) => api.post(`/api/episodes/${episodeId}/part-lines`, body, partLine),
    onSuccess,
  });
}

export function useUpdatePartLine() {
  const api = useApi();
  const onSuccess = useRefreshParts();
  return useMutation({
    mutationFn: ({ id, ...body }: Partial<PartLineInput> & { id: number }) => api.patch(`/api/part-lines/${id}`, body, partLine),
    onSuccess,
  });
}

export function useDeletePartLine() {
  const api = useApi();
  const onSuccess = useRefreshParts();
  return useMutation({
    mutationFn: (id: number) => api.del(`/api/part-lines/${id}`, noContent),
    onSuccess,
  });
}
