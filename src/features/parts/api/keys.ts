import type { LedgerQuery } from '../../../shared/schemas/parts';

/** Query-key factory for parts: every variable a fetcher uses is in its key. */
export const partKeys = {
  all: ['parts'] as const,
  episode: (episodeId: number) => [...partKeys.all, 'episode', episodeId] as const,
  buildTotals: (buildId: number, scope: 'published' | 'all') => [...partKeys.all, 'totals', buildId, scope] as const,
  ledger: (buildId: number, q: LedgerQuery) => [...partKeys.all, 'ledger', buildId, q] as const,
  sponsors: () => [...partKeys.all, 'sponsors'] as const,
  suppliers: (q: string, buildId: number | undefined) => [...partKeys.all, 'suppliers', q, buildId ?? null] as const,
};
