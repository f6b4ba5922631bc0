import { createContext, useContext, type ReactNode } from 'react';
import type { ApiClient } from './api-client';

const ApiContext = createContext<ApiClient | null>(null);

export function ApiProvider({ client, children }: { client: ApiClient; children: ReactNode }) {
  return <ApiContext.Provider value={client}>{children}</ApiContext.Provider>;
}

/** The API client of this render: same-origin in the browser, loopback to itself on the server. */
export function useApi(): ApiClient {
  const api = useContext(ApiContext);
  if (!api) throw new Error('useApi() used outside <ApiProvider>');
  return api;
}
