import type { Server, ServerResponse } from 'node:http';
import { answerClientErrorsInJson } from './client-error';

/**
 * Settings every HTTP server of ours gets — the production entry point, spawned test processes and
 * the in-process test app alike.
 *
 * Keep-alive: the server must keep an idle connection open longer than any client or proxy in front
 * of it does, or a client can send its next request on a connection the server is closing at that
 * moment, and that request fails with a reset ("other side closed") without reaching us. Fetch
 * (undici) closes idle connections after about 4 s and common proxies after 60 s; Node's default of
 * 5 s lost that race on a loaded machine. 65 s is the usual value above a 60 s proxy (common
 * practice). `headersTimeout` must exceed it, so a kept-alive connection is not timed out as a slow
 * request instead.
 */
export function prepareHttpServer(server: Server): void {
  server.keepAliveTimeout = 65_000;
  server.headersTimeout = 66_000;
  answerClientErrorsInJson(server);
}

/**
 * Stops accepting connections and resolves once every open one has ended. Idle keep-alive
 * connections are closed at once; a busy one is told `Connection: close` on its response and closed
 * when that response is done — with a 65 s keep-alive it would otherwise linger that long.
 */
export function closeGracefully(server: Server): Promise<void> {
  return new Promise((resolve, reject) => {
    server.on('request', (_req, res: ServerResponse) => {
      res.shouldKeepAlive = false;
    });
    const sweep = setInterval(() => server.closeIdleConnections(), 100);
    server.close((err) => {
      clearInterval(sweep);
      if (err) reject(err);
      else resolve();
    });
    server.closeIdleConnections();
  });
}
