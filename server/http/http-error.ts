/** An error with an HTTP status and a stable machine-readable code, safe to show to clients. */
export class HttpError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields?: Record<string, string[]>,
    /** Extra response headers, e.g. Retry-After on 429. */
    readonly headers?: Record<string, string>,
  ) {
    super(message);
    this.name = 'HttpError';
  }
}

export const notFound = (what = 'Resource') => new HttpError(404, 'not_found', `${what} not found`);
export const badRequest = (message: string, fields?: Record<string, string[]>) => new HttpError(400, 'invalid_request', message, fields);
export const serviceUnavailable = (message = 'A service this request needs is unavailable; try again shortly') =>
  new HttpError(503, 'service_unavailable', message);
