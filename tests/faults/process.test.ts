// Spawned server processes under faults: the job worker keeps delivering after PostgreSQL restarts,
// and SIGTERM lets in-flight requests finish, refuses new ones and exits 0.
import http from 'node:http';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { controlCluster } from '../../scripts/lib/postgres';
import { CSRF_HEADER } from '../../src/shared/http';
import { TestClient } from '../helpers/http-client';
import { spawnServerProcess, type ServerProcess } from '../helpers/server-process';
import { startTestApp, type TestApp } from '../helpers/test-app';

let app: TestApp;
const spawned: ServerProcess[] = [];
beforeAll(async () => {
  app = await startTestApp({ env: { RATE_LIMIT_MULTIPLIER: '1000' } });
});
afterAll(async () => {
  await Promise.allSettled(spawned.map((p) => p.terminate()));
  await app?.stop();
});

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/** Waits until the fake has received mail for the address; returns the copies and how long it took. */
async function mailFor(address: string, timeoutMs: number): Promise<{ copies: number; ms: number }> {
  const started = Date.now();
  while (Date.now() - started < timeoutMs) {
    const copies = app.smtp.messages().filter((m) => m.to.includes(address)).length;
    if (copies > 0) return { copies, ms: Date.now() - started };
    await sleep(200);
  }
  return { copies: 0, ms: Date.now() - started };
}

describe('the job worker across a PostgreSQL restart', () => {
  it('keeps polling after the database comes back: mail queued afterwards is delivered once, by the same process', async () => {
    const proc = await spawnServerProcess(app);
    spawned.push(proc);
    const client = new TestClient(proc.baseUrl);
    expect((await client.post('/api/sign-in-links', { email: 'worker-before@example.test' })).status).toBe(202);
    const before = await mailFor('worker-before@example.test', 30_000);

    const dataDir = inject('pgFaultsDataDir');
    await controlCluster(dataDir, 'stop');
    await sleep(2_000);
    const startAt = Date.now();
    await controlCluster(dataDir, 'start');
    let recoveredMs = -1;
    while (Date.now() - startAt < 30_000) {
      const res = await fetch(`${proc.baseUrl}/api/health`).catch(() => null);
      const body = res ? ((await res.json()) as { services?: { database?: string } }) : null;
      if (body?.services?.database === 'up') {
        recoveredMs = Date.now() - startAt;
        break;
      }
      await sleep(200);
    }
    client.forgetCsrf();
    const queued = await client.post('/api/sign-in-links', { email: 'worker-after@example.test' });
    const after = await mailFor('worker-after@example.test', 30_000);
    await sleep(3_000); // two more polling rounds: nothing goes out twice
    const copiesAfter = app.smtp.messages().filter((m) => m.to.includes('worker-after@example.test')).length;
    console.log(
      `[faults] worker process: mail before the restart delivered in ${before.ms} ms; PostgreSQL stopped 2 s, process saw it again ` +
        `${recoveredMs} ms after the start; mail queued afterwards (${queued.status}) delivered in ${after.ms} ms, ${copiesAfter} copy; ` +
        `process ${proc.child.exitCode === null ? 'still running' : `exited ${proc.child.exitCode}`}`,
    );
    expect(before.copies).toBe(1);
    expect(recoveredMs).toBeGreaterThanOrEqual(0);
    expect(queued.status).toBe(202);
    expect(after.copies).toBe(1);
    expect(copiesAfter).toBe(1);
    expect(proc.child.exitCode).toBeNull();
  });
});

/** Opens a POST and sends only the first half of its body; `finish()` sends the rest and reads the answer. */
function halfSentRequest(baseUrl: string, path: string, body: string, headers: Record<string, string>) {
  const url = new URL(path, baseUrl);
  const bytes = Buffer.from(body);
  let answer: Promise<{ status: number; text: string }> = Promise.reject(new Error('not finished'));
  answer.catch(() => undefined);
  const req = http.request({
    host: url.hostname,
    port: url.port,
    path: url.pathname,
    method: 'POST',
    agent: false,
    headers: { ...headers, 'content-type': 'application/json', 'content-length': String(bytes.length), connection: 'close' },
  });
  answer = new Promise((resolve, reject) => {
    req.on('response', (res) => {
      let text = '';
      res.on('data', (c: Buffer) => (text += c.toString()));
      res.on('end', () => resolve({ status: res.statusCode ?? 0, text }));
    });
    req.on('error', reject);
  });
  req.write(bytes.subarray(0, bytes.length >> 1));
  return {
    finish() {
      req.end(bytes.subarray(bytes.length >> 1));
      return answer;
    },
  };
}

describe('SIGTERM', () => {
  it('lets in-flight requests complete, refuses new connections and exits 0', async () => {
    const proc = await spawnServerProcess(app);
    spawned.push(proc);
    const client = new TestClient(proc.baseUrl);
    const token = await client.csrfToken();
    const headers: Record<string, string> = {
      [CSRF_HEADER]: token,
      accept: 'application/json',
      ...(client.cookie ? { cookie: client.cookie } : {}),
    };
    const inFlight = [1, 2, 3].map((i) =>
      halfSentRequest(proc.baseUrl, '/api/sign-in-links', JSON.stringify({ email: `sigterm-${i}@example.test` }), headers),
    );
    await sleep(500); // the server has accepted the connections and is reading the bodies
    const exited = proc.terminate();
    await sleep(500);
    let newRequest: string;
    try {
      const res = await fetch(`${proc.baseUrl}/api/health`);
      newRequest = `answered ${res.status}`;
    } catch (err) {
      newRequest = `refused (${((err as Error).cause as { code?: string })?.code ?? (err as Error).message})`;
    }
    const answers = await Promise.all(inFlight.map((r) => r.finish()));
    const code = await exited;
    console.log(
      `[faults] SIGTERM with ${inFlight.length} requests in flight: they answered ${answers.map((a) => a.status).join(', ')}; ` +
        `a new request was ${newRequest}; the process exited with ${code}`,
    );
    expect(answers.map((a) => a.status)).toEqual([202, 202, 202]);
    expect(newRequest).toMatch(/^refused/);
    expect(code).toBe(0);
    expect(proc.stderr()).not.toMatch(/forcing shutdown|error during shutdown/);
  });
});
