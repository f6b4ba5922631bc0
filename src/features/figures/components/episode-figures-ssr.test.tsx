// @vitest-environment node
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { renderToString } from 'react-dom/server';
import { expect, it } from 'vitest';
import { createApiClient } from '../../../lib/api-client';
import { ApiProvider } from '../../../lib/api-context';
import { FIGURE_CAUTION } from '../../../shared/figure-checks';
import { episodeFiguresOptions } from '../api/get-episode-figures';
import { EpisodeFigures } from './episode-figures';

// The server renders the episode page with the figures primed by its loader: no window, no storage.
it('renders on the server from a primed cache, in the recorded units', () => {
  expect(typeof window).toBe('undefined');
  const queryClient = new QueryClient();
  const api = createApiClient({ fetch: () => Promise.reject(new Error('no fetch during render')) });
  queryClient.setQueryData(episodeFiguresOptions(api, 9).queryKey, {
    items: [
      {
        id: 1,
        episodeId: 9,
        position: 0,
        fastener: 'Cylinder head nuts',
        thread: 'M8',
        threadLabel: 'M8 × 1.25 (coarse)',
        gradeFitted: '8.8',
        gradeSpecified: '8.8',
        method: 'torque-angle',
        value: 1,
        unit: 'kgf-m',
        angleStages: [30, 30],
        source: 'workshop-manual',
        wrenchRange: null,
        system: null,
        note: null,
        checks: [],
        caution: FIGURE_CAUTION,
      },
    ],
  });
  const html = renderToString(
    <QueryClientProvider client={queryClient}>
      <ApiProvider client={api}>
        <EpisodeFigures episodeId={9} />
      </ApiProvider>
    </QueryClientProvider>,
  );
  expect(html).toContain('Cylinder head nuts');
  expect(html).toContain('then 30°, then 30°');
  expect(html).toContain('kgf·m');
  expect(html).toContain('As recorded');
});
