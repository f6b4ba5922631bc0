import { useMutation, useQueryClient } from '@tanstack/react-query';
import { useNavigate } from 'react-router';
import { noContent } from '../../../lib/api-client';
import { useApi } from '../../../lib/api-context';
import { applySessionChange } from './session-change';

/** Ends the session, then goes to the front page and forgets what was fetched for this person. */
export function useSignOut() {
  const api = useApi();
  const queryClient = useQueryClient();
  const navigate = useNavigate();
  return useMutation({
    mutationFn: () => api.post('/api/session/sign-out', {}, noContent),
    onSuccess: async () => {
      // Leave first: the page on screen may be one only a signed-in person can see.
      await navigate('/');
      applySessionChange(queryClient, api, null);
    },
  });
}
