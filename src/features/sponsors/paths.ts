/** URL paths of the sponsor screens; `search` is the summary's filter as URL search params (without "?"). */
export const sponsorPaths = {
  summary: (slug: string, search = '') => `/sponsors/${encodeURIComponent(slug)}${search ? `?${search}` : ''}`,
  teamSummary: (buildId: number, sponsorId: number, search = '') =>
    `/workbench/builds/${buildId}/sponsors/${sponsorId}${search ? `?${search}` : ''}`,
};
