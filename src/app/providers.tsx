import { QueryClientProvider, type QueryClient } from '@tanstack/react-query';
import { useEffect, type ReactNode } from 'react';
import type { ApiClient } from '../lib/api-client';
import { ApiProvider } from '../lib/api-context';

/** Marks the document once React has taken over the server's HTML (browser tests wait for it). */
function HydrationMarker() {
  useEffect(() => {
    document.documentElement.dataset.hydrated = 'true';
  }, []);
  return null;
}

/** Everything every screen needs from context, on the server and in the browser alike. */
export function Providers({ queryClient, api, children }: { queryClient: QueryClient; api: ApiClient; children: ReactNode }) {
  return (
    <QueryClientProvider client={queryClient}>
      <ApiProvider client={api}>
        {children}
        <HydrationMarker />
      </ApiProvider>
    </QueryClientProvider>
  );
}
