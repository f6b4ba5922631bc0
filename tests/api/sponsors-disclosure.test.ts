// Sponsors: the disclosure everywhere a supported episode reaches readers (episode JSON, Atom feed,
// new-episode e-mail, the editor's chapter export), and the publish rule that refuses without it —
// now, and again when a scheduled episode's time comes (the owner is told by e-mail).
import { sql } from 'kysely';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { exportChapterBlock } from '../../src/shared/chapters';
import { disclosureLine } from '../../src/shared/disclosure';
import { addBuildMember, createOwnedBuild, signedInClient } from '../helpers/accounts';
import { createBuild, createEpisode, createUser } from '../helpers/factories';
import { TestClient } from '../helpers/http-client';
import { startTestApp, type TestApp } from '../helpers/test-app';

let app: TestApp;
let owner: TestClient;
let follower: TestClient;
let visitor: TestClient;
let buildId: number;
let sponsorId: number;
let paidSponsorId: number;

const doc = (text: string) => JSON.stringify({ type: 'doc', content: [{ type: 'paragraph', content: [{ type: 'text', text }] }] });

beforeAll(async () => {
  app = await startTestApp({ env: { RATE_LIMIT_MULTIPLIER: '1000' } });
  const db = app.deps.db;
  const { build } = await createOwnedBuild(db, {
    owner: { handle: 'disclosure-owner', email: 'disclosure-owner@example.test' },
    build: { slug: 'disclosure-build', title: 'Disclosure build', currency: 'GBP' },
  });
  buildId = build.id;
  sponsorId = (
    await db
      .insertInto('sponsors')
      .values({ slug: 'fernhollow-parts', name: 'Fernhollow Parts', website: null })
      .returning('id')
      .executeTakeFirstOrThrow()
  ).id;
  paidSponsorId = (
    await db
      .insertInto('sponsors')
      .values({ slug: 'brightwick-tools', name: 'Brightwick Tools', website: null })
      .returning('id')
      .executeTakeFirstOrThrow()
  ).id;
  await createUser(db, { email: 'disclosure-follower@example.test' });
  owner = await signedInClient(app, 'disclosure-owner@example.test');
  follower = await signedInClient(app, 'disclosure-follower@example.test');
  visitor = new TestClient(app.baseUrl);
  expect((await follower.request('PUT', `/api/builds/${buildId}/follow`, {})).status).toBe(204);
});
afterAll(async () => {
  await app?.stop();
});

async function draftEpisode(title: string, confirmed = false) {
  const e = await createEpisode(app.deps.db, {
    build_id: buildId,
    title,
    status: 'draft',
    published_at: null,
    write_up: doc('Fitted the new clutch cable.'),
    video_disclosure_confirmed: confirmed,
  });
  return e.id;
}
const addLine = async (episodeId: number, extra: Record<string, unknown>) => {
  const res = await owner.post(`/api/episodes/${episodeId}/part-lines`, {
    currency: 'GBP',
    unitPriceMinor: 0,
    kind: 'part',
    description: 'Clutch cable',
    ...extra,
  });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body.id as number;
};
const version = async (episodeId: number) => (await owner.get(`/api/episodes/${episodeId}`)).body.version as number;

describe('publishing a supported episode', () => {
  let episodeId: number;
  let lineId: number;

  it('is refused with 422 naming the line when a supported line lacks its sponsor', async () => {
    episodeId = await draftEpisode('Gifted clutch cable');
    lineId = await addLine(episodeId, { supportKind: 'gifted', listPriceMinor: 1899 });
    const res = await owner.post(`/api/episodes/${episodeId}/publish`, { version: await version(episodeId) });
    expect(res.status).toBe(422);
    expect(res.body.error.code).toBe('publish_checks_failed');
    expect(res.body.error.fields[`partLines.${lineId}.sponsorId`][0]).toMatch(
      /Part line 1 “Clutch cable” is marked gifted: name its sponsor/,
    );
  });

  it('names a line with a sponsor but no kind of support', async () => {
    const other = await addLine(episodeId, { description: 'Cable ties', sponsorId });
    const res = await owner.post(`/api/episodes/${episodeId}/schedule`, {
      version: await version(episodeId),
      publishAt: new Date(Date.now() + 3_600_000).toISOString(),
    });
    expect(res.status).toBe(422);
    expect(Object.keys(res.body.error.fields)).toContain(`partLines.${other}.supportKind`);
    expect((await owner.delete(`/api/part-lines/${other}`)).status).toBe(204);
  });

  it('is refused until the creator confirms that the video discloses it too', async () => {
    expect((await owner.patch(`/api/part-lines/${lineId}`, { sponsorId })).status).toBe(200);
    const res = await owner.post(`/api/episodes/${episodeId}/publish`, { version: await version(episodeId) });
    expect(res.status).toBe(422);
    expect(Object.keys(res.body.error.fields)).toEqual(['videoDisclosureConfirmed']);
    expect(res.body.error.fields.videoDisclosureConfirmed[0]).toContain('Fernhollow Parts gave one part shown here free of charge.');
    const saved = await owner.patch(`/api/episodes/${episodeId}`, { version: await version(episodeId), videoDisclosureConfirmed: true });
    expect(saved.status).toBe(200);
    expect(saved.body.videoDisclosureConfirmed).toBe(true);
    const ok = await owner.post(`/api/episodes/${episodeId}/publish`, { version: saved.body.version });
    expect(ok.status, JSON.stringify(ok.body)).toBe(200);
    expect(ok.body.status).toBe('published');
  });

  it('carries the disclosure in the episode JSON', async () => {
    const res = await visitor.get(`/api/episodes/${episodeId}/reading`);
    expect(res.status).toBe(200);
    expect(res.body.disclosure).toMatchObject({
      label: 'Gifted',
      text: 'Fernhollow Parts gave one part shown here free of charge.',
      sponsors: [{ id: sponsorId, name: 'Fernhollow Parts' }],
    });
  });

  it('carries it in the build’s Atom feed item, summary and content', async () => {
    const res = await fetch(`${app.baseUrl}/feeds/builds/${buildId}.atom`);
    const xml = await res.text();
    expect(res.status).toBe(200);
    expect(xml).toContain('<summary type="html"><![CDATA[Gifted: Fernhollow Parts gave one part shown here free of charge.');
    expect(xml).toContain('<strong>Gifted:</strong> Fernhollow Parts gave one part shown here free of charge.');
  });

  it('carries it first in the new-episode e-mail to followers', async () => {
    await app.runJobs();
    const mail = app.smtp
      .messages()
      .find((m) => m.to.includes('disclosure-follower@example.test') && m.subject.includes('Gifted clutch cable'));
    expect(mail).toBeDefined();
    expect(mail!.text.startsWith('Gifted: Fernhollow Parts gave one part shown here free of charge.')).toBe(true);
    expect(mail!.html).toContain('Gifted: Fernhollow Parts gave one part shown here free of charge.');
  });

  it('gives the editor the disclosure that opens the exported chapter block', async () => {
    const parts = await owner.get(`/api/episodes/${episodeId}/part-lines`);
    expect(parts.body.disclosure.label).toBe('Gifted');
    // The editor's export: exportChapterBlock with the disclosure line (features/episode-editor, export-block.tsx).
    const block = exportChapterBlock(
      [
        { startSeconds: 0, title: 'Intro' },
        { startSeconds: 75, title: 'Old cable out' },
      ],
      { disclosure: disclosureLine(parts.body.disclosure) },
    );
    expect(block.split('\n')).toEqual([
      'Gifted: Fernhollow Parts gave one part shown here free of charge.',
      '',
      '0:00 Intro',
      '1:15 Old cable out',
    ]);
  });
});

describe('a paid sponsorship and affiliate links', () => {
  it('label the episode "Ad" when it is published within the sponsorship’s dates', async () => {
    const episodeId = await draftEpisode('Sponsored session');
    const today = new Date().toISOString().slice(0, 10);
    expect(
      (await owner.post(`/api/builds/${buildId}/sponsorships`, { sponsorId: paidSponsorId, kind: 'paid', startsOn: today, endsOn: null }))
        .status,
    ).toBe(201);
    await addLine(episodeId, { description: 'Feeler gauges', buyUrl: 'https://shop.example/gauges', affiliate: true });
    const parts = await owner.get(`/api/episodes/${episodeId}/part-lines`);
    expect(parts.body.disclosure.label).toBe('Ad');
    expect(parts.body.disclosure.text).toBe(
      'This episode is sponsored: Brightwick Tools pays for a sponsorship of this build. One where-to-buy link is an affiliate link: the creator earns a commission on what you buy through it.',
    );
    const refused = await owner.post(`/api/episodes/${episodeId}/publish`, { version: await version(episodeId) });
    expect(refused.status).toBe(422);
    expect(Object.keys(refused.body.error.fields)).toEqual(['videoDisclosureConfirmed']);
  });
});

describe('scheduling into a paid sponsorship', () => {
  it('judges the sponsorship on the scheduled day, not today', async () => {
    const db = app.deps.db;
    const ownerId = (await db.selectFrom('users').select('id').where('handle', '=', 'disclosure-owner').executeTakeFirstOrThrow()).id;
    const build = await createBuild(db, { owner_id: ownerId, slug: 'later-sponsored', currency: 'GBP' });
    await addBuildMember(db, build.id, ownerId, 'owner');
    const day = (offset: number) => new Date(Date.now() + offset * 86_400_000);
    expect(
      (
        await owner.post(`/api/builds/${build.id}/sponsorships`, {
          sponsorId: paidSponsorId,
          kind: 'paid',
          startsOn: day(10).toISOString().slice(0, 10),
          endsOn: null,
        })
      ).status,
    ).toBe(201);
    const e = await createEpisode(db, { build_id: build.id, status: 'draft', published_at: null, write_up: doc('Welding the sill.') });
    // Today no disclosure is needed; twelve days from now the paid sponsorship covers the day.
    expect((await owner.get(`/api/episodes/${e.id}/part-lines`)).body.disclosure).toBeNull();
    const res = await owner.post(`/api/episodes/${e.id}/schedule`, { version: await version(e.id), publishAt: day(12).toISOString() });
    expect(res.status).toBe(422);
    expect(Object.keys(res.body.error.fields)).toEqual(['videoDisclosureConfirmed']);
    const soon = await owner.post(`/api/episodes/${e.id}/schedule`, { version: await version(e.id), publishAt: day(2).toISOString() });
    expect(soon.status, JSON.stringify(soon.body)).toBe(200);
  });
});

describe('a scheduled episode that became non-compliant', () => {
  it('is not published at its time, goes back to draft, and the owner is told by e-mail', async () => {
    // Confirmed: the build's paid sponsorship (above) is disclosed in the video.
    const episodeId = await draftEpisode('Scheduled then supported', true);
    const scheduled = await owner.post(`/api/episodes/${episodeId}/schedule`, {
      version: await version(episodeId),
      publishAt: new Date(Date.now() + 3_600_000).toISOString(),
    });
    expect(scheduled.status, JSON.stringify(scheduled.body)).toBe(200);
    // After scheduling, a discounted line is added and its sponsor left out.
    await addLine(episodeId, { description: 'Brake hose', unitPriceMinor: 1500, listPriceMinor: 2000, supportKind: 'discounted' });
    await app.deps.db
      .updateTable('episodes')
      .set({ publish_at: sql<Date>`now() - interval '1 minute'` })
      .where('id', '=', episodeId)
      .execute();
    await app.runJobs({ recurring: true });
    const row = await app.deps.db
      .selectFrom('episodes')
      .select(['status', 'publish_error'])
      .where('id', '=', episodeId)
      .executeTakeFirstOrThrow();
    expect(row.status).toBe('draft');
    expect(row.publish_error).toMatch(/“Brake hose” is marked discounted: name its sponsor/);
    expect((await visitor.get(`/api/episodes/${episodeId}/reading`)).status).toBe(404);
    await app.runJobs();
    const mail = app.smtp.messages().find((m) => m.to.includes('disclosure-owner@example.test') && m.subject.startsWith('Not published'));
    expect(mail).toBeDefined();
    expect(mail!.subject).toBe(
      'Not published: Disclosure build, episode ' +
        (await app.deps.db.selectFrom('episodes').select('number').where('id', '=', episodeId).executeTakeFirstOrThrow()).number,
    );
    expect(mail!.text).toContain('“Brake hose” is marked discounted: name its sponsor');
    expect(mail!.text).toContain(`/workbench/episodes/${episodeId}/edit`);
    // The editor says so too.
    const ep = await owner.get(`/api/episodes/${episodeId}`);
    expect(ep.body.publishError).toMatch(/Brake hose/);
  });
});
