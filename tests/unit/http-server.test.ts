// How our HTTP servers treat kept-alive connections: an error reported after a complete response
// leaves the connection usable, and a graceful close does not wait out the keep-alive time.
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import express from 'express';
import { afterEach, describe, expect, it } from 'vitest';
import { errorHandler } from '../../server/http/error-handler';
import { closeGracefully, prepareHttpServer } from '../../server/http/server-settings';

const servers: http.Server[] = [];
afterEach(() => {
  for (const s of servers.splice(0)) {
    s.closeAllConnections();
    s.close();
  }
});

async function listen(handler: http.RequestListener): Promise<{ server: http.Server; port: number }> {
  const server = http.createServer(handler);
  prepareHttpServer(server);
  servers.push(server);
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  return { server, port: (server.address() as AddressInfo).port };
}

/** GET over the given agent; resolves with the status and the local port of the connection used. */
function get(port: number, agent: http.Agent, path = '/'): Promise<{ status: number; localPort: number }> {
  return new Promise((resolve, reject) => {
    const req = http.get({ host: '127.0.0.1', port, path, agent }, (res) => {
      res.resume();
      res.on('end', () => resolve({ status: res.statusCode ?? 0, localPort: req.socket?.localPort ?? 0 }));
    });
    req.on('error', reject);
  });
}

describe('errors reported after the response', () => {
  it('are logged, and the kept-alive connection carries the next request', async () => {
    const app = express();
    app.get('/', (_req, res, next) => {
      // As express-session does when saving the session fails: answer, then report the error.
      res.json({ ok: true });
      setImmediate(() => next(new Error('session store unavailable')));
    });
    app.use(errorHandler);
    const { port } = await listen(app);
    const agent = new http.Agent({ keepAlive: true, maxSockets: 1 });
    const first = await get(port, agent);
    await new Promise((r) => setTimeout(r, 50)); // the late error has been handled
    const second = await get(port, agent);
    agent.destroy();
    expect(first.status).toBe(200);
    expect(second.status).toBe(200);
    // The same connection: it was not destroyed in between.
    expect(second.localPort).toBe(first.localPort);
  });
});

describe('server settings', () => {
  it('keep idle connections longer than fetch (about 4 s) and common proxies (60 s) do', async () => {
    const { server } = await listen((_req, res) => res.end());
    expect(server.keepAliveTimeout).toBeGreaterThan(60_000);
    expect(server.headersTimeout).toBeGreaterThan(server.keepAliveTimeout);
  });

  it('close gracefully: a busy kept-alive connection ends after its response, without waiting out the keep-alive time', async () => {
    const { server, port } = await listen((_req, res) => setTimeout(() => res.end('done'), 300));
    const agent = new http.Agent({ keepAlive: true });
    const idle = await get(port, agent); // leaves an idle kept-alive connection behind
    const busy = get(port, agent);
    await new Promise((r) => setTimeout(r, 50));
    let closed = false;
    const closing = closeGracefully(server).then(() => (closed = true));
    expect((await busy).status).toBe(200); // the request in flight is answered
    await closing; // and the server closes long before its 65 s keep-alive would have run out
    agent.destroy();
    expect(idle.status).toBe(200);
    expect(closed).toBe(true);
  }, 10_000);
});
