import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { apiErrorBody } from '../shared/schemas/common';
import { ApiError, createApiClient, CSRF_HEADER, errorOf, noContent, typed } from './api-client';

interface Call {
  method: string;
  url: string;
  csrf: string | null;
  body: string | null;
}

function json(status: number, body: unknown, headers: Record<string, string> = {}): Response {
  return new Response(JSON.stringify(body), { status, headers: { 'content-type': 'application/json', ...headers } });
}

/** A fake server: hands out numbered tokens and accepts only the newest (or, stale, not even the first). */
function fakeServer({ staleFirstToken = false } = {}) {
  const calls: Call[] = [];
  let issued = 0;
  let valid = '';
  const fakeFetch: typeof fetch = async (input, init) => {
    const headers = new Headers(init?.headers);
    const call: Call = {
      method: init?.method ?? 'GET',
      url: String(input),
      csrf: headers.get(CSRF_HEADER),
      body: typeof init?.body === 'string' ? init.body : null,
    };
    calls.push(call);
    if (call.url.endsWith('/api/csrf-token')) {
      issued += 1;
      // A stale first token: the session behind it changed before the first write arrived.
      valid = staleFirstToken && issued === 1 ? '' : `token-${issued}`;
      return json(200, { token: `token-${issued}` });
    }
    if (call.method === 'GET') return json(200, { ok: true });
    if (!valid || call.csrf !== valid) return json(403, { error: { code: 'csrf_invalid', message: 'Stale form token' } });
    return call.method === 'DELETE' ? new Response(null, { status: 204 }) : json(200, { saved: true });
  };
  return { calls, fakeFetch };
}

const saved = z.object({ saved: z.boolean() });

describe('createApiClient CSRF handling', () => {
  it('fetches the token once, lazily, and sends it on every write', async () => {
    const { calls, fakeFetch } = fakeServer();
    const api = createApiClient({ fetch: fakeFetch });

    await api.get('/api/session', z.object({ ok: z.boolean() }));
    expect(calls.map((c) => c.url)).toEqual(['/api/session']);
    expect(calls[0]!.csrf).toBeNull();

    await expect(api.post('/api/things', { a: 1 }, saved)).resolves.toEqual({ saved: true });
    await expect(api.patch('/api/things/1', { a: 2 }, saved)).resolves.toEqual({ saved: true });
    await expect(api.del('/api/things/1', noContent)).resolves.toBeUndefined();

    expect(calls.filter((c) => c.url === '/api/csrf-token')).toHaveLength(1);
    const writes = calls.filter((c) => c.method !== 'GET');
    expect(writes.map((c) => [c.method, c.csrf])).toEqual([
      ['POST', 'token-1'],
      ['PATCH', 'token-1'],
      ['DELETE', 'token-1'],
    ]);
    expect(writes[0]!.body).toBe('{"a":1}');
  });

  it('shares one token fetch between writes started together', async () => {
    const { calls, fakeFetch } = fakeServer();
    const api = createApiClient({ fetch: fakeFetch });
    await Promise.all([api.post('/api/a', {}, saved), api.post('/api/b', {}, saved)]);
    expect(calls.filter((c) => c.url === '/api/csrf-token')).toHaveLength(1);
  });

  it('refetches the token once and retries when the server answers csrf_invalid', async () => {
    const { calls, fakeFetch } = fakeServer({ staleFirstToken: true });
    const api = createApiClient({ fetch: fakeFetch });

    await expect(api.post('/api/things', {}, saved)).resolves.toEqual({ saved: true });
    expect(calls.map((c) => `${c.method} ${c.url} ${c.csrf ?? '-'}`)).toEqual([
      'GET /api/csrf-token -',
      'POST /api/things token-1',
      'GET /api/csrf-token -',
      'POST /api/things token-2',
    ]);

    // The fresh token is cached from then on.
    await api.post('/api/things', {}, saved);
    expect(calls.filter((c) => c.url === '/api/csrf-token')).toHaveLength(2);
  });

  it('gives up after one retry and reports the 403', async () => {
    const fakeFetch: typeof fetch = async (input) =>
      String(input).endsWith('/api/csrf-token')
        ? json(200, { token: 'never-good' })
        : json(403, { error: { code: 'csrf_invalid', message: 'Stale form token' } });
    const api = createApiClient({ fetch: fakeFetch });
    const err = await api.post('/api/things', {}, saved).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(ApiError);
    expect((err as ApiError).status).toBe(403);
    expect((err as ApiError).code).toBe('csrf_invalid');
  });

  it('does not retry other 403s', async () => {
    let writes = 0;
    const fakeFetch: typeof fetch = async (input) => {
      if (String(input).endsWith('/api/csrf-token')) return json(200, { token: 'token-1' });
      writes += 1;
      return json(403, { error: { code: 'forbidden', message: 'Not yours' } });
    };
    const api = createApiClient({ fetch: fakeFetch });
    await expect(api.post('/api/things', {}, saved)).rejects.toMatchObject({ status: 403, code: 'forbidden' });
    expect(writes).toBe(1);
  });

  it('fetches a new token after forgetCsrfToken (the session changed)', async () => {
    const { calls, fakeFetch } = fakeServer();
    const api = createApiClient({ fetch: fakeFetch });
    await api.post('/api/things', {}, saved);
    api.forgetCsrfToken();
    await api.post('/api/things', {}, saved);
    expect(calls.filter((c) => c.url === '/api/csrf-token')).toHaveLength(2);
    expect(calls.at(-1)!.csrf).toBe('token-2');
  });

  it('tries the token fetch again after it failed', async () => {
    let failNext = true;
    const fakeFetch: typeof fetch = async (input) => {
      if (String(input).endsWith('/api/csrf-token')) {
        if (failNext) {
          failNext = false;
          return json(503, { error: { code: 'unavailable', message: 'Down' } });
        }
        return json(200, { token: 'token-1' });
      }
      return json(200, { saved: true });
    };
    const api = createApiClient({ fetch: fakeFetch });
    await expect(api.post('/api/things', {}, saved)).rejects.toMatchObject({ status: 503 });
    await expect(api.post('/api/things', {}, saved)).resolves.toEqual({ saved: true });
  });

  it('carries Retry-After seconds on a 429', async () => {
    const fakeFetch: typeof fetch = async (input) =>
      String(input).endsWith('/api/csrf-token')
        ? json(200, { token: 'token-1' })
        : json(429, { error: { code: 'rate_limited', message: 'Slow down' } }, { 'retry-after': '120' });
    const api = createApiClient({ fetch: fakeFetch });
    await expect(api.post('/api/sign-in-links', {}, saved)).rejects.toMatchObject({ status: 429, code: 'rate_limited', retryAfter: 120 });
  });
});

describe('reading answers', () => {
  it('validates with a zod schema and trusts the answer with typed()', async () => {
    const fakeFetch: typeof fetch = async () => json(200, { ok: 'yes', extra: 1 });
    const api = createApiClient({ fetch: fakeFetch });
    await expect(api.get('/api/x', z.object({ ok: z.boolean() }))).rejects.toThrow();
    await expect(api.get('/api/x', typed<{ ok: string }>())).resolves.toEqual({ ok: 'yes', extra: 1 });
  });

  it('turns a CSRF token answer without a token into an error', async () => {
    const fakeFetch: typeof fetch = async () => json(200, { nope: true });
    const api = createApiClient({ fetch: fakeFetch });
    await expect(api.post('/api/things', {}, saved)).rejects.toThrow(/token/);
  });

  it('reads the error shape exactly as the shared apiErrorBody schema does', () => {
    const bodies: unknown[] = [
      { error: { code: 'not_found', message: 'Not found' } },
      { error: { code: 'invalid', message: 'Check the form', fields: { title: ['required'], body: [] } } },
      { error: { code: 'invalid', message: 'Check the form', fields: { title: 'required' } } },
      { error: { code: 'invalid', message: 'Check the form', fields: ['title'] } },
      { error: { code: 'invalid', message: 'Check the form', fields: null } },
      { error: { code: 'x', message: 'y', extra: true }, more: 1 },
      { error: { code: 1, message: 'y' } },
      { error: { code: 'x' } },
      { error: 'x' },
      { error: null },
      {},
      [],
      null,
      undefined,
      'text',
    ];
    for (const body of bodies) {
      const parsed = apiErrorBody.safeParse(body);
      expect(errorOf(body), JSON.stringify(body)).toEqual(parsed.success ? parsed.data.error : null);
    }
  });
});
