import { createContext, useContext, type ReactNode } from 'react';

/** What every page needs to know about the site itself: its public address, for canonical and share links. */
export interface Site {
  /** e.g. https://rivet-reel.example, without a trailing slash; empty in tests renders relative links. */
  publicUrl: string;
}

const SiteContext = createContext<Site>({ publicUrl: '' });

export function SiteProvider({ site, children }: { site: Site; children: ReactNode }) {
  return <SiteContext.Provider value={site}>{children}</SiteContext.Provider>;
}

export function useSite(): Site {
  return useContext(SiteContext);
}

/** An absolute URL on this site for a path, as link previews and feeds need. */
export function useAbsoluteUrl(): (path: string) => string {
  const { publicUrl } = useSite();
  return (path) => publicUrl.replace(/\/$/, '') + path;
}
