import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import { noContent } from '../../../lib/api-client';
import { useApi } from '../../../lib/api-context';
import { openItem, type openItemCreate, type openItemUpdate } from '../../../shared/schemas/episodes';
import { editorKeys } from './keys';

export type OpenItemCreate = z.input<typeof openItemCreate>;
export type OpenItemUpdate = z.input<typeof openItemUpdate>;

/** Adding, closing and removing share this episode's open-item list, so they live together. */
function useRefreshOpenItems(buildId: number, episodeId: number) {
  const queryClient = useQueryClient();
  return () => queryClient.invalidateQueries({ queryKey: editorKeys.openItems(buildId, episodeId) });
}

export function useCreateOpenItem(buildId: number, episodeId: number) {
  const api = useApi();
  const onSuccess = useRefreshOpenItems(buildId, episodeId);
  return useMutation({
    mutationFn: (body: OpenItemCreate) => api.post(`/api/builds/${buildId}/open-items`, body, openItem),
    onSuccess,
  });
}

export function useUpdateOpenItem(buildId: number, episodeId: number) {
  const api = useApi();
  const onSuccess = useRefreshOpenItems(buildId, episodeId);
  return useMutation({
    mutationFn: ({ id, ...body }: OpenItemUpdate & { id: number }) => api.patch(`/api/open-items/${id}`, body, openItem),
    onSuccess,
  });
}

export function useDeleteOpenItem(buildId: number, episodeId: number) {
  const api = useApi();
  const onSuccess = useRefreshOpenItems(buildId, episodeId);
  return useMutation({
    mutationFn: (id: number) => api.del(`/api/open-items/${id}`, noContent),
    onSuccess,
  });
}
