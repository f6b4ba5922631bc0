import { useMutation } from '@tanstack/react-query';
import { z } from 'zod';
import { useApi } from '../../../lib/api-context';
import type { signInLinkRequest } from '../../../shared/schemas/accounts';

const accepted = z.object({ ok: z.literal(true) });

export type SignInLinkRequest = z.output<typeof signInLinkRequest>;

/** Asks for a one-time sign-in link by e-mail; the answer is the same whether or not the address is known. */
export function useRequestSignInLink() {
  const api = useApi();
  return useMutation({
    mutationFn: (body: SignInLinkRequest) => api.post('/api/sign-in-links', body, accepted),
  });
}
