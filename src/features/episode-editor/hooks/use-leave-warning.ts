import { useEffect, useState } from 'react';
import { useBlocker, type Blocker } from 'react-router';

/**
 * Warns before leaving with unsaved changes: the browser's own prompt for closing or reloading the
 * tab; for a link inside the app, one last save first, and a question only when that fails.
 */
export function useLeaveWarning(hasUnsaved: boolean, saveNow: () => Promise<boolean>): { blocker: Blocker; asking: boolean } {
  const [asking, setAsking] = useState(false);

  useEffect(() => {
    if (!hasUnsaved) return;
    const onBeforeUnload = (event: BeforeUnloadEvent) => {
      event.preventDefault();
      // Older browsers still need returnValue set to show the prompt.
      event.returnValue = '';
    };
    window.addEventListener('beforeunload', onBeforeUnload);
    return () => window.removeEventListener('beforeunload', onBeforeUnload);
  }, [hasUnsaved]);

  const blocker = useBlocker(({ currentLocation, nextLocation }) => hasUnsaved && currentLocation.pathname !== nextLocation.pathname);

  useEffect(() => {
    if (blocker.state !== 'blocked') {
      setAsking(false);
      return;
    }
    let cancelled = false;
    void saveNow().then((saved) => {
      if (cancelled) return;
      if (saved) blocker.proceed();
      else setAsking(true);
    });
    return () => {
      cancelled = true;
    };
  }, [blocker, saveNow]);

  return { blocker, asking };
}
