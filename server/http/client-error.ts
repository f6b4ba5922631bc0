import type { Server } from 'node:http';
import type { Duplex } from 'node:stream';

/**
 * Requests Node's HTTP parser refuses before Express sees them (a request line or headers over
 * `maxHeaderSize`, e.g. a huge query string; malformed HTTP) get the API's JSON error shape too,
 * instead of Node's bare status line — 431 for oversize headers, 400 otherwise.
 */
export function answerClientErrorsInJson(server: Server): void {
  server.on('clientError', (err: NodeJS.ErrnoException, socket: Duplex) => {
    if (!socket.writable || (err.code === 'ECONNRESET' && !socket.readable)) {
      socket.destroy();
      return;
    }
    const tooLarge = err.code === 'HPE_HEADER_OVERFLOW';
    const [status, reason, code, message] = tooLarge
      ? [431, 'Request Header Fields Too Large', 'headers_too_large', 'The address or headers are too long']
      : [400, 'Bad Request', 'bad_request', 'The request could not be read'];
    const body = JSON.stringify({ error: { code, message } });
    socket.end(
      `HTTP/1.1 ${status} ${reason}\r\nContent-Type: application/json; charset=utf-8\r\nContent-Length: ${Buffer.byteLength(body)}\r\nConnection: close\r\n\r\n${body}`,
    );
  });
}
