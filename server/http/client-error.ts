import type { Server } from 'node:http';
import type { Socket } from 'node:net';

const STATUS: Record<string, [number, string, string, string]> = {
  HPE_HEADER_OVERFLOW: [431, 'Request Header Fields Too Large', 'headers_too_large', 'The address or headers are too long'],
  ERR_HTTP_REQUEST_TIMEOUT: [408, 'Request Timeout', 'request_timeout', 'The request took too long to arrive'],
};

/**
 * Requests Node's HTTP parser refuses before Express sees them (a request line or headers over
 * `maxHeaderSize`, e.g. a huge query string; malformed HTTP) get the API's JSON error shape too,
 * instead of Node's bare status line — 431 for oversize headers, 408 for a timeout, 400 otherwise.
 * Like Node's own handler, it answers only when no response has begun on the socket, then closes it.
 */
export function answerClientErrorsInJson(server: Server): void {
  server.on('clientError', (err: NodeJS.ErrnoException, socket: Socket) => {
    // Node's own rule (lib/_http_server.js socketOnError): answer only when no response on this
    // socket has begun, so a peer is never sent a reply in the middle of another.
    const inFlight = (socket as Socket & { _httpMessage?: { headersSent: boolean } | null })._httpMessage;
    if (socket.writable && (!inFlight || !inFlight.headersSent) && err.code !== 'ECONNRESET') {
      const [status, reason, code, message] = STATUS[err.code ?? ''] ?? [
        400,
        'Bad Request',
        'bad_request',
        'The request could not be read',
      ];
      const body = JSON.stringify({ error: { code, message } });
      socket.end(
        `HTTP/1.1 ${status} ${reason}\r\nContent-Type: application/json; charset=utf-8\r\nContent-Length: ${Buffer.byteLength(body)}\r\nConnection: close\r\n\r\n${body}`,
      );
      return;
    }
    socket.destroy(err);
  });
}
