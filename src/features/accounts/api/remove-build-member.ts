import { useMutation, useQueryClient } from '@tanstack/react-query';
import { noContent } from '../../../lib/api-client';
import { useApi } from '../../../lib/api-context';
import { accountKeys } from './keys';

/** The owner removes an editor from the build team (the owner cannot be removed: 409). */
export function useRemoveBuildMember(buildId: number) {
  const api = useApi();
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (userId: number) => api.del(`/api/builds/${buildId}/members/${userId}`, noContent),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: accountKeys.members(buildId) }),
  });
}
