import type { ErrorRequestHandler, RequestHandler } from 'express';
import { HttpError } from './http-error';

interface PgError {
  code?: string;
  constraint?: string;
}

// Connection-level failures: the database or a service is down, not the request's fault.
const UNAVAILABLE_CODES = new Set([
  'ECONNREFUSED',
  'ECONNRESET',
  'ETIMEDOUT',
  'EPIPE',
  '57P01',
  '57P02',
  '57P03',
  '08000',
  '08003',
  '08006',
]);

/** Maps any error to the one JSON error shape; never leaks stack traces or raw messages. */
export function toHttpError(err: unknown): HttpError {
  if (err instanceof HttpError) return err;
  const e = err as { type?: string; status?: number; code?: string; message?: string } & PgError;
  if (e?.code === 'csrf_invalid') return new HttpError(403, 'csrf_invalid', 'Missing or invalid CSRF token; reload the page and try again');
  if (e?.type === 'entity.parse.failed')
    return new HttpError(400, 'malformed_json', 'The request body is not valid JSON', { body: ['not valid JSON'] });
  if (e?.type === 'entity.too.large') return new HttpError(413, 'payload_too_large', 'The request body is too large');
  if (e?.type === 'encoding.unsupported' || e?.type === 'charset.unsupported')
    return new HttpError(415, 'unsupported_encoding', 'Unsupported request encoding');
  if (e?.code === '23505')
    return new HttpError(409, 'conflict', 'That already exists', e.constraint ? { [e.constraint]: ['already exists'] } : undefined);
  if (e?.code === '23503') return new HttpError(409, 'conflict', 'A referenced record does not exist or is still in use');
  if (e?.code === '22P02' || e?.code === '22003') return new HttpError(400, 'invalid_request', 'A value is out of range or malformed');
  if (e?.code && UNAVAILABLE_CODES.has(e.code))
    return new HttpError(503, 'service_unavailable', 'A service this request needs is unavailable; try again shortly');
  if (
    e?.message &&
    /Connection terminated|timeout exceeded when trying to connect|Client has encountered a connection error/i.test(e.message)
  ) {
    return new HttpError(503, 'service_unavailable', 'A service this request needs is unavailable; try again shortly');
  }
  if (typeof e?.status === 'number' && e.status >= 400 && e.status < 500)
    return new HttpError(e.status, 'invalid_request', 'The request could not be processed');
  return new HttpError(500, 'internal', 'Something went wrong on our side');
}

/** The last middleware: logs server faults and answers with `{ error: { code, message, fields? } }`. */
export const errorHandler: ErrorRequestHandler = (err, req, res, next) => {
  // An error reported after the response was complete (express-session saves the session as the
  // response ends and reports a failed save afterwards): the client has its answer, so log it and
  // leave the connection alone. Express's own handler would destroy the socket, and a client that
  // had already sent its next request on that kept-alive connection would see it fail.
  if (res.writableEnded) {
    req.log?.error({ err }, 'error after the response was sent');
    return;
  }
  // Part of a response went out: only closing the connection can tell the client it is incomplete.
  if (res.headersSent) return next(err);
  const httpError = toHttpError(err);
  // The method and path (never the query: it can carry tokens), for when the request log is off.
  if (httpError.status >= 500) req.log?.error({ err, method: req.method, path: req.path }, 'request failed');
  if (httpError.status === 503) res.setHeader('retry-after', '5');
  for (const [k, v] of Object.entries(httpError.headers ?? {})) res.setHeader(k, v);
  res.status(httpError.status).json({
    error: { code: httpError.code, message: httpError.message, ...(httpError.fields ? { fields: httpError.fields } : {}) },
  });
};

/** Unknown /api paths answer 404 JSON, never the HTML page. */
export const apiNotFound: RequestHandler = (req, res) => {
  res.status(404).json({ error: { code: 'not_found', message: `No API route for ${req.method} ${req.path}` } });
};
