// The S3 and SMTP fakes stopped and started again under a running app: uploads answer 503 and
// leave nothing behind, then work; e-mail stays queued, then goes out exactly once.
import { ListObjectsV2Command } from '@aws-sdk/client-s3';
import { mkdtemp } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startS3Fake, type S3Fake } from '../../fakes/s3';
import { startSmtpFake, type SmtpFake } from '../../fakes/smtp';
import { createOwnedBuild, signedInClient } from '../helpers/accounts';
import { TestClient } from '../helpers/http-client';
import { startTestApp, TEST_BUCKET, type TestApp } from '../helpers/test-app';

let app: TestApp;
let owner: TestClient;
let buildId: number;
const restarted: Array<S3Fake | SmtpFake> = [];

beforeAll(async () => {
  app = await startTestApp({ env: { RATE_LIMIT_MULTIPLIER: '1000' } });
  const { build } = await createOwnedBuild(app.deps.db, { owner: { email: 'faults-owner@example.test' } });
  buildId = build.id;
  owner = await signedInClient(app, 'faults-owner@example.test');
  await owner.csrfToken(); // one token before uploads run side by side
});
afterAll(async () => {
  await Promise.allSettled(restarted.map((f) => f.stop()));
  await app?.stop();
});

async function upload(name: string): Promise<{ status: number; body: { id?: number; error?: { code: string } } }> {
  const png = await sharp({ create: { width: 8, height: 8, channels: 3, background: '#7a4a2a' } })
    .png()
    .toBuffer();
  const form = new FormData();
  form.set('kind', 'photo');
  form.set('file', new Blob([new Uint8Array(png)]), name);
  const res = await fetch(`${app.baseUrl}/api/builds/${buildId}/media`, {
    method: 'POST',
    body: form,
    headers: { accept: 'application/json', cookie: owner.cookie!, 'x-csrf-token': await owner.csrfToken() },
  });
  return { status: res.status, body: (await res.json()) as { id?: number; error?: { code: string } } };
}

const mediaCount = async () =>
  (
    await app.deps.db
      .selectFrom('media')
      .select((eb) => eb.fn.countAll<number>().as('n'))
      .executeTakeFirstOrThrow()
  ).n;

describe('object storage stopped and started', () => {
  it('answers uploads with 503 JSON and writes no row while S3 is down, then stores them again', async () => {
    const port = app.s3.port;
    await app.s3.stop();
    const rowsBefore = Number(await mediaCount());
    const down = await Promise.all([upload('down-1.png'), upload('down-2.png'), upload('down-3.png')]);
    const rowsWhileDown = Number(await mediaCount());
    const again = await startS3Fake({ port, directory: await mkdtemp(path.join(os.tmpdir(), 'rr-s3-again-')), buckets: [TEST_BUCKET] });
    restarted.push(again);
    const up = await upload('up.png');
    const listed = await app.deps.storage.client.send(new ListObjectsV2Command({ Bucket: TEST_BUCKET }));
    console.log(
      `[faults] S3 stopped: ${down.length} uploads answered ${down.map((d) => `${d.status} ${d.body.error?.code}`).join(', ')}; ` +
        `media rows ${rowsBefore} → ${rowsWhileDown}; S3 started again: upload answered ${up.status}, ${listed.KeyCount} object(s) stored`,
    );
    for (const d of down) {
      expect(d.status).toBe(503);
      expect(d.body.error?.code).toBe('storage_unavailable');
    }
    expect(rowsWhileDown).toBe(rowsBefore);
    expect(up.status).toBe(201);
    expect(Number(await mediaCount())).toBe(rowsBefore + 1);
    // Only the upload made after the restart is stored: nothing half-written from the failed ones.
    expect((listed.Contents ?? []).every((o) => o.Key!.startsWith(`builds/${buildId}/photo/`))).toBe(true);
  });
});

describe('mail server stopped and started', () => {
  it('keeps sign-in mail queued while SMTP is down and sends each message exactly once afterwards', async () => {
    const port = app.smtp.smtpPort;
    await app.smtp.stop();
    const visitor = new TestClient(app.baseUrl);
    const addresses = ['queued-1@example.test', 'queued-2@example.test'];
    for (const email of addresses) expect((await visitor.post('/api/sign-in-links', { email })).status).toBe(202);
    await app.runJobs();
    const pending = await app.deps.db
      .selectFrom('outbox_messages')
      .select(['id', 'status', 'attempts'])
      .where('to_address', 'in', addresses)
      .execute();

    const smtp = await startSmtpFake({ smtpPort: port, httpPort: 0 });
    restarted.push(smtp);
    // The outbox's once-a-minute sweep picks waiting mail up; fire it as its schedule would, twice
    // more to show nothing goes out again.
    for (let i = 0; i < 3; i += 1) await app.runJobs({ recurring: true });
    const after = await app.deps.db.selectFrom('outbox_messages').select(['id', 'status']).where('to_address', 'in', addresses).execute();
    const delivered = addresses.map((a) => smtp.messages().filter((m) => m.to.includes(a)).length);
    console.log(
      `[faults] SMTP stopped: ${pending.length} messages queued (${pending.map((p) => `${p.status} after ${p.attempts} attempt`).join(', ')}); ` +
        `SMTP started again: ${after.map((r) => r.status).join(', ')}; copies received per address ${delivered.join(', ')}`,
    );
    expect(pending.map((p) => p.status)).toEqual(['pending', 'pending']);
    expect(pending.every((p) => p.attempts >= 1)).toBe(true);
    expect(after.map((r) => r.status)).toEqual(['sent', 'sent']);
    expect(delivered).toEqual([1, 1]);
  });
});
