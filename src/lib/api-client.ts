import { CSRF_HEADER } from '../shared/http';
import type { ApiErrorBody } from '../shared/schemas/common';

/**
 * What reads an answer: anything with `parse`. A zod schema is one (forms, the workbench and the
 * editor validate answers with theirs); public reading code passes `typed<T>()`, which trusts the
 * server's answer as T without validating, so no zod code loads on the public pages.
 */
export interface Reader<T> {
  parse(data: unknown): T;
}

/** Reads an answer as T without checking it (the server is typed against the same shared schemas). */
export function typed<T>(): Reader<T> {
  return trusted as Reader<T>;
}
const trusted: Reader<unknown> = { parse: (data) => data };

/** An API answer that was not 2xx, carrying the server's error code and field messages. */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields?: Record<string, string[]>,
    /** Seconds from the Retry-After header of a 429, when the server sent one. */
    readonly retryAfter?: number,
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
  request<T>(method: Method, path: string, schema: Reader<T>, body?: unknown, signal?: AbortSignal): Promise<T>;
  get<T>(path: string, schema: Reader<T>, signal?: AbortSignal): Promise<T>;
  post<T>(path: string, body: unknown, schema: Reader<T>, signal?: AbortSignal): Promise<T>;
  put<T>(path: string, body: unknown, schema: Reader<T>, signal?: AbortSignal): Promise<T>;
  patch<T>(path: string, body: unknown, schema: Reader<T>, signal?: AbortSignal): Promise<T>;
  del<T>(path: string, schema: Reader<T>, signal?: AbortSignal): Promise<T>;
  /** Drops the cached CSRF token; call it whenever the session changes (sign-in, sign-out, deletion). */
  forgetCsrfToken(): void;
  /**
   * POSTs a multipart form with upload progress (XMLHttpRequest: fetch reports no upload progress).
   * Browser only. `onProgress` gets 0…1; aborting the signal cancels the upload (ApiError status 0).
   */
  upload<T>(
    path: string,
    form: FormData,
    schema: Reader<T>,
    opts?: { onProgress?: (share: number) => void; signal?: AbortSignal },
  ): Promise<T>;
}

/** For 204 answers: whatever arrives (normally nothing) is read as `undefined`. */
export const noContent: Reader<undefined> = { parse: () => undefined };

/** The CSRF token answer (`{ token }`); the same shape as csrfResponse in the shared schemas. */
const csrfAnswer: Reader<{ token: string }> = {
  parse(data) {
    const token = isRecord(data) ? data.token : undefined;
    if (typeof token !== 'string') throw new TypeError('the CSRF token answer has no token');
    return { token };
  },
};

export { CSRF_HEADER };
export const CSRF_TOKEN_PATH = '/api/csrf-token';
/** The error code the server answers a missing or stale CSRF token with (403). */
export const CSRF_INVALID = 'csrf_invalid';

interface Exchange {
  res: Response;
  json: unknown;
}

/** The one fetch wrapper: JSON in and out, CSRF header on writes, errors as ApiError. */
export function createApiClient(options: ApiClientOptions = {}): ApiClient {
  const doFetch = options.fetch ?? globalThis.fetch.bind(globalThis);
  const baseUrl = options.baseUrl ?? '';
  // One token per client instance, fetched on the first write; concurrent writes share the fetch.
  let csrfToken: Promise<string> | undefined;

  async function exchange(method: Method, path: string, body: unknown, signal: AbortSignal | undefined, csrf?: string): Promise<Exchange> {
    const headers: Record<string, string> = { accept: 'application/json', ...options.headers };
    if (body !== undefined) headers['content-type'] = 'application/json';
    if (csrf) headers[CSRF_HEADER] = csrf;
    const res = await doFetch(`${baseUrl}${path}`, {
      method,
      headers,
      body: body === undefined ? undefined : JSON.stringify(body),
      credentials: 'same-origin',
      signal,
    });
    const text = await res.text();
    return { res, json: text ? safeJson(text) : undefined };
  }

  function getCsrfToken(): Promise<string> {
    if (!csrfToken) {
      const pending = exchange('GET', CSRF_TOKEN_PATH, undefined, undefined).then((ex) => read(ex, csrfAnswer).token);
      csrfToken = pending;
      // A failed fetch must not stick: the next write tries again.
      pending.catch(() => {
        if (csrfToken === pending) csrfToken = undefined;
      });
    }
    return csrfToken;
  }

  async function request<T>(method: Method, path: string, schema: Reader<T>, body?: unknown, signal?: AbortSignal): Promise<T> {
    if (method === 'GET') return read(await exchange(method, path, body, signal), schema);
    let ex = await exchange(method, path, body, signal, await getCsrfToken());
    if (isCsrfInvalid(ex)) {
      // The session (and with it the token) may have changed since we fetched it: refetch once.
      csrfToken = undefined;
      ex = await exchange(method, path, body, signal, await getCsrfToken());
    }
    return read(ex, schema);
  }

  return {
    request,
    get: (path, schema, signal) => request('GET', path, schema, undefined, signal),
    post: (path, body, schema, signal) => request('POST', path, schema, body, signal),
    put: (path, body, schema, signal) => request('PUT', path, schema, body, signal),
    patch: (path, body, schema, signal) => request('PATCH', path, schema, body, signal),
    del: (path, schema, signal) => request('DELETE', path, schema, undefined, signal),
    forgetCsrfToken: () => {
      csrfToken = undefined;
    },
    upload: async (path, form, schema, opts = {}) => {
      const token = await getCsrfToken();
      const ex = await new Promise<Exchange>((resolve, reject) => {
        const xhr = new XMLHttpRequest();
        xhr.open('POST', `${baseUrl}${path}`);
        xhr.setRequestHeader('accept', 'application/json');
        xhr.setRequestHeader(CSRF_HEADER, token);
        xhr.upload.onprogress = (e) => {
          if (e.lengthComputable) opts.onProgress?.(e.loaded / e.total);
        };
        xhr.onload = () => {
          const headers = new Headers();
          const retry = xhr.getResponseHeader('retry-after');
          if (retry) headers.set('retry-after', retry);
          resolve({ res: new Response(null, { status: xhr.status, headers }), json: safeJson(xhr.responseText) });
        };
        xhr.onerror = () => reject(new ApiError(0, 'network_error', 'The upload could not reach the server'));
        xhr.onabort = () => reject(new ApiError(0, 'aborted', 'The upload was cancelled'));
        opts.signal?.addEventListener('abort', () => xhr.abort(), { once: true });
        xhr.send(form);
      });
      return read(ex, schema);
    },
  };
}

function isCsrfInvalid({ res, json }: Exchange): boolean {
  return res.status === 403 && errorOf(json)?.code === CSRF_INVALID;
}

function read<T>({ res, json }: Exchange, schema: Reader<T>): T {
  if (!res.ok) throw toApiError(res, json);
  return schema.parse(json);
}

function isRecord(v: unknown): v is Record<string, unknown> {
  return typeof v === 'object' && v !== null && !Array.isArray(v);
}

/**
 * The `error` of the API's one error shape (apiErrorBody in the shared schemas), or null when the body
 * is not of that shape: code and message strings, and fields, when present, a record of string lists.
 */
export function errorOf(json: unknown): ApiErrorBody['error'] | null {
  const error = isRecord(json) ? json.error : undefined;
  if (!isRecord(error) || typeof error.code !== 'string' || typeof error.message !== 'string') return null;
  const { code, message, fields } = error;
  if (fields === undefined) return { code, message };
  if (!isRecord(fields) || !Object.values(fields).every((f) => Array.isArray(f) && f.every((x) => typeof x === 'string'))) return null;
  return { code, message, fields: fields as Record<string, string[]> };
}

function toApiError(res: Response, json: unknown): ApiError {
  const retryAfter = parseRetryAfter(res.headers.get('retry-after'));
  const error = errorOf(json);
  if (error) {
    const { code, message, fields } = error;
    return new ApiError(res.status, code, message, fields, retryAfter);
  }
  return new ApiError(res.status, 'http_error', `Request failed with status ${res.status}`, undefined, retryAfter);
}

/** Retry-After is either seconds or an HTTP date; only the seconds form is worth a countdown. */
function parseRetryAfter(value: string | null): number | undefined {
  if (!value) return undefined;
  const seconds = Number(value);
  return Number.isInteger(seconds) && seconds >= 0 ? seconds : undefined;
}

function safeJson(text: string): unknown {
  try {
    return JSON.parse(text);
  } catch {
    return undefined;
  }
}
