import { useMutation, useQueryClient } from '@tanstack/react-query';
import { useNavigate } from 'react-router';
import { noContent } from '../../../lib/api-client';
import { useApi } from '../../../lib/api-context';
import { applySessionChange } from './session-change';

/** Deletes the signed-in account (409 `owns_builds` while it still owns builds). */
export function useDeleteAccount() {
  const api = useApi();
  const queryClient = useQueryClient();
  const navigate = useNavigate();
  return useMutation({
    mutationFn: () => api.del('/api/account', noContent),
    onSuccess: async () => {
      await navigate('/', { state: { notice: 'Your account has been deleted. What you wrote stays, shown as by a former member.' } });
      applySessionChange(queryClient, api, null);
    },
  });
}
