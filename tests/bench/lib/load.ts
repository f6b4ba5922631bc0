// autocannon runs and the bench-mode query count, shared by the benchmarks and the load test.
import { createHmac, randomBytes } from 'node:crypto';
import autocannon from 'autocannon';
import pg from 'pg';

export interface LoadResult {
  rps: number;
  p50_ms: number;
  p99_ms: number;
  /** Connection errors, timeouts and responses other than the expected status. */
  errors: number;
  requests: number;
  statusCounts: Record<string, number>;
}

export interface LoadOptions {
  url: string;
  connections: number;
  seconds: number;
  method?: 'GET' | 'POST';
  headers?: Record<string, string>;
  body?: string;
  /** Per-request bodies for writes, cycled (autocannon's `requests`). */
  expectStatus?: number;
}

/**
 * What every benchmark request says it accepts, as browsers and HTTP libraries do: answers the
 * server keeps gzipped (the episode read, totals, kept pages) go out gzipped, as they would to a
 * reader. The ceilings' small bodies are not compressed either way.
 */
export const CLIENT_HEADERS = { 'accept-encoding': 'gzip, deflate' } as const;

/** Runs autocannon against one URL and returns its figures. */
export async function load(opts: LoadOptions): Promise<LoadResult> {
  const result = await autocannon({
    url: opts.url,
    connections: opts.connections,
    duration: opts.seconds,
    method: opts.method ?? 'GET',
    headers: { ...CLIENT_HEADERS, ...opts.headers },
    body: opts.body,
    timeout: 10,
  });
  const expected = opts.expectStatus ?? 200;
  const counts = (result as unknown as { statusCodeStats?: Record<string, { count: number }> }).statusCodeStats ?? {};
  const statusCounts = Object.fromEntries(Object.entries(counts).map(([k, v]) => [k, v.count]));
  const unexpected = Object.entries(statusCounts).reduce((n, [k, v]) => n + (Number(k) === expected ? 0 : v), 0);
  return {
    rps: Math.round(result.requests.average),
    p50_ms: result.latency.p50,
    p99_ms: result.latency.p99,
    errors: result.errors + result.timeouts + unexpected,
    requests: result.requests.total,
    statusCounts,
  };
}

/** The bench-mode running total of SQL queries (and the statements after `since`). */
export async function queryLog(
  baseUrl: string,
  since?: number,
): Promise<{ queries: number; log: Array<{ seq: number; text: string; values: unknown[] }> }> {
  const res = await fetch(`${baseUrl}/__bench/queries${since === undefined ? '' : `?since=${since}`}`);
  if (!res.ok) throw new Error(`/__bench/queries answered ${res.status}: is the server in bench mode?`);
  return (await res.json()) as { queries: number; log: Array<{ seq: number; text: string; values: unknown[] }> };
}

/** Waits until the server has sent no query for half a second (an earlier load's stragglers are done). */
export async function quiet(baseUrl: string): Promise<void> {
  let last = (await queryLog(baseUrl)).queries;
  for (let i = 0; i < 60; i += 1) {
    await new Promise((r) => setTimeout(r, 500));
    const now = (await queryLog(baseUrl)).queries;
    if (now === last) return;
    last = now;
  }
}

/** SQL queries per request: `n` sequential requests, the count read before and after. */
export async function queriesPerRequest(baseUrl: string, send: () => Promise<Response>, n = 5): Promise<number> {
  await (await send()).arrayBuffer();
  await quiet(baseUrl);
  const before = (await queryLog(baseUrl)).queries;
  for (let i = 0; i < n; i += 1) await (await send()).arrayBuffer();
  const after = (await queryLog(baseUrl)).queries;
  return Math.round(((after - before - 0) / n) * 10) / 10;
}

/**
 * A signed-in session for the bench: a session row for the account, its cookie signed as
 * express-session signs it (cookie-signature: HMAC-SHA256, base64 without padding), and its CSRF token.
 */
export async function benchSession(
  databaseUrl: string,
  baseUrl: string,
  secret: string,
  userId: number,
): Promise<{ cookie: string; csrf: string }> {
  const sid = randomBytes(24).toString('base64url');
  const maxAge = 30 * 24 * 3600 * 1000;
  const sess = {
    cookie: { originalMaxAge: maxAge, expires: new Date(Date.now() + maxAge).toISOString(), httpOnly: true, path: '/', sameSite: 'lax' },
    userId,
  };
  const client = new pg.Client({ connectionString: databaseUrl });
  await client.connect();
  try {
    await client.query('insert into sessions (sid, sess, expire) values ($1, $2, $3)', [sid, sess, new Date(Date.now() + maxAge)]);
  } finally {
    await client.end();
  }
  const signature = createHmac('sha256', secret).update(sid).digest('base64').replace(/=+$/, '');
  const cookie = `rr_sid=${encodeURIComponent(`s:${sid}.${signature}`)}`;
  const res = await fetch(`${baseUrl}/api/csrf-token`, { headers: { cookie } });
  if (!res.ok) throw new Error(`csrf-token answered ${res.status}`);
  const { token } = (await res.json()) as { token: string };
  return { cookie, csrf: token };
}
