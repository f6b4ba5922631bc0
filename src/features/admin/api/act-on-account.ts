import { useMutation, useQueryClient } from '@tanstack/react-query';
import { useApi } from '../../../lib/api-context';
import { adminAccount, type AdminAccountAction } from '../../../shared/schemas/accounts';
import { adminKeys } from './keys';

/** Suspend, restore, grant or revoke admin; the server records who did it and when. */
export function useAccountAction() {
  const api = useApi();
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ userId, action }: { userId: number; action: AdminAccountAction }) =>
      api.post(`/api/admin/accounts/${userId}/actions`, { action }, adminAccount),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: adminKeys.accounts() }),
  });
}
