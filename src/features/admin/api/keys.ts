import type { z } from 'zod';
import type { adminAccountsQuery } from '../../../shared/schemas/accounts';

export type AdminAccountsQuery = z.output<typeof adminAccountsQuery>;

/** Query-key factory for the admin screens: every variable a fetcher uses is in its key. */
export const adminKeys = {
  all: ['admin'] as const,
  accounts: () => [...adminKeys.all, 'accounts'] as const,
  accountList: (q: AdminAccountsQuery) => [...adminKeys.accounts(), 'list', q] as const,
};
