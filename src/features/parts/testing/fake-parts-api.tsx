import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import type { ReactNode } from 'react';
import { createApiClient } from '../../../lib/api-client';
import { ApiProvider } from '../../../lib/api-context';
import { lineAmounts } from '../../../shared/money';
import { computeTotals } from '../../../shared/parts-totals';
import type { PartLine, PartLineInput } from '../../../shared/schemas/parts';
import { totalsLineOf } from '../lib/part-line-form';

// Test helpers for the parts screens: a fake server that keeps one episode's lines as the API
// does (positions, amounts, totals), with invented suppliers.

export interface Call {
  method: string;
  url: string;
  body: Record<string, unknown> | null;
}

function json(status: number, body: unknown): Response {
  return new Response(JSON.stringify(body), { status, headers: { 'content-type': 'application/json' } });
}

const sponsors = [{ id: 3, slug: 'quillon-works', name: 'Quillon Works', website: null, logoUrl: null }];
const suppliers = [
  { id: 1, name: 'Brackenford Motor Spares', website: null, usedInBuild: true, sponsor: null },
  { id: 2, name: 'Quillon Fasteners', website: null, usedInBuild: false, sponsor: { id: 3, slug: 'quillon-works', name: 'Quillon Works' } },
];

export function createFakePartsServer({ episodeId = 41, buildCurrency = 'EUR' } = {}) {
  const state = { lines: [] as PartLine[], calls: [] as Call[], nextId: 500 };
  const present = (input: PartLineInput, id: number, position: number): PartLine => {
    const amounts = lineAmounts(input);
    const supplier = suppliers.find((s) => s.id === input.supplierId);
    return {
      ...input,
      id,
      buildId: 7,
      episodeId,
      position,
      supplier: supplier ? { id: supplier.id, name: supplier.name } : null,
      sponsor: sponsors.find((sp) => sp.id === input.sponsorId) ?? null,
      suggestedSponsor: supplier?.sponsor ?? null,
      valueGivenMinor: 0,
      openItem: null,
      receipt: null,
      amounts,
      buildAmounts: { ...amounts, avoidedMinor: input.avoidedCostMinor },
      episode: { number: 4, title: 'Rear brakes', slug: 'rear-brakes' },
    } as PartLine;
  };
  const fetch: typeof globalThis.fetch = async (input, init) => {
    const call: Call = {
      method: init?.method ?? 'GET',
      url: String(input),
      body: typeof init?.body === 'string' ? JSON.parse(init.body) : null,
    };
    state.calls.push(call);
    const { method, url, body } = call;
    if (url === '/api/csrf-token') return json(200, { token: 'csrf' });
    if (url === '/api/sponsors') return json(200, { items: sponsors });
    if (url.startsWith('/api/suppliers')) {
      const q = new URL(url, 'http://x').searchParams.get('q')?.toLowerCase() ?? '';
      return json(200, { items: suppliers.filter((s) => s.name.toLowerCase().includes(q)) });
    }
    if (url === `/api/episodes/${episodeId}/part-lines` && method === 'GET') {
      const inputs = state.lines.map((l) => ({ ...l, supplierId: l.supplier?.id ?? null }) as unknown as PartLineInput);
      return json(200, { items: state.lines, totals: computeTotals(inputs.map(totalsLineOf), buildCurrency) });
    }
    if (url === `/api/episodes/${episodeId}/part-lines` && method === 'POST') {
      const { position, ...line } = body as PartLineInput & { position?: number };
      if (line.description === 'refused')
        return json(400, { error: { code: 'invalid_request', message: 'Invalid', fields: { unitPriceMinor: ['too dear'] } } });
      const at = position ?? state.lines.length;
      const created = present(line, state.nextId++, at);
      state.lines.splice(at, 0, created);
      state.lines.forEach((l, i) => (l.position = i));
      return json(201, created);
    }
    const m = /^\/api\/part-lines\/(\d+)$/.exec(url);
    if (m) {
      const i = state.lines.findIndex((l) => l.id === Number(m[1]));
      if (method === 'DELETE') {
        state.lines.splice(i, 1);
        return new Response(null, { status: 204 });
      }
      const old = state.lines[i]!;
      const merged = { ...old, supplierId: old.supplier?.id ?? null, ...(body as object) } as unknown as PartLineInput;
      state.lines[i] = present(merged, old.id, old.position);
      return json(200, state.lines[i]);
    }
    return json(404, { error: { code: 'not_found', message: 'Not found' } });
  };
  return { state, fetch, calls: (method: string) => state.calls.filter((c) => c.method === method && c.url !== '/api/csrf-token') };
}

export function makePartsWrapper(fetch: typeof globalThis.fetch) {
  const queryClient = new QueryClient({ defaultOptions: { queries: { retry: false } } });
  const api = createApiClient({ fetch });
  return function Wrapper({ children }: { children: ReactNode }) {
    return (
      <QueryClientProvider client={queryClient}>
        <ApiProvider client={api}>{children}</ApiProvider>
      </QueryClientProvider>
    );
  };
}
