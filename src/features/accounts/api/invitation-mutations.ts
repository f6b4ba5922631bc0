import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import { noContent } from '../../../lib/api-client';
import { useApi } from '../../../lib/api-context';
import { invitation, type invitationCreate } from '../../../shared/schemas/accounts';
import { accountKeys } from './keys';

export type InvitationCreate = z.output<typeof invitationCreate>;

/** Invite, resend and revoke share the build's invitation list, so they live together. */
function useInvalidateInvitations(buildId: number) {
  const queryClient = useQueryClient();
  return () => queryClient.invalidateQueries({ queryKey: accountKeys.invitations(buildId) });
}

export function useCreateInvitation(buildId: number) {
  const api = useApi();
  const onSuccess = useInvalidateInvitations(buildId);
  return useMutation({
    mutationFn: (body: InvitationCreate) => api.post(`/api/builds/${buildId}/invitations`, body, invitation),
    onSuccess,
  });
}

export function useResendInvitation(buildId: number) {
  const api = useApi();
  const onSuccess = useInvalidateInvitations(buildId);
  return useMutation({
    mutationFn: (invitationId: number) => api.post(`/api/invitations/${invitationId}/resend`, {}, invitation),
    onSuccess,
  });
}

export function useRevokeInvitation(buildId: number) {
  const api = useApi();
  const onSuccess = useInvalidateInvitations(buildId);
  return useMutation({
    mutationFn: (invitationId: number) => api.del(`/api/invitations/${invitationId}`, noContent),
    onSuccess,
  });
}
