import type { z } from 'zod';
import { apiErrorBody } from '../shared/schemas/common';

/** An API answer that was not 2xx, carrying the server's error code and field messages. */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields?: Record<string, string[]>,
  ) {
    super(message);
    this.name = 'ApiError';
  }
}

export interface ApiClientOptions {
  /** Empty in the browser (same origin); the server's own address when rendering on the server. */
  baseUrl?: string;
  /** Extra headers, e.g. the incoming request's cookie during server rendering. */
  headers?: Record<string, string>;
  fetch?: typeof fetch;
}

type Method = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';

export interface ApiClient {
  request<S extends z.ZodType>(method: Method, path: string, schema: S, body?: unknown, signal?: AbortSignal): Promise<z.infer<S>>;
  get<S extends z.ZodType>(path: string, schema: S, signal?: AbortSignal): Promise<z.infer<S>>;
}

const CSRF_COOKIE = 'rr_csrf';
export const CSRF_HEADER = 'x-csrf-token';

function csrfFromCookie(): string | undefined {
  if (typeof document === 'undefined') return undefined;
  const hit = document.cookie.split('; ').find((c) => c.startsWith(`${CSRF_COOKIE}=`));
  return hit ? decodeURIComponent(hit.slice(CSRF_COOKIE.length + 1)) : undefined;
}

/** The one fetch wrapper: JSON in and out, CSRF header on writes, errors as ApiError. */
export function createApiClient(options: ApiClientOptions = {}): ApiClient {
  const doFetch = options.fetch ?? globalThis.fetch.bind(globalThis);
  const baseUrl = options.baseUrl ?? '';

  async function request<S extends z.ZodType>(method: Method, path: string, schema: S, body?: unknown, signal?: AbortSignal) {
    const headers: Record<string, string> = { accept: 'application/json', ...options.headers };
    if (body !== undefined) headers['content-type'] = 'application/json';
    const csrf = method === 'GET' ? undefined : csrfFromCookie();
    if (csrf) headers[CSRF_HEADER] = csrf;
    const res = await doFetch(`${baseUrl}${path}`, {
      method,
      headers,
      body: body === undefined ? undefined : JSON.stringify(body),
      credentials: 'same-origin',
      signal,
    });
    const text = await res.text();
    const json: unknown = text ? safeJson(text) : undefined;
    if (!res.ok) {
      const parsed = apiErrorBody.safeParse(json);
      if (parsed.success) {
        const { code, message, fields } = parsed.data.error;
        throw new ApiError(res.status, code, message, fields);
      }
      throw new ApiError(res.status, 'http_error', `Request failed with status ${res.status}`);
    }
    return schema.parse(json) as z.infer<S>;
  }

  return {
    request,
    get: (path, schema, signal) => request('GET', path, schema, undefined, signal),
  };
}

function safeJson(text: string): unknown {
  try {
    return JSON.parse(text);
  } catch {
    return undefined;
  }
}
