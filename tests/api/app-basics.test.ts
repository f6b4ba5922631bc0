import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { latestEpisodesResponse } from '../../src/shared/schemas/episodes';
import { createBuild, createEpisode } from '../helpers/factories';
import { startTestApp, type TestApp } from '../helpers/test-app';

let app: TestApp;
beforeAll(async () => {
  app = await startTestApp();
});
afterAll(async () => {
  await app?.stop();
});

describe('health', () => {
  it('reports the database, S3 and SMTP up', async () => {
    const res = await fetch(`${app.baseUrl}/api/health`);
    expect(res.status).toBe(200);
    expect(await res.json()).toEqual({ status: 'ok', services: { database: 'up', storage: 'up', mail: 'up' } });
  });
});

describe('errors', () => {
  it('answers unknown API routes with 404 JSON', async () => {
    const res = await fetch(`${app.baseUrl}/api/no-such-thing`);
    expect(res.status).toBe(404);
    expect(res.headers.get('content-type')).toMatch(/application\/json/);
    expect((await res.json()).error.code).toBe('not_found');
  });

  it('answers a malformed JSON body with 400 JSON, not 500', async () => {
    const res = await fetch(`${app.baseUrl}/api/episodes`, { method: 'GET' });
    expect(res.status).toBe(200);
    const bad = await fetch(`${app.baseUrl}/api/health`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: '{"title": ',
    });
    expect(bad.status).toBe(400);
    const body = await bad.json();
    expect(body.error.code).toBe('malformed_json');
    expect(body.error.fields).toHaveProperty('body');
    expect(JSON.stringify(body)).not.toMatch(/at .*\.js:\d+/);
  });

  it('answers an address too long for the HTTP parser with 431 JSON, not a bare status line', async () => {
    // Node's default header limit is 16 KiB; 20,000 characters of query string is past it.
    const res = await fetch(`${app.baseUrl}/api/search?q=${'a'.repeat(20_000)}`);
    expect(res.status).toBe(431);
    expect(res.headers.get('content-type')).toMatch(/application\/json/);
    expect(((await res.json()) as { error: { code: string } }).error.code).toBe('headers_too_large');
  });

  it('names the bad field of an invalid query', async () => {
    const res = await fetch(`${app.baseUrl}/api/episodes?perPage=5000`);
    expect(res.status).toBe(400);
    const body = await res.json();
    expect(body.error.code).toBe('invalid_request');
    expect(Object.keys(body.error.fields)).toEqual(['perPage']);
  });

  it('sets a Content-Security-Policy without inline scripts', async () => {
    const res = await fetch(`${app.baseUrl}/api/health`);
    const csp = res.headers.get('content-security-policy') ?? '';
    expect(csp).toMatch(/script-src 'self'(;|$)/);
    expect(csp).not.toMatch(/unsafe-inline/);
  });
});

describe('front-page endpoint', () => {
  it('lists a published episode of a public build and not a draft', async () => {
    const build = await createBuild(app.deps.db, { title: 'Hatchback, rust and all' });
    const published = await createEpisode(app.deps.db, { build_id: build.id, title: 'Seized caliper freed' });
    const draft = await createEpisode(app.deps.db, { build_id: build.id, title: 'Unfinished notes', status: 'draft', published_at: null });
    const hidden = await createBuild(app.deps.db, { visibility: 'private' });
    const privateEp = await createEpisode(app.deps.db, { build_id: hidden.id, title: 'Private session' });

    const res = await fetch(`${app.baseUrl}/api/episodes?perPage=50`);
    expect(res.status).toBe(200);
    const body = latestEpisodesResponse.parse(await res.json());
    const ids = body.items.map((i) => i.id);
    expect(ids).toContain(published.id);
    expect(ids).not.toContain(draft.id);
    expect(ids).not.toContain(privateEp.id);
    const item = body.items.find((i) => i.id === published.id);
    expect(item?.title).toBe('Seized caliper freed');
    expect(item?.build.title).toBe('Hatchback, rust and all');
  });

  it('pages newest first', async () => {
    const build = await createBuild(app.deps.db);
    const older = await createEpisode(app.deps.db, { build_id: build.id, published_at: new Date('2026-01-01T10:00:00Z') });
    const newer = await createEpisode(app.deps.db, { build_id: build.id, published_at: new Date('2026-02-01T10:00:00Z') });
    const res = await fetch(`${app.baseUrl}/api/episodes?perPage=100`);
    const body = latestEpisodesResponse.parse(await res.json());
    const ids = body.items.map((i) => i.id);
    expect(ids.indexOf(newer.id)).toBeLessThan(ids.indexOf(older.id));
    const page2 = latestEpisodesResponse.parse(await (await fetch(`${app.baseUrl}/api/episodes?perPage=1&page=2`)).json());
    expect(page2.items).toHaveLength(1);
    expect(page2.total).toBe(body.total);
  });
});
