// @vitest-environment happy-dom
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { cleanup, fireEvent, render, screen, within } from '@testing-library/react';
import type { ReactNode } from 'react';
import { afterEach, describe, expect, it } from 'vitest';
import { createApiClient } from '../../../lib/api-client';
import { ApiProvider } from '../../../lib/api-context';
import { FIGURE_CAUTION, figureChecks } from '../../../shared/figure-checks';
import type { Figure } from '../../../shared/schemas/figures';
import { episodeFiguresOptions } from '../api/get-episode-figures';
import { EpisodeFigures } from './episode-figures';

afterEach(() => {
  cleanup();
  localStorage.clear();
});

const housing: Figure = {
  id: 1,
  episodeId: 9,
  position: 0,
  fastener: 'Thermostat housing bolts',
  thread: 'M8',
  threadLabel: 'M8 × 1.25 (coarse)',
  gradeFitted: 'A2-70',
  gradeSpecified: '8.8',
  method: 'torque',
  value: 25,
  unit: 'N-m',
  angleStages: [],
  source: 'workshop-manual',
  wrenchRange: { min: 20, max: 100, unit: 'N-m' },
  system: { key: 'cooling', name: 'Cooling', safetyCritical: true },
  note: null,
  checks: figureChecks({
    thread: 'M8',
    gradeFitted: 'A2-70',
    gradeSpecified: '8.8',
    value: 25,
    unit: 'N-m',
    wrenchRange: { min: 20, max: 100, unit: 'N-m' },
  }),
  caution: FIGURE_CAUTION,
};
const snug: Figure = { ...housing, id: 2, fastener: 'Hose clip', method: 'snug', value: null, checks: [], system: null, wrenchRange: null };

function setup(items: Figure[]) {
  const queryClient = new QueryClient({ defaultOptions: { queries: { retry: false } } });
  const api = createApiClient({
    fetch: async () => new Response(JSON.stringify({ items }), { headers: { 'content-type': 'application/json' } }),
  });
  queryClient.setQueryData(episodeFiguresOptions(api, 9).queryKey, { items });
  const Wrapper = ({ children }: { children: ReactNode }) => (
    <QueryClientProvider client={queryClient}>
      <ApiProvider client={api}>{children}</ApiProvider>
    </QueryClientProvider>
  );
  return { Wrapper };
}

describe('<EpisodeFigures>', () => {
  it('shows a figure as recorded, its checks as caution bars and its plain caution', () => {
    const { Wrapper } = setup([housing, snug]);
    render(<EpisodeFigures episodeId={9} />, { wrapper: Wrapper });
    const card = screen.getByRole('heading', { name: 'Thermostat housing bolts' }).closest('li')!;
    expect(within(card).getByText('25')).toBeTruthy();
    expect(within(card).getByText('As recorded')).toBeTruthy();
    expect(within(card).getByText('Weaker than specified')).toBeTruthy();
    expect(within(card).getByText(/Stainless A2-70 is weaker than the Class 8\.8 specified/)).toBeTruthy();
    expect(within(card).getByText(/check the workshop manual for yours/)).toBeTruthy();
    expect(screen.getByText('By hand, snug')).toBeTruthy();
  });

  it('lets a reader toggle the unit; the recorded value stays and every card follows', () => {
    const second: Figure = { ...housing, id: 3, fastener: 'Pulley bolts', value: 90, unit: 'lbf-in', checks: [], wrenchRange: null };
    const { Wrapper } = setup([housing, second]);
    render(<EpisodeFigures episodeId={9} />, { wrapper: Wrapper });
    const group = screen.getByRole('group', { name: 'Unit for Thermostat housing bolts' });
    const lbfFt = within(group).getByRole('button', { name: 'lbf·ft' });
    expect(lbfFt.getAttribute('aria-pressed')).toBe('false');
    fireEvent.click(lbfFt);
    expect(lbfFt.getAttribute('aria-pressed')).toBe('true');
    // 25 N·m ÷ 1.355 818 N·m per lbf·ft = 18.44 → 18.4 (NIST SP 811 factor, three significant figures).
    const card = screen.getByRole('heading', { name: 'Thermostat housing bolts' }).closest('li')!;
    expect(within(card).getByText('18.4')).toBeTruthy();
    expect(within(card).getByText(/Recorded as 25 N·m/)).toBeTruthy();
    expect(within(card).getByText('Wrench 14.8–73.8 lbf·ft', { exact: false })).toBeTruthy();
    // 90 lbf·in ÷ 12 = 7.5 lbf·ft (exact).
    const pulley = screen.getByRole('heading', { name: 'Pulley bolts' }).closest('li')!;
    expect(within(pulley).getByText('7.5')).toBeTruthy();
    fireEvent.click(within(pulley).getByRole('button', { name: 'kgf·m' }));
    // 25 N·m ÷ 9.806 65 = 2.549 → 2.55 kgf·m (NIST SP 811, exact factor).
    expect(within(card).getByText('2.55')).toBeTruthy();
    expect(localStorage.getItem('rr-torque-unit')).toBe('kgf-m');
  });

  it('renders nothing for an episode without figures', () => {
    const { Wrapper } = setup([]);
    const { container } = render(<EpisodeFigures episodeId={9} />, { wrapper: Wrapper });
    expect(container.textContent).toBe('');
  });
});
