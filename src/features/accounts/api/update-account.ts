import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { useApi } from '../../../lib/api-context';
import { account, type accountUpdate } from '../../../shared/schemas/accounts';
import { sessionOptions } from './get-session';

const updated = z.object({ account });

export type AccountUpdate = z.output<typeof accountUpdate>;

/** Saves display name and notice address; the session in the cache takes the answer as is. */
export function useUpdateAccount() {
  const api = useApi();
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: AccountUpdate) => api.patch('/api/account', body, updated),
    onSuccess: (data) => queryClient.setQueryData(sessionOptions(api).queryKey, { account: data.account }),
  });
}
