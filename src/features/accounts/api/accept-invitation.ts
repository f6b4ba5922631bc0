import { useMutation, useQueryClient } from '@tanstack/react-query';
import { useApi } from '../../../lib/api-context';
import { invitationAcceptResponse } from '../../../shared/schemas/accounts';
import { sessionOptions } from './get-session';

/** Accepts an invitation for the signed-in account, then reloads the session's memberships. */
export function useAcceptInvitation() {
  const api = useApi();
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (token: string) => api.post('/api/invitations/accept', { token }, invitationAcceptResponse),
    onSuccess: async () => {
      // Awaited: the team page's loader reads the memberships from this very query.
      await queryClient.fetchQuery({ ...sessionOptions(api), staleTime: 0 });
    },
  });
}
