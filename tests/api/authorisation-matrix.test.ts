// The authorisation matrix: every route in the registry × every kind of actor, with the status
// each must get. The rows and the world live in tests/helpers/route-world.ts (the fuzz suite reads
// them too).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { isPublicAction } from '../../server/auth/policy';
import { routeRegistry } from '../../server/routes';
import { ACTORS, makeWorld, routeMatrix as matrix, type Row } from '../helpers/route-world';
import { startTestApp, type TestApp } from '../helpers/test-app';

let app: TestApp;
beforeAll(async () => {
  app = await startTestApp({ env: { RATE_LIMIT_MULTIPLIER: '1000' } });
});
afterAll(async () => {
  await app?.stop();
});

describe('authorisation matrix', () => {
  it('has a row for every route in the registry, and no row for a route that does not exist', () => {
    const registered = routeRegistry.map((r) => `${r.method.toUpperCase()} ${r.path}`).sort();
    expect(Object.keys(matrix).sort()).toEqual(registered);
  });

  it('gives every route an allowed actor, and every route closed to visitors a denied one', () => {
    for (const r of routeRegistry) {
      const row = matrix[`${r.method.toUpperCase()} ${r.path}`]!.expect;
      const statuses = Object.values(row);
      expect(
        statuses.some((s) => s < 401 || s > 404),
        `${r.path} has no allowed actor`,
      ).toBe(true);
      if (!isPublicAction(r.action))
        expect(
          statuses.some((s) => s >= 401 && s <= 404),
          `${r.path} has no denied actor`,
        ).toBe(true);
    }
  });

  for (const route of routeRegistry) {
    const key = `${route.method.toUpperCase()} ${route.path}`;
    it(`${key}`, async () => {
      const entry = matrix[key];
      expect(entry, `matrix row for ${key}`).toBeDefined();
      let world = await makeWorld(app);
      const got: Partial<Row> = {};
      for (const actor of ACTORS) {
        if (entry!.freshWorldPerActor && actor !== ACTORS[0]) world = await makeWorld(app);
        const { path, body } = entry!.request(world);
        const res = await world.clients[actor].request(route.method.toUpperCase(), path, body);
        got[actor] = res.status;
        if (res.status >= 400) expect(res.body, `${key} as ${actor}: JSON error body`).toHaveProperty('error.code');
      }
      expect(got).toEqual(entry!.expect);
    });
  }

  it('hides a private build from everyone outside its team: 404, admins included', async () => {
    const world = await makeWorld(app, 'private');
    const path = `/api/builds/${world.ids.buildA}/members`;
    const statuses: Partial<Row> = {};
    for (const actor of ACTORS) statuses[actor] = (await world.clients[actor].get(path)).status;
    expect(statuses).toEqual({ visitor: 404, follower: 404, editor: 200, owner: 200, otherOwner: 404, sponsorMember: 404, admin: 404 });
    const invitations = await world.clients.admin.get(`/api/builds/${world.ids.buildA}/invitations`);
    expect(invitations.status).toBe(404);
    expect(invitations.body.error.code).toBe('not_found');
    // The build page's data of a private build: its team only.
    const overview: Partial<Row> = {};
    for (const actor of ACTORS) overview[actor] = (await world.clients[actor].get(`/api/builds/${world.ids.buildA}/overview`)).status;
    expect(overview).toEqual({ visitor: 404, follower: 404, editor: 200, owner: 200, otherOwner: 404, sponsorMember: 404, admin: 404 });
  });
});
