// Local stand-in for the S3 bucket that holds build media, backed by s3rver on loopback.
import { mkdir } from 'node:fs/promises';
import { createRequire } from 'node:module';
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import type { Server } from 'node:http';

export type S3FakeOptions = { port?: number; host?: string; directory: string; buckets: string[] };
export type S3Fake = { url: string; port: number; stop(): Promise<void> };

/** Starts an S3-compatible server on loopback with the given buckets created up front. */
export async function startS3Fake(opts: S3FakeOptions): Promise<S3Fake> {
  const host = opts.host ?? '127.0.0.1';
  await mkdir(opts.directory, { recursive: true });
  const server = new S3rver({
    address: host,
    port: opts.port ?? 0,
    directory: opts.directory,
    silent: true,
    configureBuckets: opts.buckets.map((name) => ({ name, configs: [] })),
  });
  const address = await server.run();
  const httpServer = server.httpServer;
  let stopped = false;
  return {
    url: `http://${urlHost(host)}:${address.port}`,
    port: address.port,
    async stop() {
      if (stopped || !httpServer) return;
      stopped = true;
      // Keep-alive sockets from the AWS SDK would otherwise hold close() open for seconds.
      httpServer.closeAllConnections();
      await new Promise<void>((resolve, reject) => httpServer.close((err) => (err ? reject(err) : resolve())));
    },
  };
}

/** Options for running the fake from the environment (shared with fakes/all.ts). */
export function s3FakeOptionsFromEnv(env: NodeJS.ProcessEnv = process.env): S3FakeOptions {
  return {
    port: portFromEnv(env.S3_FAKE_PORT, 4569, 'S3_FAKE_PORT'),
    directory: path.resolve(env.S3_FAKE_DIR ?? '.data/s3'),
    buckets: (env.S3_BUCKET ?? 'rivet-reel-media')
      .split(',')
      .map((b) => b.trim())
      .filter(Boolean),
  };
}

// Fails loudly on a typo rather than silently listening somewhere else.
function portFromEnv(value: string | undefined, fallback: number, name: string): number {
  if (value === undefined || value === '') return fallback;
  const port = Number(value);
  if (!Number.isInteger(port) || port < 0 || port > 65535) {
    throw new Error(`${name} must be a port number (0-65535), got "${value}"`);
  }
  return port;
}

// IPv6 literals need brackets inside a URL.
function urlHost(host: string): string {
  return host.includes(':') ? `[${host}]` : host;
}

// s3rver ships no type declarations; this is the small part of its API the fake relies on.
type S3rverInstance = {
  run(): Promise<{ port: number; address: string }>;
  httpServer?: Server;
};
type S3rverConstructor = new (options: {
  address: string;
  port: number;
  directory: string;
  silent: boolean;
  configureBuckets: { name: string; configs: string[] }[];
}) => S3rverInstance;
// Loaded through require so the missing declarations do not force an untyped import.
const S3rver = createRequire(import.meta.url)('s3rver') as S3rverConstructor;

const isMain = process.argv[1] !== undefined && import.meta.url === pathToFileURL(path.resolve(process.argv[1])).href;
if (isMain) {
  const options = s3FakeOptionsFromEnv();
  const fake = await startS3Fake(options);
  console.log(`s3 fake: ${fake.url} (buckets: ${options.buckets.join(', ')}; data in ${options.directory})`);
  const shutdown = () => void fake.stop().then(() => process.exit(0));
  process.once('SIGINT', shutdown);
  process.once('SIGTERM', shutdown);
}
