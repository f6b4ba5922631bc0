import { afterAll, beforeAll, expect, it } from 'vitest';
import { startTestApp, type TestApp } from '../helpers/test-app';

let app: TestApp;
beforeAll(async () => {
  app = await startTestApp();
});
afterAll(async () => {
  await app?.stop();
});

it('reports S3 down (and 503) when the S3 fake is stopped', async () => {
  await app.s3.stop();
  const res = await fetch(`${app.baseUrl}/api/health`);
  expect(res.status).toBe(503);
  expect(await res.json()).toEqual({ status: 'degraded', services: { database: 'up', storage: 'down', mail: 'up' } });
});

it('reports SMTP down when the SMTP fake is stopped', async () => {
  await app.smtp.stop();
  const body = await (await fetch(`${app.baseUrl}/api/health`)).json();
  expect(body.services.mail).toBe('down');
  expect(body.services.database).toBe('up');
});
