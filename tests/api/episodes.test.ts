import { sql } from 'kysely';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createUser } from '../helpers/factories';
import { signInByEmail, TestClient } from '../helpers/http-client';
import { startTestApp, type TestApp } from '../helpers/test-app';

let app: TestApp;
let owner: TestClient;
let editor: TestClient;
let stranger: TestClient;
let visitor: TestClient;
let editorId: number;
let ownerHandle: string;

const doc = (text: string) => ({ type: 'doc', content: [{ type: 'paragraph', content: [{ type: 'text', text }] }] });

beforeAll(async () => {
  app = await startTestApp({ env: { RATE_LIMIT_MULTIPLIER: '1000' } });
  const db = app.deps.db;
  const o = await createUser(db, { handle: 'wren-okafor', email: 'wren@example.test' });
  ownerHandle = o.handle;
  const e = await createUser(db, { email: 'ed@example.test' });
  editorId = e.id;
  await createUser(db, { email: 'stranger@example.test' });
  owner = new TestClient(app.baseUrl);
  editor = new TestClient(app.baseUrl);
  stranger = new TestClient(app.baseUrl);
  visitor = new TestClient(app.baseUrl);
  await signInByEmail(owner, db, 'wren@example.test');
  await signInByEmail(editor, db, 'ed@example.test');
  await signInByEmail(stranger, db, 'stranger@example.test');
});
afterAll(async () => {
  await app?.stop();
});

async function newBuild(title = '1977 Marlowe Pipit estate', extra: Record<string, unknown> = {}) {
  const res = await owner.post('/api/builds', { title, vehicleKind: 'car', currency: 'EUR', visibility: 'public', ...extra });
  expect(res.status).toBe(201);
  await app.deps.db
    .insertInto('build_members')
    .values({ build_id: res.body.id, user_id: editorId, role: 'editor' })
    .onConflict((oc) => oc.doNothing())
    .execute();
  return res.body as { id: number; slug: string; systems: Array<{ key: string; safetyCritical: boolean }> };
}

async function newEpisode(buildId: number, title = 'Front brakes apart') {
  const res = await editor.post(`/api/builds/${buildId}/episodes`, { title });
  expect(res.status).toBe(201);
  return res.body as { id: number; number: number; version: number; slug: string };
}

describe('builds', () => {
  it('starts with the default vehicle systems, brakes and cooling safety-critical, body not', async () => {
    const b = await newBuild();
    // DESIGN.md "Safety": on by default for brakes, steering, suspension, fuel, cooling and electrical.
    const critical = Object.fromEntries(b.systems.map((s) => [s.key, s.safetyCritical]));
    expect(critical).toMatchObject({
      brakes: true,
      cooling: true,
      steering: true,
      suspension: true,
      fuel: true,
      electrical: true,
      body: false,
      interior: false,
    });
  });

  it('refuses a currency that is not ISO 4217, naming the field', async () => {
    const res = await owner.post('/api/builds', { title: 'X', vehicleKind: 'car', currency: 'EUX' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty('currency');
  });

  it('keeps an old slug working after a rename: 301 to the new one', async () => {
    const b = await newBuild('Vantel 125 trail bike', { vehicleKind: 'motorcycle' });
    const renamed = await owner.request('PATCH', `/api/builds/${b.id}`, { title: 'Vantel 125 desert sled' });
    expect(renamed.status).toBe(200);
    expect(renamed.body.slug).toBe('vantel-125-desert-sled');
    const old = await visitor.get(`/api/creators/${ownerHandle}/builds/${b.slug}`);
    expect(old.status).toBe(301);
    expect(old.headers.get('location')).toBe(`/api/creators/${ownerHandle}/builds/vantel-125-desert-sled`);
    const current = await visitor.get(`/api/creators/${ownerHandle}/builds/vantel-125-desert-sled`);
    expect(current.status).toBe(200);
    expect(current.body.buildId).toBe(b.id);
  });

  it('hands a build to an editor only when they accept; the old owner becomes an editor', async () => {
    const b = await newBuild('Handover build');
    expect((await owner.post(`/api/builds/${b.id}/transfer`, { toUserId: 999999 })).status).toBe(400);
    expect((await owner.post(`/api/builds/${b.id}/transfer`, { toUserId: editorId })).body.pendingTransferTo.userId).toBe(editorId);
    expect((await stranger.post(`/api/builds/${b.id}/transfer/accept`, {})).status).toBe(403);
    // The hand-over in progress is shown to the team, not to readers of a public build.
    expect((await editor.get(`/api/builds/${b.id}`)).body.pendingTransferTo.userId).toBe(editorId);
    expect((await stranger.get(`/api/builds/${b.id}`)).body.pendingTransferTo).toBeNull();
    expect((await visitor.get(`/api/builds/${b.id}`)).body.pendingTransferTo).toBeNull();
    const accepted = await editor.post(`/api/builds/${b.id}/transfer/accept`, {});
    expect(accepted.status).toBe(200);
    expect(accepted.body.role).toBe('owner');
    const roles = await app.deps.db.selectFrom('build_members').select(['user_id', 'role']).where('build_id', '=', b.id).execute();
    expect(roles.find((r) => r.user_id === editorId)?.role).toBe('owner');
    expect(roles.filter((r) => r.role === 'owner')).toHaveLength(1);
  });
});

describe('episodes', () => {
  it('numbers new episodes with the next free number', async () => {
    const b = await newBuild('Numbering');
    expect((await newEpisode(b.id, 'One')).number).toBe(1);
    expect((await newEpisode(b.id, 'Two')).number).toBe(2);
  });

  it('saves with the version it was based on; a stale version gets 409 with the current episode', async () => {
    const b = await newBuild('Versions');
    const ep = await newEpisode(b.id);
    const first = await editor.request('PATCH', `/api/episodes/${ep.id}`, { version: ep.version, summary: 'Tab one' });
    expect(first.status).toBe(200);
    expect(first.body.version).toBe(ep.version + 1);
    const stale = await owner.request('PATCH', `/api/episodes/${ep.id}`, { version: ep.version, summary: 'Tab two' });
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe('version_conflict');
    expect(stale.body.current.summary).toBe('Tab one');
    expect(stale.body.current.version).toBe(ep.version + 1);
  });

  it('keeps the unfinished chapters of a draft, and refuses to publish them, pointing at the row', async () => {
    const b = await newBuild('Chapters');
    const ep = await newEpisode(b.id);
    const chapters: Array<{ startSeconds: number; title: string; systemKey: string | null; notes: string | null }> = [
      { startSeconds: 0, title: 'Intro', systemKey: null, notes: null },
      { startSeconds: 5, title: 'Too soon', systemKey: null, notes: null },
    ];
    const draft = await editor.request('PATCH', `/api/episodes/${ep.id}`, { version: ep.version, chapters, writeUp: doc('Notes.') });
    expect(draft.status).toBe(200);
    const refused = await editor.post(`/api/episodes/${ep.id}/publish`, { version: draft.body.version });
    expect(refused.status).toBe(422);
    expect(Object.keys(refused.body.error.fields)).toContain('chapters.0.startSeconds');

    chapters[1]!.startSeconds = 10; // exactly 10 s long is allowed (the rule)
    chapters.push({ startSeconds: 95, title: 'Caliper off', systemKey: 'brakes', notes: null });
    const ok = await editor.request('PATCH', `/api/episodes/${ep.id}`, { version: draft.body.version, chapters });
    expect(ok.status).toBe(200);
    expect(ok.body.chapters.map((c: { startSeconds: number }) => c.startSeconds)).toEqual([0, 10, 95]);
    // A chapter on the brakes (safety-critical by default) puts the caution bar on the episode.
    expect(ok.body.needsCaution).toBe(true);
    expect((await editor.post(`/api/episodes/${ep.id}/publish`, { version: ok.body.version })).status).toBe(200);

    const unknownSystem = await editor.request('PATCH', `/api/episodes/${ep.id}`, {
      version: ok.body.version + 1,
      chapters: [{ ...chapters[0]!, systemKey: 'warp-drive' }],
    });
    expect(unknownSystem.status).toBe(400);
    expect(unknownSystem.body.error.fields).toHaveProperty('chapters.0.systemKey');
  });

  it('stores the write-up as JSON, refuses unknown nodes, and gives readers sanitised HTML', async () => {
    const b = await newBuild('Write-up');
    const ep = await newEpisode(b.id);
    const unknown = await editor.request('PATCH', `/api/episodes/${ep.id}`, {
      version: ep.version,
      writeUp: { type: 'doc', content: [{ type: 'iframe', attrs: { src: 'https://x.test' } }] },
    });
    expect(unknown.status).toBe(400);
    const evil = {
      type: 'doc',
      content: [{ type: 'paragraph', content: [{ type: 'text', text: '<script>alert(1)</script>', marks: [{ type: 'bold' }] }] }],
    };
    const saved = await editor.request('PATCH', `/api/episodes/${ep.id}`, { version: ep.version, writeUp: evil });
    expect(saved.status).toBe(200);
    expect(saved.body.writeUpHtml).toContain('<strong>&lt;script&gt;alert(1)&lt;/script&gt;</strong>');
    expect(saved.body.writeUpHtml).not.toMatch(/<script/i);
  });

  it('publishes after the checks, appears on the front page, and unpublishes back to draft', async () => {
    const b = await newBuild('Publishing');
    const ep = await newEpisode(b.id, 'Cooling system flush');
    const refused = await editor.post(`/api/episodes/${ep.id}/publish`, { version: ep.version });
    expect(refused.status).toBe(422);
    expect(refused.body.error.code).toBe('publish_checks_failed');
    expect(refused.body.error.fields).toHaveProperty('writeUp');
    const written = await editor.request('PATCH', `/api/episodes/${ep.id}`, {
      version: ep.version,
      writeUp: doc('Drained, flushed, refilled.'),
    });
    const published = await editor.post(`/api/episodes/${ep.id}/publish`, { version: written.body.version });
    expect(published.status).toBe(200);
    expect(published.body.status).toBe('published');
    const front = await visitor.get('/api/episodes?perPage=100');
    expect(front.body.items.map((i: { id: number }) => i.id)).toContain(ep.id);
    const draft = await editor.post(`/api/episodes/${ep.id}/unpublish`, { version: published.body.version });
    expect(draft.body.status).toBe('draft');
    expect((await visitor.get(`/api/episodes/${ep.id}`)).status).toBe(404);
  });

  it('hides drafts from visitors and other creators (404) and from the public episode list', async () => {
    const b = await newBuild('Drafts');
    const ep = await newEpisode(b.id, 'Secret draft');
    for (const c of [visitor, stranger]) {
      const res = await c.get(`/api/episodes/${ep.id}`);
      expect(res.status).toBe(404);
      expect(res.body.error.code).toBe('not_found');
    }
    expect((await visitor.get(`/api/builds/${b.id}/episodes`)).body.items).toEqual([]);
    expect((await editor.get(`/api/builds/${b.id}/episodes`)).body.items).toHaveLength(1);
  });
});

describe('scheduling', () => {
  async function scheduledEpisode(title: string, withText = true) {
    const b = await newBuild(`Schedule ${title}`);
    const ep = await newEpisode(b.id, title);
    const written = withText
      ? await editor.request('PATCH', `/api/episodes/${ep.id}`, { version: ep.version, writeUp: doc('Notes from the garage.') })
      : { body: ep };
    const at = new Date(Date.now() + 3_600_000).toISOString();
    const res = await editor.post(`/api/episodes/${ep.id}/schedule`, { version: written.body.version, publishAt: at });
    return { ep, res, at };
  }

  it('publishes at the scheduled time (controlled clock: the time is moved into the past), not before', async () => {
    const { ep, res } = await scheduledEpisode('On time');
    expect(res.status).toBe(200);
    expect(res.body.status).toBe('scheduled');
    await app.runJobs({ recurring: true });
    expect((await editor.get(`/api/episodes/${ep.id}`)).body.status).toBe('scheduled');

    const due = new Date(Date.now() - 60_000);
    await app.deps.db.updateTable('episodes').set({ publish_at: due }).where('id', '=', ep.id).execute();
    await app.runJobs({ recurring: true });
    const after = await editor.get(`/api/episodes/${ep.id}`);
    expect(after.body.status).toBe('published');
    expect(new Date(after.body.publishedAt).getTime()).toBe(due.getTime());
  });

  it('re-runs the publish checks when the time comes: a failing episode goes back to draft', async () => {
    const { ep, res } = await scheduledEpisode('Emptied later');
    expect(res.status).toBe(200);
    // The write-up is emptied after scheduling (straight in the database, as a later rule might fail).
    await app.deps.db
      .updateTable('episodes')
      .set({ write_up: JSON.stringify({ type: 'doc', content: [] }), publish_at: sql<Date>`now() - interval '1 minute'` })
      .where('id', '=', ep.id)
      .execute();
    await app.runJobs({ recurring: true });
    const row = await app.deps.db
      .selectFrom('episodes')
      .select(['status', 'publish_error'])
      .where('id', '=', ep.id)
      .executeTakeFirstOrThrow();
    expect(row.status).toBe('draft');
    expect(row.publish_error).toMatch(/write something/i);
  });

  it('refuses a time in the past', async () => {
    const b = await newBuild('Past');
    const ep = await newEpisode(b.id);
    const res = await editor.post(`/api/episodes/${ep.id}/schedule`, { version: ep.version, publishAt: '2020-01-01T00:00:00Z' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty('publishAt');
  });
});

describe('trash', () => {
  it('soft-deletes an episode, lists it on the Workbench, restores it, and purges after 30 days', async () => {
    const b = await newBuild('Trash');
    const ep = await newEpisode(b.id, 'Going away');
    expect((await editor.request('DELETE', `/api/episodes/${ep.id}`)).status).toBe(403);
    expect((await owner.request('DELETE', `/api/episodes/${ep.id}`)).status).toBe(204);
    expect((await editor.get(`/api/episodes/${ep.id}`)).status).toBe(404);
    const bench = await owner.get('/api/workbench');
    expect(bench.body.deleted.map((d: { id: number }) => d.id)).toContain(ep.id);
    expect(bench.body.deleted.find((d: { id: number }) => d.id === ep.id)).toMatchObject({ kind: 'episode', buildTitle: 'Trash' });
    expect((await owner.post(`/api/episodes/${ep.id}/restore`, {})).status).toBe(200);
    expect((await editor.get(`/api/episodes/${ep.id}`)).status).toBe(200);

    await owner.request('DELETE', `/api/episodes/${ep.id}`);
    await app.deps.db
      .updateTable('episodes')
      .set({ deleted_at: sql<Date>`now() - interval '31 days'` })
      .where('id', '=', ep.id)
      .execute();
    expect((await owner.post(`/api/episodes/${ep.id}/restore`, {})).status).toBe(409);
    await app.runJobs({ recurring: true });
    expect(await app.deps.db.selectFrom('episodes').select('id').where('id', '=', ep.id).executeTakeFirst()).toBeUndefined();
  });

  it('soft-deletes a build and its owner restores it', async () => {
    const b = await newBuild('Whole build');
    expect((await owner.request('DELETE', `/api/builds/${b.id}`)).status).toBe(204);
    expect((await visitor.get(`/api/builds/${b.id}`)).status).toBe(404);
    expect((await editor.get(`/api/builds/${b.id}`)).status).toBe(404);
    expect((await owner.get(`/api/builds/${b.id}`)).body.deletedAt).not.toBeNull();
    expect((await owner.post(`/api/builds/${b.id}/restore`, {})).body.deletedAt).toBeNull();
    expect((await visitor.get(`/api/builds/${b.id}`)).status).toBe(200);
  });
});

describe('open items', () => {
  it('carries an item across episodes until one closes it', async () => {
    const b = await newBuild('Open items');
    const e1 = await newEpisode(b.id, 'One');
    const e2 = await newEpisode(b.id, 'Two');
    const e3 = await newEpisode(b.id, 'Three');
    const item = await editor.post(`/api/builds/${b.id}/open-items`, {
      title: 'Refill and bleed the cooling system',
      openedInEpisodeId: e1.id,
    });
    expect(item.status).toBe(201);
    expect((await editor.get(`/api/builds/${b.id}/open-items?episodeId=${e2.id}`)).body.items.map((i: { id: number }) => i.id)).toEqual([
      item.body.id,
    ]);
    const closed = await editor.request('PATCH', `/api/open-items/${item.body.id}`, { closedInEpisodeId: e2.id });
    expect(closed.body.closedIn.number).toBe(2);
    expect((await editor.get(`/api/builds/${b.id}/open-items?episodeId=${e2.id}`)).body.items).toHaveLength(1);
    expect((await editor.get(`/api/builds/${b.id}/open-items?episodeId=${e3.id}`)).body.items).toHaveLength(0);
    const other = await newBuild('Another');
    const foreign = await newEpisode(other.id);
    const wrong = await editor.request('PATCH', `/api/open-items/${item.body.id}`, { closedInEpisodeId: foreign.id });
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.fields).toHaveProperty('closedInEpisodeId');
  });
});

describe('workbench', () => {
  it('lists my builds with counts and hours, drafts and scheduled episodes', async () => {
    const b = await newBuild('Bench');
    const ep = await newEpisode(b.id, 'Bench draft');
    await editor.request('PATCH', `/api/episodes/${ep.id}`, { version: ep.version, hoursWorked: 3.5 });
    const bench = await editor.get('/api/workbench');
    expect(bench.status).toBe(200);
    const row = bench.body.builds.find((x: { id: number }) => x.id === b.id);
    expect(row).toMatchObject({ role: 'editor', episodeCount: 1, publishedCount: 0, hoursWorked: 3.5 });
    expect(bench.body.drafts.map((d: { id: number }) => d.id)).toContain(ep.id);
  });
});
