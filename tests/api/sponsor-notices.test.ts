// Member notices: publishing an episode with an organisation's support tells each of its members once
// (in-app and by e-mail through the outbox, with the disclosure), by "publish now" and by the scheduled job.
import { sql } from 'kysely';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { publishDueEpisodes } from '../../server/jobs/episodes';
import { disclosureLine } from '../../src/shared/disclosure';
import { addEpisode, buildWithEpisode, person } from '../helpers/followers-world';
import { addSponsorMember, createPartLine, createSponsor } from '../helpers/sponsors';
import { startTestApp, type TestApp } from '../helpers/test-app';

let app: TestApp;
beforeAll(async () => {
  app = await startTestApp({ env: { RATE_LIMIT_MULTIPLIER: '1000' } });
});
afterAll(async () => {
  await app?.stop();
});

const sponsorMail = async (addresses: string[]) =>
  app.deps.db
    .selectFrom('outbox_messages')
    .select(['to_address', 'subject', 'text_body', 'headers'])
    .where('kind', '=', 'notice-sponsor-episode')
    .where('to_address', 'in', addresses)
    .orderBy('id')
    .execute();

const sponsorNotices = async (userIds: number[]) =>
  app.deps.db
    .selectFrom('notifications')
    .select(['user_id', 'episode_id'])
    .where('kind', '=', 'sponsor-episode')
    .where('user_id', 'in', userIds)
    .execute();

/** Two organisations (one member each, and one person in both), a bystander organisation, and a draft with support from the two. */
async function world(visibility: 'public' | 'unlisted' | 'private' = 'public') {
  const db = app.deps.db;
  const w = await buildWithEpisode(app, { visibility });
  const gifts = await createSponsor(db, { name: 'Bolt Barn' });
  const deals = await createSponsor(db, { name: 'Caliper Court' });
  const bystander = await createSponsor(db, { name: 'Nobody Here' });
  const a = await person(app);
  const b = await person(app);
  const both = await person(app);
  const other = await person(app);
  await addSponsorMember(db, gifts.id, a.user.id);
  await addSponsorMember(db, deals.id, b.user.id);
  await addSponsorMember(db, gifts.id, both.user.id);
  await addSponsorMember(db, deals.id, both.user.id);
  await addSponsorMember(db, bystander.id, other.user.id);
  const draft = await addEpisode(app, w.build.id, 'draft');
  // Confirmed, so the disclosure publish rule (the other half of the sponsors issue) lets it through.
  await db.updateTable('episodes').set({ video_disclosure_confirmed: true }).where('id', '=', draft.id).execute();
  const line = { build_id: w.build.id, episode_id: draft.id, list_price_minor: 5000, unit_price_minor: 0 };
  await createPartLine(db, { ...line, description: 'Brake hose', sponsor_id: gifts.id, support_kind: 'gifted' });
  await createPartLine(db, {
    ...line,
    description: 'Brake pads',
    sponsor_id: deals.id,
    support_kind: 'discounted',
    unit_price_minor: 3000,
  });
  const members = [a, b, both, other];
  return { ...w, draft, a, b, both, other, addresses: members.map((m) => m.user.email!), ids: members.map((m) => m.user.id) };
}

describe('sponsor member notices', () => {
  it('publishing tells each member once, in-app and by e-mail with the disclosure; a re-publish sends nothing more', async () => {
    const w = await world();
    const published = await w.editor.client.post(`/api/episodes/${w.draft.id}/publish`, { version: 1 });
    expect(published.status, JSON.stringify(published.body)).toBe(200);

    const notes = await sponsorNotices(w.ids);
    // a (gifts), b (deals) and both (in both organisations, told once); the bystander organisation's member: nothing.
    expect(notes.map((n) => n.user_id).sort()).toEqual([w.a.user.id, w.b.user.id, w.both.user.id].sort());
    const mail = await sponsorMail(w.addresses);
    expect(mail.map((m) => m.to_address).sort()).toEqual([w.a.user.email, w.b.user.email, w.both.user.email].sort());
    const toA = mail.find((m) => m.to_address === w.a.user.email)!;
    expect(toA.subject).toContain(`episode ${w.draft.number}`);
    expect(toA.text_body).toContain('with one part line supported by Bolt Barn');
    // The same disclosure, word for word, as the episode's parts list (and page) shows.
    const parts = await w.editor.client.get(`/api/episodes/${w.draft.id}/part-lines`);
    expect(parts.body.disclosure).not.toBeNull();
    expect(toA.text_body).toContain(disclosureLine(parts.body.disclosure));
    expect(toA.text_body).toMatch(/Bolt Barn/);
    expect(toA.text_body).toMatch(/https?:\/\/\S+\/builds\/\S+\/episodes\//);
    expect(toA.text_body).toContain('/sponsors/');

    // The in-app notice reads as such and links to the episode.
    const inApp = await w.a.client.get('/api/notifications');
    const item = inApp.body.items.find((n: { kind: string }) => n.kind === 'sponsor-episode');
    expect(item.text).toContain('Your support appears in');
    expect(item.path).toContain('/episodes/');

    const back = await w.editor.client.post(`/api/episodes/${w.draft.id}/unpublish`, { version: published.body.version });
    expect((await w.editor.client.post(`/api/episodes/${w.draft.id}/publish`, { version: back.body.version })).status).toBe(200);
    expect(await sponsorNotices(w.ids)).toHaveLength(3);
    expect(await sponsorMail(w.addresses)).toHaveLength(3);
  });

  it('the scheduled job tells them the same way, once', async () => {
    const w = await world('unlisted');
    await app.deps.db
      .updateTable('episodes')
      .set({
        status: 'scheduled',
        publish_at: sql<Date>`now() - interval '1 minute'`,
        published_at: sql<Date>`now() - interval '1 minute'`,
      })
      .where('id', '=', w.draft.id)
      .execute();
    expect(await publishDueEpisodes(app.deps)).toContain(w.draft.id);
    expect(await publishDueEpisodes(app.deps)).not.toContain(w.draft.id);
    expect((await sponsorMail(w.addresses)).map((m) => m.to_address).sort()).toEqual(
      [w.a.user.email, w.b.user.email, w.both.user.email].sort(),
    );
  });

  it('a private build tells no one', async () => {
    const w = await world('private');
    expect((await w.editor.client.post(`/api/episodes/${w.draft.id}/publish`, { version: 1 })).status).toBe(200);
    expect(await sponsorNotices(w.ids)).toEqual([]);
    expect(await sponsorMail(w.addresses)).toEqual([]);
  });
});
