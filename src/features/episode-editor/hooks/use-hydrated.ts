import { useSyncExternalStore } from 'react';

const subscribe = () => () => undefined;

/**
 * False on the server and during hydration, true after: for what only the browser knows (the
 * reader's time zone and locale), so server HTML and the hydrating client agree.
 */
export function useHydrated(): boolean {
  return useSyncExternalStore(
    subscribe,
    () => true,
    () => false,
  );
}
