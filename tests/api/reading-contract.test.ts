// The public pages read the API's answers by type (typed<T>() in src/lib/api-client.ts), without zod,
// so that no zod code loads on them. The answers they read must therefore be exactly what the shared
// schemas describe: every field there, and no field more (an extra one would also land in the page's
// hydration data). Each answer here is parsed with its schema and compared with what was sent.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { z } from 'zod';
import { sessionResponse } from '../../src/shared/schemas/accounts';
import { episodePage } from '../../src/shared/schemas/episode-page';
import { latestEpisodesResponse } from '../../src/shared/schemas/episodes';
import { figureList } from '../../src/shared/schemas/figures';
import { followingResponse, noticePreferences, notificationsResponse } from '../../src/shared/schemas/following';
import { buildTotals, episodeParts } from '../../src/shared/schemas/parts';
import { episodePosts } from '../../src/shared/schemas/posts';
import { episodeReading } from '../../src/shared/schemas/reading';
import type { TestClient } from '../helpers/http-client';
import { makeWorld, type World } from '../helpers/route-world';
import { startTestApp, type TestApp } from '../helpers/test-app';

let app: TestApp;
let world: World;

beforeAll(async () => {
  app = await startTestApp();
  world = await makeWorld(app);
  // The world's draft carries a part line, a figure and an open item: publish it so visitors read them too.
  await app.deps.db
    .updateTable('episodes')
    .set({ status: 'published', published_at: new Date() })
    .where('id', '=', world.ids.draft)
    .execute();
  const reply = await world.clients.owner.post(`/api/posts/${world.ids.post}/replies`, { body: 'Axle stands from the co-op.' });
  expect(reply.status).toBe(201);
});

afterAll(async () => {
  await app?.stop();
});

async function exact(client: TestClient, path: string, schema: z.ZodType) {
  const res = await client.get(path);
  expect(res.status, path).toBe(200);
  expect(schema.parse(res.body), path).toEqual(res.body);
  return res.body as Record<string, unknown>;
}

describe('answers the public pages read by type', () => {
  it('match their schemas exactly for a visitor, a follower and the owner', async () => {
    const buildPath = `/api/creators/${encodeURIComponent(world.slugs.owner)}/builds/${encodeURIComponent(world.slugs.buildA)}`;
    const buildId = world.ids.buildA;
    for (const actor of ['visitor', 'follower', 'owner'] as const) {
      const client = world.clients[actor];
      await exact(client, '/api/session', sessionResponse);
      const address = (await client.get(buildPath)).body as { buildId: number; path: string; movedFrom: string | null };
      expect(Object.keys(address).sort()).toEqual(['buildId', 'movedFrom', 'path']);
      await exact(client, '/api/episodes?page=1&perPage=12', latestEpisodesResponse);
      await exact(client, `/api/builds/${buildId}/totals?scope=published`, buildTotals);
      for (const episodeId of [world.ids.draft]) {
        await exact(client, `/api/episodes/${episodeId}/reading`, episodeReading);
        await exact(client, `/api/episodes/${episodeId}/part-lines`, episodeParts);
        await exact(client, `/api/episodes/${episodeId}/figures`, figureList);
        await exact(client, `/api/episodes/${episodeId}/posts`, episodePosts);
      }
      for (const slug of [world.slugs.draft, `published-${buildId}`]) {
        const page = await exact(client, `/api/builds/${buildId}/episode-page/${slug}`, episodePage);
        expect(Object.keys(page).sort()).toEqual(['episodeId', 'figures', 'movedFrom', 'parts', 'posts', 'reading', 'slug', 'totals']);
      }
    }
    const follower = world.clients.follower;
    await exact(follower, '/api/following', followingResponse);
    await exact(follower, '/api/notifications', notificationsResponse);
    await exact(follower, '/api/account/notices', noticePreferences);
  });
});
