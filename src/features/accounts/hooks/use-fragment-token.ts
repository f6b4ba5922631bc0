import { useEffect, useState } from 'react';
import { useLocation } from 'react-router';

export type FragmentToken = { state: 'reading' } | { state: 'missing' } | { state: 'found'; token: string };

/**
 * The `#token=…` of an e-mailed link. The fragment never reaches the server (nor its logs), so the
 * server render cannot know it: it is read in an effect, and the first render says "reading" on
 * both sides, which keeps hydration exact.
 */
export function useFragmentToken(): FragmentToken {
  const { hash } = useLocation();
  const [result, setResult] = useState<FragmentToken>({ state: 'reading' });
  useEffect(() => {
    const token = new URLSearchParams(hash.replace(/^#/, '')).get('token');
    setResult(token ? { state: 'found', token } : { state: 'missing' });
  }, [hash]);
  return result;
}
