import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import type { ApiClient } from '../../../lib/api-client';
import { useApi } from '../../../lib/api-context';
import { sponsorRef, sponsorSummary, sponsorSummaryQuery, type SponsorSummaryQuery } from '../../../shared/schemas/sponsors';
import { sponsorKeys } from './keys';

/** Lines per page on the summary screen. */
export const SUMMARY_PAGE_SIZE = 25;

/** The summary's filter and page from the URL; a malformed value is dropped, the rest kept. */
export function summaryQueryFrom(params: URLSearchParams): SponsorSummaryQuery {
  const raw: Record<string, string> = { perPage: String(SUMMARY_PAGE_SIZE) };
  for (const [key, value] of params.entries()) if (value !== '' && key !== 'perPage') raw[key] = value;
  const parsed = sponsorSummaryQuery.safeParse(raw);
  if (parsed.success) return parsed.data;
  const kept: Record<string, string> = {};
  for (const [key, value] of Object.entries(raw)) if (sponsorSummaryQuery.safeParse({ [key]: value }).success) kept[key] = value;
  return sponsorSummaryQuery.parse(kept);
}

/** The same query as URL search params, defaults left out (for links and the API). */
export function summarySearch(q: Partial<SponsorSummaryQuery>, opts: { withPage?: boolean } = {}): string {
  const params = new URLSearchParams();
  if (q.from) params.set('from', q.from);
  if (q.to) params.set('to', q.to);
  if (q.build) params.set('build', String(q.build));
  if (q.kind) params.set('kind', q.kind);
  if (opts.withPage !== false && q.page && q.page > 1) params.set('page', String(q.page));
  return params.toString();
}

const apiSearch = (q: SponsorSummaryQuery) => {
  const s = summarySearch(q);
  return `perPage=${q.perPage}${s ? `&${s}` : ''}`;
};

/** A member's view of their organisation's summary. */
export function sponsorSummaryOptions(api: ApiClient, slug: string, q: SponsorSummaryQuery) {
  return queryOptions({
    queryKey: sponsorKeys.summary(slug, q),
    queryFn: ({ signal }) => api.get(`/api/sponsors/${encodeURIComponent(slug)}/summary?${apiSearch(q)}`, sponsorSummary, signal),
  });
}
export function useSponsorSummary(slug: string, q: SponsorSummaryQuery) {
  return useQuery({ ...sponsorSummaryOptions(useApi(), slug, q), placeholderData: keepPreviousData });
}

/** The build team's view of one sponsor's summary on its build (unpublished lines included). */
export function teamSummaryOptions(api: ApiClient, buildId: number, sponsorId: number, q: SponsorSummaryQuery) {
  return queryOptions({
    queryKey: sponsorKeys.teamSummary(buildId, sponsorId, q),
    queryFn: ({ signal }) => api.get(`/api/builds/${buildId}/sponsors/${sponsorId}/summary?${apiSearch(q)}`, sponsorSummary, signal),
  });
}
export function useTeamSummary(buildId: number, sponsorId: number, q: SponsorSummaryQuery) {
  return useQuery({ ...teamSummaryOptions(useApi(), buildId, sponsorId, q), placeholderData: keepPreviousData });
}

const buildSponsors = z.object({ items: z.array(sponsorRef) });

/** The sponsors whose support is on a build's lines (the build team). */
export function buildSponsorsOptions(api: ApiClient, buildId: number) {
  return queryOptions({
    queryKey: sponsorKeys.buildSponsors(buildId),
    queryFn: ({ signal }) => api.get(`/api/builds/${buildId}/sponsor-summaries`, buildSponsors, signal),
  });
}
export function useBuildSponsors(buildId: number) {
  return useQuery(buildSponsorsOptions(useApi(), buildId));
}
