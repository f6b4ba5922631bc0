import { sql } from 'kysely';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { RATE_LIMITS } from '../../server/http/rate-limit';
import { buildWithEpisode, person } from '../helpers/followers-world';
import { TestClient } from '../helpers/http-client';
import { startTestApp, type TestApp } from '../helpers/test-app';

const MULTIPLIER = 2;
let app: TestApp;
beforeAll(async () => {
  // Many people sign in from one address here: widen the limits (the posting limit is checked against its multiple).
  app = await startTestApp({ env: { RATE_LIMIT_MULTIPLIER: String(MULTIPLIER) } });
});
afterAll(async () => {
  await app?.stop();
});

const question = (body = 'How did you free the piston?') => ({ kind: 'question', chapterStartSeconds: 120, atSeconds: 150, body });

describe('posts on an episode', () => {
  it('takes a question on chapter 2 at a moment inside it, lists it, and lets the team reply', async () => {
    const { episode, editor } = await buildWithEpisode(app);
    const follower = await person(app);
    const made = await follower.client.post(`/api/episodes/${episode.id}/posts`, question());
    expect(made.status).toBe(201);
    const list = await new TestClient(app.baseUrl).get(`/api/episodes/${episode.id}/posts`);
    expect(list.status).toBe(200);
    expect(list.body.items).toHaveLength(1);
    expect(list.body.items[0]).toMatchObject({ kind: 'question', state: 'open', chapterStartSeconds: 120, atSeconds: 150, byTeam: false });
    expect(list.body.canPost).toBe(false);

    const reply = await editor.client.post(`/api/posts/${made.body.id}/replies`, { body: 'A wide clamp over the old pad.' });
    expect(reply.status).toBe(201);
    const again = await follower.client.get(`/api/episodes/${episode.id}/posts`);
    expect(again.body.items[0].replies[0]).toMatchObject({ byTeam: true, body: 'A wide clamp over the old pad.' });
    // Replies nest one level only.
    const deeper = await follower.client.post(`/api/posts/${reply.body.id}/replies`, { body: 'Thanks!' });
    expect(deeper.status).toBe(409);
    expect(deeper.body.error.code).toBe('reply_depth');
  });

  it('refuses a moment outside its chapter, an unknown chapter, an empty body and a draft episode', async () => {
    const { episode } = await buildWithEpisode(app);
    const draft = await buildWithEpisode(app, { status: 'draft' });
    const { client } = await person(app);
    const outside = await client.post(`/api/episodes/${episode.id}/posts`, { ...question(), atSeconds: 450 });
    expect(outside.status).toBe(400);
    expect(outside.body.error.fields).toHaveProperty('atSeconds');
    const before = await client.post(`/api/episodes/${episode.id}/posts`, { ...question(), atSeconds: 119 });
    expect(before.body.error.fields).toHaveProperty('atSeconds');
    const unknown = await client.post(`/api/episodes/${episode.id}/posts`, { ...question(), chapterStartSeconds: 121 });
    expect(unknown.status).toBe(400);
    expect(unknown.body.error.fields).toHaveProperty('chapterStartSeconds');
    const empty = await client.post(`/api/episodes/${episode.id}/posts`, { ...question(), body: '   ' });
    expect(empty.status).toBe(400);
    expect(empty.body.error.fields).toHaveProperty('body');
    expect((await client.post(`/api/episodes/${draft.episode.id}/posts`, question())).status).toBe(404);
  });

  it('lets authors edit within 15 minutes (marked) and delete their own, nobody else', async () => {
    const { episode } = await buildWithEpisode(app);
    const author = await person(app);
    const other = await person(app);
    const made = await author.client.post(`/api/episodes/${episode.id}/posts`, question());
    expect((await other.client.patch(`/api/posts/${made.body.id}`, { body: 'Hijacked' })).status).toBe(403);
    expect((await author.client.patch(`/api/posts/${made.body.id}`, { body: 'How did you free the seized piston?' })).status).toBe(204);
    const listed = await author.client.get(`/api/episodes/${episode.id}/posts`);
    expect(listed.body.items[0].editedAt).not.toBeNull();
    expect(listed.body.items[0].editableUntil).not.toBeNull();
    await app.deps.db
      .updateTable('posts')
      .set({ created_at: sql<Date>`now() - interval '16 minutes'` })
      .where('id', '=', made.body.id)
      .execute();
    const late = await author.client.patch(`/api/posts/${made.body.id}`, { body: 'Too late' });
    expect(late.status).toBe(409);
    expect(late.body.error.code).toBe('edit_window_closed');
    expect((await other.client.delete(`/api/posts/${made.body.id}`)).status).toBe(403);
    expect((await author.client.delete(`/api/posts/${made.body.id}`)).status).toBe(204);
    expect((await author.client.get(`/api/episodes/${episode.id}/posts`)).body.items).toHaveLength(0);
  });

  it('lets only the build team set states, and only the states of that kind', async () => {
    const { episode, owner } = await buildWithEpisode(app);
    const follower = await person(app);
    const q = await follower.client.post(`/api/episodes/${episode.id}/posts`, question());
    const s = await follower.client.post(`/api/episodes/${episode.id}/posts`, {
      kind: 'suggestion',
      chapterStartSeconds: 400,
      body: 'Bleed from the far wheel first.',
    });
    expect((await follower.client.request('PUT', `/api/posts/${q.body.id}/state`, { state: 'answered' })).status).toBe(403);
    const adoptedQuestion = await owner.client.request('PUT', `/api/posts/${q.body.id}/state`, { state: 'adopted', note: 'x' });
    expect(adoptedQuestion.status).toBe(400);
    expect(adoptedQuestion.body.error.fields).toHaveProperty('state');
    expect((await owner.client.request('PUT', `/api/posts/${q.body.id}/state`, { state: 'answered' })).status).toBe(204);
    const noNote = await owner.client.request('PUT', `/api/posts/${s.body.id}/state`, { state: 'adopted' });
    expect(noNote.status).toBe(400);
    expect(noNote.body.error.fields).toHaveProperty('note');
    expect(
      (await owner.client.request('PUT', `/api/posts/${s.body.id}/state`, { state: 'adopted', note: 'Now bleeding from the far wheel.' }))
        .status,
    ).toBe(204);
    const list = await follower.client.get(`/api/episodes/${episode.id}/posts`);
    const byId = new Map(list.body.items.map((p: { id: number }) => [p.id, p]));
    expect(byId.get(q.body.id)).toMatchObject({ state: 'answered' });
    expect(byId.get(s.body.id)).toMatchObject({ state: 'adopted', adoptedNote: 'Now bleeding from the far wheel.' });
  });

  it('hides a post from everyone but its author, the build team and admins; reports reach the moderation queue', async () => {
    const { episode, editor } = await buildWithEpisode(app);
    const author = await person(app);
    const reporter = await person(app);
    const admin = await person(app, { is_admin: true });
    const made = await author.client.post(`/api/episodes/${episode.id}/posts`, { ...question('Selling hub caps, message me') });
    expect((await reporter.client.post(`/api/posts/${made.body.id}/reports`, { reason: 'A sales request' })).status).toBe(204);
    const queue = await admin.client.get('/api/moderation/queue');
    expect(queue.body.items.map((i: { post: { id: number } }) => i.post.id)).toContain(made.body.id);
    expect((await reporter.client.request('PUT', `/api/posts/${made.body.id}/visibility`, { hidden: true, reason: 'nope' })).status).toBe(
      403,
    );
    expect(
      (await editor.client.request('PUT', `/api/posts/${made.body.id}/visibility`, { hidden: true, reason: 'Off topic' })).status,
    ).toBe(204);

    const count = async (c: TestClient) => (await c.get(`/api/episodes/${episode.id}/posts`)).body.items.length;
    expect(await count(new TestClient(app.baseUrl))).toBe(0);
    expect(await count(reporter.client)).toBe(0);
    expect(await count(author.client)).toBe(1);
    expect(await count(editor.client)).toBe(1);
    expect(await count(admin.client)).toBe(1);
    const hiddenReply = await reporter.client.post(`/api/posts/${made.body.id}/replies`, { body: 'Hello?' });
    expect(hiddenReply.status).toBe(404);
    const after = await admin.client.get('/api/moderation/queue');
    const item = after.body.items.find((i: { post: { id: number } }) => i.post.id === made.body.id);
    expect(item.actions[0]).toMatchObject({ action: 'hide', reason: 'Off topic' });
    expect(
      (await admin.client.request('PUT', `/api/posts/${made.body.id}/visibility`, { hidden: false, reason: 'Fine after all' })).status,
    ).toBe(204);
    expect(await count(reporter.client)).toBe(1);
  });

  it('limits posting per account: 429 with Retry-After', async () => {
    const { episode } = await buildWithEpisode(app);
    const { client } = await person(app);
    for (let i = 0; i < RATE_LIMITS['post-create'].points * MULTIPLIER; i += 1)
      expect((await client.post(`/api/episodes/${episode.id}/posts`, question(`Question ${i}`))).status).toBe(201);
    const limited = await client.post(`/api/episodes/${episode.id}/posts`, question('One too many'));
    expect(limited.status).toBe(429);
    expect(limited.body.error.code).toBe('rate_limited');
    expect(Number(limited.headers.get('retry-after'))).toBeGreaterThan(0);
  }, 60_000);

  it('gives the build team one inbox across builds, unanswered first, filtered by kind', async () => {
    const { episode, owner } = await buildWithEpisode(app);
    const follower = await person(app);
    const first = await follower.client.post(`/api/episodes/${episode.id}/posts`, question('First'));
    await follower.client.post(`/api/episodes/${episode.id}/posts`, { kind: 'suggestion', chapterStartSeconds: 0, body: 'Second' });
    await owner.client.post(`/api/posts/${first.body.id}/replies`, { body: 'Answered.' });
    const inbox = await owner.client.get('/api/inbox');
    expect(inbox.status).toBe(200);
    expect(inbox.body.items.map((p: { body: string }) => p.body)).toEqual(['Second', 'First']);
    expect(inbox.body.openCount).toBe(2);
    const only = await owner.client.get('/api/inbox?kind=question');
    expect(only.body.items.map((p: { body: string }) => p.body)).toEqual(['First']);
    expect((await follower.client.get('/api/inbox')).body.items).toEqual([]);
    const wb = await owner.client.get('/api/workbench');
    expect(wb.body.openPostCount).toBe(2);
    expect(wb.body.unansweredPosts.map((p: { excerpt: string }) => p.excerpt)).toEqual(['Second']);
  });

  it('keeps a deleted account’s posts, attributed to “Former member”, and exports them', async () => {
    const { episode } = await buildWithEpisode(app);
    const author = await person(app);
    await author.client.post(`/api/episodes/${episode.id}/posts`, question('Still useful'));
    const exported = await author.client.get('/api/account/export');
    expect(exported.body.followers.posts).toHaveLength(1);
    expect((await author.client.delete('/api/account')).status).toBe(204);
    const list = await new TestClient(app.baseUrl).get(`/api/episodes/${episode.id}/posts`);
    expect(list.body.items[0]).toMatchObject({ body: 'Still useful', author: { displayName: 'Former member' } });
  });
});
