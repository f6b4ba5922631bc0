/** Query-key factory for sponsors and sponsorships: every variable a fetcher uses is in its key. */
export const sponsorKeys = {
  all: ['sponsors'] as const,
  list: () => [...sponsorKeys.all, 'list'] as const,
  sponsorships: (buildId: number) => [...sponsorKeys.all, 'sponsorships', buildId] as const,
};
