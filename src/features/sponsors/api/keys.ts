import type { SponsorSummaryQuery } from '../../../shared/schemas/sponsors';

/** Query-key factory for sponsors: every variable a fetcher uses is in its key. */
export const sponsorKeys = {
  all: ['sponsors'] as const,
  admin: () => [...sponsorKeys.all, 'admin'] as const,
  adminList: () => [...sponsorKeys.admin(), 'list'] as const,
  adminDetail: (sponsorId: number) => [...sponsorKeys.admin(), 'detail', sponsorId] as const,
  supplierSearch: (q: string) => [...sponsorKeys.all, 'supplier-search', q] as const,
  summary: (slug: string, q: SponsorSummaryQuery) => [...sponsorKeys.all, 'summary', slug, q] as const,
  teamSummary: (buildId: number, sponsorId: number, q: SponsorSummaryQuery) =>
    [...sponsorKeys.all, 'team-summary', buildId, sponsorId, q] as const,
  list: () => [...sponsorKeys.all, 'list'] as const,
  sponsorships: (buildId: number) => [...sponsorKeys.all, 'sponsorships', buildId] as const,
  buildSponsors: (buildId: number) => [...sponsorKeys.all, 'build-sponsors', buildId] as const,
};
