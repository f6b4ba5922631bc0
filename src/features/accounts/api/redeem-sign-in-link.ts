import { useMutation, useQueryClient } from '@tanstack/react-query';
import { useApi } from '../../../lib/api-context';
import { signInLinkRedeemResponse } from '../../../shared/schemas/accounts';
import { applySessionChange } from './session-change';

/** Uses up an e-mailed sign-in token (a POST, so mail scanners that fetch links cannot). */
export function useRedeemSignInLink() {
  const api = useApi();
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (token: string) => api.post('/api/sign-in-links/redeem', { token }, signInLinkRedeemResponse),
    onSuccess: ({ account }) => applySessionChange(queryClient, api, account),
  });
}
