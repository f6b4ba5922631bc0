// A tiny HTTP front that sends each request to the next of several servers in turn, as a load
// balancer without sticky sessions would. The two-process suites put it before two server processes.
import http from 'node:http';
import type { AddressInfo } from 'node:net';

export interface RoundRobin {
  url: string;
  /** Requests forwarded to each target, in the order of `targets`. */
  counts: number[];
  setTargets(targets: string[]): void;
  stop(): Promise<void>;
}

/** Listens on an ephemeral loopback port; targets can be set once they are known. */
export async function startRoundRobin(): Promise<RoundRobin> {
  let targets: URL[] = [];
  let next = 0;
  const counts: number[] = [];
  const agent = new http.Agent({ keepAlive: true });
  const server = http.createServer((req, res) => {
    if (!targets.length) {
      res.writeHead(503, { 'content-type': 'application/json' }).end('{"error":{"code":"service_unavailable","message":"no targets yet"}}');
      return;
    }
    const i = next++ % targets.length;
    counts[i] = (counts[i] ?? 0) + 1;
    const target = targets[i]!;
    const upstream = http.request(
      {
        host: target.hostname,
        port: target.port,
        method: req.method,
        path: req.url,
        headers: { ...req.headers, host: target.host },
        agent,
      },
      (up) => {
        res.writeHead(up.statusCode ?? 502, up.rawHeaders);
        up.pipe(res);
      },
    );
    upstream.on('error', () => {
      if (!res.headersSent) res.writeHead(502, { 'content-type': 'application/json' });
      res.end('{"error":{"code":"bad_gateway","message":"upstream failed"}}');
    });
    req.pipe(upstream);
  });
  server.keepAliveTimeout = 65_000; // longer than the clients' idle timeout, as server/http/server-settings.ts explains
  server.headersTimeout = 66_000;
  server.listen(0, '127.0.0.1');
  await new Promise<void>((resolve) => server.once('listening', resolve));
  const { port } = server.address() as AddressInfo;
  return {
    url: `http://127.0.0.1:${port}`,
    counts,
    setTargets(urls) {
      targets = urls.map((u) => new URL(u));
      counts.length = 0;
      for (let k = 0; k < urls.length; k += 1) counts.push(0);
    },
    async stop() {
      server.closeAllConnections();
      await new Promise<void>((resolve) => server.close(() => resolve()));
      agent.destroy();
    },
  };
}
