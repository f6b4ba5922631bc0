import { CSRF_HEADER } from '../../src/shared/http';
import { hashToken } from '../../server/services/tokens';
import type { Db } from '../../server/db/kysely';
import { randomBytes } from 'node:crypto';
import { sql } from 'kysely';

export interface TestResponse<T = unknown> {
  status: number;
  body: T;
  headers: Headers;
}

/** A browser-like HTTP client for API tests: keeps the session cookie and sends the CSRF token. */
export class TestClient {
  cookie: string | undefined;
  private csrf: string | undefined;

  constructor(readonly baseUrl: string) {}

  /** Sends a request; mutations carry the session's CSRF token unless `csrf: false`. */
  // eslint-disable-next-line @typescript-eslint/no-explicit-any -- response bodies are read loosely in tests
  async request<T = any>(
    method: string,
    path: string,
    body?: unknown,
    opts: { csrf?: boolean; headers?: Record<string, string> } = {},
  ): Promise<TestResponse<T>> {
    const headers: Record<string, string> = { accept: 'application/json', ...opts.headers };
    if (body !== undefined) headers['content-type'] = 'application/json';
    if (method !== 'GET' && opts.csrf !== false) headers[CSRF_HEADER] = await this.csrfToken();
    if (this.cookie) headers.cookie = this.cookie;
    const res = await fetch(`${this.baseUrl}${path}`, {
      method,
      headers,
      body: body === undefined ? undefined : JSON.stringify(body),
      redirect: 'manual',
    });
    this.keepCookie(res);
    const text = await res.text();
    let parsed: unknown = text;
    try {
      parsed = text ? JSON.parse(text) : undefined;
    } catch {
      /* not JSON: keep the text */
    }
    return { status: res.status, body: parsed as T, headers: res.headers };
  }

  /** Sends a body exactly as given (as application/json), with the session and CSRF token; the answer as text. */
  async rawRequest(method: string, path: string, raw?: string): Promise<{ status: number; text: string; contentType: string }> {
    const headers: Record<string, string> = { accept: 'application/json' };
    if (raw !== undefined) headers['content-type'] = 'application/json';
    if (method !== 'GET') headers[CSRF_HEADER] = await this.csrfToken();
    if (this.cookie) headers.cookie = this.cookie;
    const res = await fetch(`${this.baseUrl}${path}`, { method, headers, body: raw, redirect: 'manual' });
    this.keepCookie(res);
    return { status: res.status, text: await res.text(), contentType: res.headers.get('content-type') ?? '' };
  }

  // eslint-disable-next-line @typescript-eslint/no-explicit-any -- response bodies are read loosely in tests
  get<T = any>(path: string) {
    return this.request<T>('GET', path);
  }
  // eslint-disable-next-line @typescript-eslint/no-explicit-any -- response bodies are read loosely in tests
  post<T = any>(path: string, body: unknown = {}, opts?: { csrf?: boolean }) {
    return this.request<T>('POST', path, body, opts);
  }
  // eslint-disable-next-line @typescript-eslint/no-explicit-any -- response bodies are read loosely in tests
  patch<T = any>(path: string, body: unknown, opts?: { csrf?: boolean }) {
    return this.request<T>('PATCH', path, body, opts);
  }
  // eslint-disable-next-line @typescript-eslint/no-explicit-any -- response bodies are read loosely in tests
  put<T = any>(path: string, body: unknown, opts?: { csrf?: boolean }) {
    return this.request<T>('PUT', path, body, opts);
  }
  // eslint-disable-next-line @typescript-eslint/no-explicit-any -- response bodies are read loosely in tests
  delete<T = any>(path: string, opts?: { csrf?: boolean }) {
    return this.request<T>('DELETE', path, undefined, opts);
  }

  /** Reads (and caches) the CSRF token of the current session; a new session needs a new one. */
  async csrfToken(): Promise<string> {
    if (this.csrf) return this.csrf;
    const res = await fetch(`${this.baseUrl}/api/csrf-token`, { headers: this.cookie ? { cookie: this.cookie } : {} });
    this.keepCookie(res);
    this.csrf = ((await res.json()) as { token: string }).token;
    return this.csrf;
  }

  keepCookie(res: Response): void {
    for (const c of res.headers.getSetCookie()) {
      const pair = c.split(';')[0]!;
      if (pair.startsWith('rr_sid=')) {
        if (pair !== this.cookie) this.csrf = undefined;
        this.cookie = /Expires=Thu, 01 Jan 1970/.test(c) || pair === 'rr_sid=' ? undefined : pair;
      }
    }
  }

  forgetCsrf(): void {
    this.csrf = undefined;
  }
}

/** Signs the client in as the account with this e-mail address, through a real sign-in link. */
export async function signInByEmail(client: TestClient, db: Db, email: string): Promise<void> {
  const token = randomBytes(32).toString('base64url');
  await db
    .insertInto('sign_in_tokens')
    .values({ token_hash: hashToken(token), email, expires_at: sql<Date>`now() + interval '10 minutes'` })
    .execute();
  const res = await client.post('/api/sign-in-links/redeem', { token });
  if (res.status !== 200) throw new Error(`sign-in as ${email} failed: ${res.status} ${JSON.stringify(res.body)}`);
  client.forgetCsrf();
}
