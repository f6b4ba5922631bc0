import { keepPreviousData, queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { ApiClient } from '../../../lib/api-client';
import { noContent } from '../../../lib/api-client';
import { useApi } from '../../../lib/api-context';
import { invitation } from '../../../shared/schemas/accounts';
import { supplierList } from '../../../shared/schemas/parts';
import { adminSponsorDetail, adminSponsorList } from '../../../shared/schemas/sponsor-admin';
import { sponsorRef, type SponsorInput } from '../../../shared/schemas/sponsors';
import { sponsorKeys } from './keys';

/** Every organisation with its counts (admins). */
export function adminSponsorsOptions(api: ApiClient) {
  return queryOptions({
    queryKey: sponsorKeys.adminList(),
    queryFn: ({ signal }) => api.get('/api/admin/sponsors', adminSponsorList, signal),
  });
}
export function useAdminSponsors() {
  return useQuery(adminSponsorsOptions(useApi()));
}

/** One organisation with its suppliers, members and invitations (admins). */
export function adminSponsorOptions(api: ApiClient, sponsorId: number) {
  return queryOptions({
    queryKey: sponsorKeys.adminDetail(sponsorId),
    queryFn: ({ signal }) => api.get(`/api/admin/sponsors/${sponsorId}`, adminSponsorDetail, signal),
  });
}
export function useAdminSponsor(sponsorId: number) {
  return useQuery(adminSponsorOptions(useApi(), sponsorId));
}

/** Live supplier records matching `q`, to link one. */
export function useSupplierSearch(q: string) {
  const api = useApi();
  return useQuery({
    queryKey: sponsorKeys.supplierSearch(q),
    queryFn: ({ signal }) => api.get(`/api/suppliers?${new URLSearchParams({ q }).toString()}`, supplierList, signal),
    enabled: q.trim().length > 0,
    placeholderData: keepPreviousData,
    staleTime: 30_000,
  });
}

function useInvalidateAdmin() {
  const queryClient = useQueryClient();
  return () => queryClient.invalidateQueries({ queryKey: sponsorKeys.admin() });
}

export function useCreateSponsor() {
  const api = useApi();
  const invalidate = useInvalidateAdmin();
  return useMutation({ mutationFn: (body: SponsorInput) => api.post('/api/admin/sponsors', body, sponsorRef), onSuccess: invalidate });
}

export function useUpdateSponsor(sponsorId: number) {
  const api = useApi();
  const invalidate = useInvalidateAdmin();
  return useMutation({
    mutationFn: (body: SponsorInput) => api.put(`/api/admin/sponsors/${sponsorId}`, body, sponsorRef),
    onSuccess: invalidate,
  });
}

/** Uploads the logo (multipart) with progress. */
export function useUploadLogo(sponsorId: number) {
  const api = useApi();
  const invalidate = useInvalidateAdmin();
  return useMutation({
    mutationFn: ({ file, altText, onProgress }: { file: File; altText: string; onProgress?: (share: number) => void }) => {
      const form = new FormData();
      form.set('altText', altText);
      form.set('file', file);
      return api.upload(`/api/admin/sponsors/${sponsorId}/logo`, form, sponsorRef, { onProgress });
    },
    onSuccess: invalidate,
  });
}

export function useRemoveLogo(sponsorId: number) {
  const api = useApi();
  const invalidate = useInvalidateAdmin();
  return useMutation({ mutationFn: () => api.del(`/api/admin/sponsors/${sponsorId}/logo`, noContent), onSuccess: invalidate });
}

export function useLinkSupplier(sponsorId: number) {
  const api = useApi();
  const invalidate = useInvalidateAdmin();
  return useMutation({
    mutationFn: (supplierId: number) => api.put(`/api/admin/sponsors/${sponsorId}/suppliers/${supplierId}`, {}, noContent),
    onSuccess: invalidate,
  });
}

export function useUnlinkSupplier(sponsorId: number) {
  const api = useApi();
  const invalidate = useInvalidateAdmin();
  return useMutation({
    mutationFn: (supplierId: number) => api.del(`/api/admin/sponsors/${sponsorId}/suppliers/${supplierId}`, noContent),
    onSuccess: invalidate,
  });
}

export function useInviteMember(sponsorId: number) {
  const api = useApi();
  const invalidate = useInvalidateAdmin();
  return useMutation({
    mutationFn: (email: string) => api.post(`/api/admin/sponsors/${sponsorId}/invitations`, { email }, invitation),
    onSuccess: invalidate,
  });
}

export function useResendMemberInvitation(sponsorId: number) {
  const api = useApi();
  const invalidate = useInvalidateAdmin();
  return useMutation({
    mutationFn: (invitationId: number) => api.post(`/api/admin/sponsors/${sponsorId}/invitations/${invitationId}/resend`, {}, invitation),
    onSuccess: invalidate,
  });
}

export function useRevokeMemberInvitation(sponsorId: number) {
  const api = useApi();
  const invalidate = useInvalidateAdmin();
  return useMutation({
    mutationFn: (invitationId: number) => api.del(`/api/admin/sponsors/${sponsorId}/invitations/${invitationId}`, noContent),
    onSuccess: invalidate,
  });
}

export function useRemoveMember(sponsorId: number) {
  const api = useApi();
  const invalidate = useInvalidateAdmin();
  return useMutation({
    mutationFn: (userId: number) => api.del(`/api/admin/sponsors/${sponsorId}/members/${userId}`, noContent),
    onSuccess: invalidate,
  });
}
