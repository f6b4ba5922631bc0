import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { ApiError } from '../../../lib/api-client';
import { useApi } from '../../../lib/api-context';
import { partKeys } from './keys';

export const importRow = z.object({
  row: z.number().int(),
  errors: z.record(z.string(), z.string()),
  description: z.string().nullable().optional(),
  episode: z.union([z.string(), z.number()]).nullable().optional(),
});
export type ImportRow = z.infer<typeof importRow>;
export const importResult = z.object({ saved: z.boolean(), imported: z.number().int().optional(), rows: z.array(importRow).optional() });
export type ImportResult = z.infer<typeof importResult>;

/** The server's 422 for a real import names every failing row; nothing was saved. */
export class ImportRefused extends Error {
  constructor(readonly rows: ImportRow[]) {
    super('Some rows have problems; nothing was saved');
  }
}

/**
 * Preview (dryRun) or import a ledger CSV. The API client drops the body of an error answer
 * beyond code and message, so this one request reads the 422 itself to keep its rows.
 */
export function useLedgerImport(buildId: number) {
  const api = useApi();
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: async ({ csv, dryRun }: { csv: string; dryRun: boolean }): Promise<ImportResult> => {
      try {
        return await api.post(`/api/builds/${buildId}/ledger/import`, { csv, dryRun }, importResult);
      } catch (err) {
        if (err instanceof ApiError && err.status === 422) {
          const again = await api.post(`/api/builds/${buildId}/ledger/import`, { csv, dryRun: true }, importResult);
          throw new ImportRefused(again.rows ?? []);
        }
        throw err;
      }
    },
    onSuccess: (result) => {
      if (result.saved) void queryClient.invalidateQueries({ queryKey: partKeys.all });
    },
  });
}
