import { sql } from 'kysely';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startSmtpFake, type SmtpFake } from '../../fakes/smtp';
import { publishDueEpisodes } from '../../server/jobs/episodes';
import { sendDigests } from '../../server/jobs/notices';
import { addEpisode, buildWithEpisode, person } from '../helpers/followers-world';
import { startTestApp, type TestApp } from '../helpers/test-app';

const MULTIPLIER = 4;
let app: TestApp;
let restarted: SmtpFake | undefined;
beforeAll(async () => {
  // Many people sign in from one address here: widen the limits (the posting limit is checked against its multiple).
  app = await startTestApp({ env: { RATE_LIMIT_MULTIPLIER: String(MULTIPLIER) } });
});
afterAll(async () => {
  await restarted?.stop();
  await app?.stop();
});

const outboxTo = async (kind: string, addresses: string[]) =>
  (
    await app.deps.db
      .selectFrom('outbox_messages')
      .select('to_address')
      .where('kind', '=', kind)
      .where('to_address', 'in', addresses)
      .execute()
  ).map((r) => r.to_address);

/** A build, its creator, and followers: by build, by creator, by both, opted out, weekly. */
async function followed() {
  const world = await buildWithEpisode(app);
  const byBuild = await person(app);
  const byCreator = await person(app);
  const both = await person(app);
  const optedOut = await person(app);
  const weekly = await person(app);
  const handle = world.owner.user.handle;
  for (const p of [byBuild, both, optedOut, weekly])
    expect((await p.client.request('PUT', `/api/builds/${world.build.id}/follow`, {})).status).toBe(204);
  for (const p of [byCreator, both]) expect((await p.client.request('PUT', `/api/creators/${handle}/follow`, {})).status).toBe(204);
  expect(
    (
      await optedOut.client.request('PUT', '/api/account/notices', {
        newEpisodes: 'none',
        replies: true,
        stateChanges: true,
        newPosts: 'each',
      })
    ).status,
  ).toBe(200);
  await weekly.client.request('PUT', '/api/account/notices', {
    newEpisodes: 'weekly',
    replies: true,
    stateChanges: true,
    newPosts: 'each',
  });
  const emails = { byBuild, byCreator, both, optedOut, weekly };
  const addresses = Object.fromEntries(Object.entries(emails).map(([k, v]) => [k, v.user.email!])) as Record<keyof typeof emails, string>;
  return { ...world, people: emails, addresses, all: Object.values(addresses) };
}

describe('new-episode notices', () => {
  it('publishing queues exactly one message per opted-in follower, none for opted-out ones, and never again', async () => {
    const w = await followed();
    const draft = await addEpisode(app, w.build.id, 'draft');
    const published = await w.editor.client.post(`/api/episodes/${draft.id}/publish`, { version: 1 });
    expect(published.status).toBe(200);
    const sent = await outboxTo('notice-new-episode', w.all);
    expect(sent.sort()).toEqual([w.addresses.byBuild, w.addresses.byCreator, w.addresses.both].sort());
    // Unpublish and publish again: no second round.
    const draftAgain = await w.editor.client.post(`/api/episodes/${draft.id}/unpublish`, { version: published.body.version });
    await w.editor.client.post(`/api/episodes/${draft.id}/publish`, { version: draftAgain.body.version });
    expect(await outboxTo('notice-new-episode', w.all)).toHaveLength(3);
    // Everyone following still gets the in-app notice, once.
    const notes = await w.people.optedOut.client.get('/api/notifications');
    expect(notes.body.items.filter((n: { kind: string }) => n.kind === 'new-episode')).toHaveLength(1);
    expect(notes.body.unreadCount).toBe(1);
    // The weekly digest gathers it into one message.
    expect(await sendDigests(app.deps, 'new-episode')).toBeGreaterThanOrEqual(1);
    expect(await outboxTo('digest-new-episodes', w.all)).toEqual([w.addresses.weekly]);
  });

  it('the scheduled job announces once, the same way', async () => {
    const w = await followed();
    const draft = await addEpisode(app, w.build.id, 'draft');
    await app.deps.db
      .updateTable('episodes')
      .set({ status: 'scheduled', publish_at: sql<Date>`now() - interval '1 minute'` })
      .where('id', '=', draft.id)
      .execute();
    expect(await publishDueEpisodes(app.deps)).toContain(draft.id);
    expect(await publishDueEpisodes(app.deps)).not.toContain(draft.id);
    expect((await outboxTo('notice-new-episode', w.all)).sort()).toEqual(
      [w.addresses.byBuild, w.addresses.byCreator, w.addresses.both].sort(),
    );
  });

  it('delivers with text and HTML, absolute links and one-click headers; waits while SMTP is down', async () => {
    const w = await followed();
    // Deliver what earlier tests queued, so only this test's messages wait for the server.
    await app.runJobs();
    app.smtp.clear();
    const port = app.smtp.smtpPort;
    await app.smtp.stop();
    const draft = await addEpisode(app, w.build.id, 'draft');
    expect((await w.editor.client.post(`/api/episodes/${draft.id}/publish`, { version: 1 })).status).toBe(200);
    await app.runJobs();
    const waiting = await app.deps.db
      .selectFrom('outbox_messages')
      .select('status')
      .where('kind', '=', 'notice-new-episode')
      .where('to_address', '=', w.addresses.byBuild)
      .execute();
    expect(waiting.map((r) => r.status)).toEqual(['pending']);

    restarted = await startSmtpFake({ smtpPort: port, httpPort: 0 });
    await app.runJobs({ recurring: true });
    await app.runJobs({ recurring: true });
    const got = restarted.messages().filter((m) => m.to.includes(w.addresses.both.toLowerCase()));
    expect(got).toHaveLength(1);
    const mail = got[0]!;
    expect(mail.text).toContain(`${app.config.PUBLIC_URL}/builds/`);
    expect(mail.html).toContain('<a href="http://127.0.0.1');
    expect(mail.headers['list-unsubscribe']).toMatch(/^<http:\/\/127\.0\.0\.1:\d+\/api\/unsubscribe\?u=\d+&s=new-episodes&t=[\w-]+>$/);
    expect(mail.headers['list-unsubscribe-post']).toBe('List-Unsubscribe=One-Click');

    // One click, as a mail client sends it: no cookie, no CSRF token, a form body.
    const url = mail.headers['list-unsubscribe']!.slice(1, -1);
    const forged = url.replace(/t=[\w-]+/, 't=AAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAA');
    const otherPerson = url.replace(/u=\d+/, `u=${w.people.byBuild.user.id}`);
    const click = (u: string) =>
      fetch(u, { method: 'POST', headers: { 'content-type': 'application/x-www-form-urlencoded' }, body: 'List-Unsubscribe=One-Click' });
    expect((await click(forged)).status).toBe(403);
    expect((await click(otherPerson)).status).toBe(403);
    expect((await click(url)).status).toBe(204);
    expect((await w.people.both.client.get('/api/account/notices')).body.newEpisodes).toBe('none');
    expect((await w.people.byBuild.client.get('/api/account/notices')).body.newEpisodes).toBe('each');
  });
});

describe('post notices', () => {
  it('tells the build team of a new post, and the author of a reply and of a state change', async () => {
    const { episode, owner, editor } = await buildWithEpisode(app);
    const follower = await person(app);
    const made = await follower.client.post(`/api/episodes/${episode.id}/posts`, {
      kind: 'suggestion',
      chapterStartSeconds: 120,
      body: 'Label the bolts.',
    });
    expect((await outboxTo('notice-new-post', [owner.user.email!, editor.user.email!])).sort()).toEqual(
      [owner.user.email!, editor.user.email!].sort(),
    );
    await editor.client.post(`/api/posts/${made.body.id}/replies`, { body: 'Will do.' });
    await owner.client.request('PUT', `/api/posts/${made.body.id}/state`, { state: 'adopted', note: 'Bolts bagged per side.' });
    expect(await outboxTo('notice-reply', [follower.user.email!])).toEqual([follower.user.email!]);
    expect(await outboxTo('notice-state-change', [follower.user.email!])).toEqual([follower.user.email!]);
    const notes = await follower.client.get('/api/notifications');
    expect(notes.body.unreadCount).toBe(2);
    expect((await follower.client.post('/api/notifications/read', { all: true })).status).toBe(204);
    expect((await follower.client.get('/api/notifications')).body.unreadCount).toBe(0);
  });

  it('skips addresses that failed permanently', async () => {
    const { episode, owner } = await buildWithEpisode(app);
    await app.deps.db
      .insertInto('mail_suppressions')
      .values({ address: owner.user.email!.toLowerCase(), reason: '550 no such user' })
      .execute();
    const follower = await person(app);
    await follower.client.post(`/api/episodes/${episode.id}/posts`, { kind: 'question', chapterStartSeconds: 0, body: 'Which stands?' });
    expect(await outboxTo('notice-new-post', [owner.user.email!])).toEqual([]);
  });
});
