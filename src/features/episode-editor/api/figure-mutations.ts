import { useMutation, useQueryClient } from '@tanstack/react-query';
import { noContent } from '../../../lib/api-client';
import { useApi } from '../../../lib/api-context';
import { figure, type FigureInput } from '../../../shared/schemas/figures';
import { editorKeys } from './keys';

/** Figures save at once, each its own record (not with the episode's autosave). */
function useRefreshFigures(episodeId: number) {
  const queryClient = useQueryClient();
  return () => queryClient.invalidateQueries({ queryKey: editorKeys.figures(episodeId) });
}

export function useCreateFigure(episodeId: number) {
  const api = useApi();
  const onSuccess = useRefreshFigures(episodeId);
  return useMutation({
    mutationFn: (body: FigureInput) => api.post(`/api/episodes/${episodeId}/figures`, body, figure),
    onSuccess,
  });
}

export function useReplaceFigure(episodeId: number) {
  const api = useApi();
  const onSuccess = useRefreshFigures(episodeId);
  return useMutation({
    mutationFn: ({ id, body }: { id: number; body: FigureInput }) => api.put(`/api/figures/${id}`, body, figure),
    onSuccess,
  });
}

export function useDeleteFigure(episodeId: number) {
  const api = useApi();
  const onSuccess = useRefreshFigures(episodeId);
  return useMutation({
    mutationFn: (id: number) => api.del(`/api/figures/${id}`, noContent),
    onSuccess,
  });
}
