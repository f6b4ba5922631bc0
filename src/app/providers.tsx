import { QueryClientProvider, type QueryClient } from '@tanstack/react-query';
import { useEffect, type ReactNode } from 'react';
import type { ApiClient } from '../lib/api-client';
import { ApiProvider } from '../lib/api-context';
import { SiteProvider, type Site } from '../lib/site-context';

/** Marks the document once React has taken over the server's HTML (browser tests wait for it). */
function HydrationMarker() {
  useEffect(() => {
    document.documentElement.dataset.hydrated = 'true';
  }, []);
  return null;
}

/** Everything every screen needs from context, on the server and in the browser alike. */
export function Providers({
  queryClient,
  api,
  site = { publicUrl: '' },
  children,
}: {
  queryClient: QueryClient;
  api: ApiClient;
  site?: Site;
  children: ReactNode;
}) {
  return (
    <QueryClientProvider client={queryClient}>
      <ApiProvider client={api}>
        <SiteProvider site={site}>
          {children}
          <HydrationMarker />
        </SiteProvider>
      </ApiProvider>
    </QueryClientProvider>
  );
}
