import { QueryClientProvider, type QueryClient } from '@tanstack/react-query';
import type { ReactNode } from 'react';
import type { ApiClient } from '../lib/api-client';
import { ApiProvider } from '../lib/api-context';

/** Everything every screen needs from context, on the server and in the browser alike. */
export function Providers({ queryClient, api, children }: { queryClient: QueryClient; api: ApiClient; children: ReactNode }) {
  return (
    <QueryClientProvider client={queryClient}>
      <ApiProvider client={api}>{children}</ApiProvider>
    </QueryClientProvider>
  );
}
