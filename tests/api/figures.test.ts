import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createUser } from '../helpers/factories';
import { signInByEmail, TestClient } from '../helpers/http-client';
import { startTestApp, type TestApp } from '../helpers/test-app';

let app: TestApp;
let owner: TestClient;
let visitor: TestClient;

beforeAll(async () => {
  app = await startTestApp({ env: { RATE_LIMIT_MULTIPLIER: '1000' } });
  await createUser(app.deps.db, { email: 'figures-owner@example.test' });
  owner = new TestClient(app.baseUrl);
  visitor = new TestClient(app.baseUrl);
  await signInByEmail(owner, app.deps.db, 'figures-owner@example.test');
});
afterAll(async () => {
  await app?.stop();
});

const housingBolts = {
  fastener: 'Thermostat housing bolts',
  thread: 'M8',
  gradeFitted: 'A2-70',
  gradeSpecified: '8.8',
  method: 'torque',
  value: 18,
  unit: 'N-m',
  angleStages: [],
  source: 'workshop-manual',
  wrenchRange: { min: 15, max: 80, unit: 'lbf-ft' },
  systemKey: null,
  note: 'Stainless from the spares tin.',
};

async function newEpisode() {
  const build = await owner.post('/api/builds', { title: 'Invented roadster', vehicleKind: 'car', currency: 'EUR', visibility: 'public' });
  expect(build.status).toBe(201);
  const episode = await owner.post(`/api/builds/${build.body.id}/episodes`, { title: 'Thermostat housing' });
  expect(episode.status).toBe(201);
  return episode.body as { id: number; version: number };
}

describe('figures', () => {
  it('records a figure, keeps its unit, and checks it: weaker substitute and below the wrench range in mixed units', async () => {
    const ep = await newEpisode();
    const res = await owner.post(`/api/episodes/${ep.id}/figures`, housingBolts);
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ value: 18, unit: 'N-m', threadLabel: 'M8 × 1.25 (coarse)', position: 0 });
    // ISO 3506-1 A2-70 (Rm 700) < ISO 898-1 8.8 (Rm 800); 18 N·m < 15 lbf·ft = 20.3 N·m (NIST SP 811).
    expect(res.body.checks.map((c: { kind: string }) => c.kind)).toEqual(['weaker-substitute', 'below-wrench-range']);
    expect(res.body.caution).toMatch(/workshop manual/);

    const list = await owner.get(`/api/episodes/${ep.id}/figures`);
    expect(list.status).toBe(200);
    expect(list.body.items).toHaveLength(1);
  });

  it('replaces and deletes a figure; positions follow the order of adding', async () => {
    const ep = await newEpisode();
    const a = await owner.post(`/api/episodes/${ep.id}/figures`, housingBolts);
    const b = await owner.post(`/api/episodes/${ep.id}/figures`, { ...housingBolts, fastener: 'Second', gradeFitted: '10.9' });
    expect(b.body.position).toBe(1);
    expect(b.body.checks.map((c: { kind: string }) => c.kind)).toEqual(['below-wrench-range']);
    const put = await owner.request('PUT', `/api/figures/${a.body.id}`, { ...housingBolts, gradeFitted: '8.8', value: 30 });
    expect(put.status).toBe(200);
    expect(put.body.checks).toEqual([]);
    const del = await owner.delete(`/api/figures/${b.body.id}`);
    expect(del.status).toBe(204);
    expect((await owner.get(`/api/episodes/${ep.id}/figures`)).body.items.map((f: { id: number }) => f.id)).toEqual([a.body.id]);
  });

  it.each([
    ['thread', { thread: 'M9' }],
    ['gradeFitted', { gradeFitted: '9.9' }],
    ['gradeSpecified', { gradeSpecified: 'grade 12' }],
    ['unit', { unit: 'ft-lb' }],
    ['wrenchRange.unit', { wrenchRange: { min: 5, max: 20, unit: 'Nm' } }],
    ['angleStages.0', { method: 'torque-angle', angleStages: [720] }],
    ['angleStages', { method: 'torque-angle', angleStages: [] }],
    ['angleStages', { angleStages: [90] }],
    ['value', { value: null }],
    ['systemKey', { systemKey: 'flux-capacitor' }],
  ])('answers 400 naming %s', async (field, change) => {
    const ep = await newEpisode();
    const res = await owner.post(`/api/episodes/${ep.id}/figures`, { ...housingBolts, ...change });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_request');
    expect(Object.keys(res.body.error.fields)).toEqual([field]);
  });

  it('records torque plus angle, and by hand to snug without a value', async () => {
    const ep = await newEpisode();
    const angle = await owner.post(`/api/episodes/${ep.id}/figures`, {
      ...housingBolts,
      gradeFitted: '10.9',
      gradeSpecified: '10.9',
      method: 'torque-angle',
      value: 20,
      angleStages: [90, 90],
      wrenchRange: null,
    });
    expect(angle.status).toBe(201);
    expect(angle.body.angleStages).toEqual([90, 90]);
    const snug = await owner.post(`/api/episodes/${ep.id}/figures`, { ...housingBolts, method: 'snug', value: null, wrenchRange: null });
    expect(snug.status).toBe(201);
    expect(snug.body.value).toBeNull();
  });

  it('shows readers the figures of a published episode and hides a draft’s (404)', async () => {
    const ep = await newEpisode();
    await owner.post(`/api/episodes/${ep.id}/figures`, housingBolts);
    expect((await visitor.get(`/api/episodes/${ep.id}/figures`)).status).toBe(404);
    // Published directly: the publish checks (chapters, write-up) are not what this test is about.
    await app.deps.db.updateTable('episodes').set({ status: 'published', published_at: new Date() }).where('id', '=', ep.id).execute();
    const res = await visitor.get(`/api/episodes/${ep.id}/figures`);
    expect(res.status).toBe(200);
    expect(res.body.items[0].checks).toHaveLength(2);
  });

  it('makes the episode show its caution when a figure is on a safety-critical system', async () => {
    const ep = await newEpisode();
    expect((await owner.get(`/api/episodes/${ep.id}`)).body.needsCaution).toBe(false);
    const res = await owner.post(`/api/episodes/${ep.id}/figures`, { ...housingBolts, fastener: 'Caliper bolts', systemKey: 'brakes' });
    expect(res.body.system).toEqual({ key: 'brakes', name: 'Brakes', safetyCritical: true });
    expect((await owner.get(`/api/episodes/${ep.id}`)).body.needsCaution).toBe(true);
    await owner.request('PUT', `/api/figures/${res.body.id}`, { ...housingBolts, systemKey: 'body' });
    expect((await owner.get(`/api/episodes/${ep.id}`)).body.needsCaution).toBe(false);
  });
});
