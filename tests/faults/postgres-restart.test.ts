// PostgreSQL fast-restarted while writes run (new suppliers, each acknowledged with its id), on the fault suites' own durable cluster: requests
// meanwhile fail fast with 503 JSON, the app recovers by itself (no restart of the app), and every
// write acknowledged with 2xx is in the database afterwards.
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { controlCluster } from '../../scripts/lib/postgres';
import { createOwnedBuild, signedInClient } from '../helpers/accounts';
import type { TestClient } from '../helpers/http-client';
import { startTestApp, type TestApp } from '../helpers/test-app';

const WRITERS = 4;
let app: TestApp;
let owner: TestClient;

beforeAll(async () => {
  app = await startTestApp({ env: { RATE_LIMIT_MULTIPLIER: '1000' } });
  await createOwnedBuild(app.deps.db, { owner: { email: 'restart-owner@example.test' } });
  owner = await signedInClient(app, 'restart-owner@example.test');
  // One token for the session before the writers start (four first fetches at once would race).
  await owner.csrfToken();
});
afterAll(async () => {
  await app?.stop();
});

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

describe('PostgreSQL restarted during requests', () => {
  it('answers 503 JSON fast while it is down, recovers by itself, and loses no acknowledged write', async () => {
    const dataDir = inject('pgFaultsDataDir');
    const acknowledged = new Map<number, string>();
    const statuses = new Map<number, number>();
    const unavailableMs: number[] = [];
    const problems: string[] = [];
    let running = true;
    let n = 0;

    const writer = async (w: number) => {
      while (running) {
        const title = `Restart check supplier ${w}-${(n += 1)}`;
        const started = Date.now();
        const res = await owner.post('/api/suppliers', { name: title });
        const ms = Date.now() - started;
        statuses.set(res.status, (statuses.get(res.status) ?? 0) + 1);
        if (res.status === 201 || res.status === 200) acknowledged.set(res.body.id as number, title);
        else if (res.status === 503) {
          unavailableMs.push(ms);
          if (res.body?.error?.code !== 'service_unavailable')
            problems.push(`503 without the JSON error shape: ${JSON.stringify(res.body)}`);
          await sleep(50);
        } else problems.push(`unexpected ${res.status}: ${JSON.stringify(res.body).slice(0, 200)}`);
      }
    };
    const writers = Array.from({ length: WRITERS }, (_, w) => writer(w));

    await sleep(1_000);
    const beforeStop = acknowledged.size;
    const stopAt = Date.now();
    await controlCluster(dataDir, 'stop');
    const stoppedIn = Date.now() - stopAt;
    await sleep(2_000);
    const startAt = Date.now();
    await controlCluster(dataDir, 'start');
    const startedIn = Date.now() - startAt;

    // The app must find the database again by itself: poll its health for up to 30 s.
    let recoveredMs = -1;
    while (Date.now() - startAt < 30_000) {
      const res = await fetch(`${app.baseUrl}/api/health`);
      const body = (await res.json()) as { services: { database: string } };
      if (body.services.database === 'up') {
        recoveredMs = Date.now() - startAt;
        break;
      }
      await sleep(100);
    }
    const ackAtRecovery = acknowledged.size;
    await sleep(1_500);
    running = false;
    await Promise.all(writers);

    const rows = await app.deps.db.selectFrom('suppliers').select(['id', 'name']).execute();
    const stored = new Map(rows.map((r) => [r.id, r.name]));
    const lost = [...acknowledged].filter(([id, title]) => stored.get(id) !== title);
    const byStatus = [...statuses].map(([s, c]) => `${s}×${c}`).join(', ');
    const maxUnavailable = Math.max(0, ...unavailableMs);
    console.log(
      `[faults] PostgreSQL fast stop (${stoppedIn} ms), down 2 s, start (${startedIn} ms) under ${WRITERS} concurrent writers: ` +
        `${byStatus}; slowest 503 ${maxUnavailable} ms; app recovered ${recoveredMs} ms after the start began ` +
        `(${recoveredMs + 2_000 + stoppedIn} ms after the stop began); acknowledged ${acknowledged.size} writes ` +
        `(${beforeStop} before the stop), ${lost.length} missing afterwards`,
    );
    expect(problems).toEqual([]);
    expect(recoveredMs, 'the app did not see the database again within 30 s').toBeGreaterThanOrEqual(0);
    expect(unavailableMs.length, 'no request saw the database down').toBeGreaterThan(0);
    // Fast: a refused connection is answered at once; 5 s is the pool's connection timeout.
    expect(maxUnavailable).toBeLessThan(6_000);
    expect(acknowledged.size, 'writes resumed after the restart').toBeGreaterThan(ackAtRecovery);
    expect(lost).toEqual([]);
  });
});
