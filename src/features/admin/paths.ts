/** URL paths of the admin screens. (They belong in src/shared/paths.ts once that file takes them.) */
export const adminPaths = {
  accounts: (q: { q?: string; page?: number } = {}) => {
    const params = new URLSearchParams();
    if (q.q) params.set('q', q.q);
    if (q.page && q.page > 1) params.set('page', String(q.page));
    const search = params.toString();
    return search ? `/admin/accounts?${search}` : '/admin/accounts';
  },
  sponsors: () => '/admin/sponsors',
  sponsor: (sponsorId: number) => `/admin/sponsors/${sponsorId}`,
  suppliers: (q = '') => (q ? `/admin/suppliers?${new URLSearchParams({ q }).toString()}` : '/admin/suppliers'),
};
