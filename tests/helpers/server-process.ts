import { spawn, type ChildProcess } from 'node:child_process';
import net from 'node:net';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { TEST_BUCKET, TEST_SESSION_SECRET, type TestApp } from './test-app';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');

/** A port that was free a moment ago (listen on 0, read it, close). */
export async function freePort(): Promise<number> {
  const server = net.createServer();
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const { port } = server.address() as net.AddressInfo;
  await new Promise<void>((resolve) => server.close(() => resolve()));
  return port;
}

export interface ServerProcess {
  baseUrl: string;
  child: ChildProcess;
  /** What the process wrote to stderr (for failure messages). */
  stderr(): string;
  /** Sends SIGTERM and resolves with the exit code. */
  terminate(): Promise<number | null>;
}

/**
 * Spawns a second server process (`node --import tsx server/index.ts`) over the test app's
 * database, S3 and SMTP fakes, and waits until /api/health answers.
 */
export async function spawnServerProcess(
  app: Pick<TestApp, 'database' | 's3' | 'smtp'>,
  opts: { timeoutMs?: number; env?: Record<string, string>; publicUrl?: string } = {},
): Promise<ServerProcess> {
  const port = await freePort();
  const baseUrl = `http://127.0.0.1:${port}`;
  const child = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], {
    cwd: root,
    env: {
      PATH: process.env.PATH,
      HOME: process.env.HOME,
      NODE_ENV: 'test',
      LOG_LEVEL: 'silent',
      HOST: '127.0.0.1',
      PORT: String(port),
      PUBLIC_URL: opts.publicUrl ?? baseUrl,
      DATABASE_URL: app.database.url,
      DATABASE_POOL_MAX: '3',
      SESSION_SECRET: TEST_SESSION_SECRET,
      S3_ENDPOINT: app.s3.url,
      S3_BUCKET: TEST_BUCKET,
      SMTP_HOST: '127.0.0.1',
      SMTP_PORT: String(app.smtp.smtpPort),
      AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED: 'true',
      ...opts.env,
    },
    stdio: ['ignore', 'ignore', 'pipe'],
  });
  let stderr = '';
  child.stderr?.on('data', (chunk: Buffer) => (stderr += chunk.toString()));
  const exited = new Promise<number | null>((resolve) => child.once('exit', (code) => resolve(code)));
  let done = false;
  void exited.then(() => (done = true));

  // Generous: tsx compiles the server on start, which is slow on a busy 2-core machine.
  const deadline = Date.now() + (opts.timeoutMs ?? 45_000);
  for (;;) {
    if (done) throw new Error(`server process exited before answering: ${stderr}`);
    try {
      const res = await fetch(`${baseUrl}/api/health`);
      await res.arrayBuffer();
      break;
    } catch {
      if (Date.now() > deadline) {
        child.kill('SIGKILL');
        throw new Error(`server process did not answer /api/health in time: ${stderr}`);
      }
      await new Promise((r) => setTimeout(r, 100));
    }
  }
  return {
    baseUrl,
    child,
    stderr: () => stderr,
    async terminate() {
      if (!done) child.kill('SIGTERM');
      return exited;
    },
  };
}
