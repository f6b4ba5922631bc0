import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { noContent, type ApiClient } from '../../../lib/api-client';
import { useApi } from '../../../lib/api-context';
import { sponsorList, sponsorship, sponsorshipList, type SponsorshipInput } from '../../../shared/schemas/sponsors';
import { sponsorKeys } from './keys';

export function sponsorListOptions(api: ApiClient) {
  return queryOptions({
    queryKey: sponsorKeys.list(),
    queryFn: ({ signal }) => api.get('/api/sponsors', sponsorList, signal),
    staleTime: 5 * 60_000,
  });
}
export const useSponsorList = () => useQuery(sponsorListOptions(useApi()));

/** The build's sponsorships (the owner's). */
export function sponsorshipsOptions(api: ApiClient, buildId: number) {
  return queryOptions({
    queryKey: sponsorKeys.sponsorships(buildId),
    queryFn: ({ signal }) => api.get(`/api/builds/${buildId}/sponsorships`, sponsorshipList, signal),
  });
}
export const useSponsorships = (buildId: number) => useQuery(sponsorshipsOptions(useApi(), buildId));

function useRefresh(buildId: number) {
  const queryClient = useQueryClient();
  return () => queryClient.invalidateQueries({ queryKey: sponsorKeys.sponsorships(buildId) });
}

export function useSaveSponsorship(buildId: number) {
  const api = useApi();
  const onSuccess = useRefresh(buildId);
  return useMutation({
    mutationFn: ({ id, input }: { id: number | null; input: SponsorshipInput }) =>
      id === null
        ? api.post(`/api/builds/${buildId}/sponsorships`, input, sponsorship)
        : api.put(`/api/sponsorships/${id}`, input, sponsorship),
    onSuccess,
  });
}

export function useDeleteSponsorship(buildId: number) {
  const api = useApi();
  const onSuccess = useRefresh(buildId);
  return useMutation({ mutationFn: (id: number) => api.del(`/api/sponsorships/${id}`, noContent), onSuccess });
}
