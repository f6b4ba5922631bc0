// The public side: server-rendered pages (no JavaScript), visibility rules, feeds and search.
import { XMLParser, XMLValidator } from 'fast-xml-parser';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { renderWriteUp } from '../../server/services/write-up-html';
import type { WriteUpDoc } from '../../src/shared/write-up';
import { addBuildMember, createOwnedBuild, signedInClient } from '../helpers/accounts';
import { createEpisode, createUser } from '../helpers/factories';
import { TestClient } from '../helpers/http-client';
import { startTestApp, type TestApp } from '../helpers/test-app';

let app: TestApp;
let visitor: TestClient;
const ids = { publicBuild: 0, unlistedBuild: 0, privateBuild: 0, episode: 0, draft: 0, unlistedEpisode: 0, privateEpisode: 0 };

const doc = (...paragraphs: string[]): WriteUpDoc => ({
  type: 'doc',
  content: paragraphs.map((text) => ({ type: 'paragraph', content: [{ type: 'text', text }] })),
});

async function episodeWith(buildId: number, fields: { slug: string; title: string; text: string; status?: 'draft' | 'published' }) {
  const writeUp = doc(fields.text);
  const e = await createEpisode(app.deps.db, {
    build_id: buildId,
    slug: fields.slug,
    title: fields.title,
    status: fields.status ?? 'published',
    published_at: fields.status === 'draft' ? null : new Date(Date.now() - 3_600_000),
    video_url: 'https://video.example.test/watch?v=abc',
    duration_seconds: 900,
    minutes_worked: 150,
    write_up: JSON.stringify(writeUp),
    write_up_html: renderWriteUp(writeUp),
  });
  return e;
}

beforeAll(async () => {
  app = await startTestApp();
  const db = app.deps.db;
  visitor = new TestClient(app.baseUrl);
  const { owner, build } = await createOwnedBuild(db, {
    owner: { handle: 'nell-ashdown', display_name: 'Nell Ashdown', email: 'nell@example.test' },
    build: { slug: 'harrier-1968', title: '1968 Tollgate Harrier roadster', vehicle_make: 'Tollgate', vehicle_year: '1968' },
  });
  ids.publicBuild = build.id;
  await db
    .insertInto('build_systems')
    .values([
      { build_id: build.id, key: 'brakes', name: 'Brakes', safety_critical: true, position: 0 },
      { build_id: build.id, key: 'body', name: 'Body', safety_critical: false, position: 1 },
    ])
    .execute();
  const first = await episodeWith(build.id, { slug: 'sills', title: 'Sills cut out', text: 'Rotten sills came out with a grinder.' });
  const e = await episodeWith(build.id, {
    slug: 'rear-drums',
    title: 'Rear drums and shoes',
    text: 'The wheel cylinder was weeping, so a zinctastic rebuild kit went in.',
  });
  ids.episode = e.id;
  await db
    .insertInto('chapters')
    .values([
      { episode_id: e.id, position: 0, start_seconds: 0, title: 'Drums off', system_key: 'brakes', notes: null },
      {
        episode_id: e.id,
        position: 1,
        start_seconds: 95,
        title: 'Adjuster quadrantfix freed',
        system_key: 'brakes',
        notes: 'Penetrating oil overnight.',
      },
      { episode_id: e.id, position: 2, start_seconds: 410, title: 'Shoes back on', system_key: null, notes: null },
    ])
    .execute();
  await db
    .insertInto('open_items')
    .values({ build_id: build.id, title: 'Bleed the rear brakes', note: null, opened_in_episode_id: e.id })
    .execute();
  ids.draft = (
    await episodeWith(build.id, { slug: 'secret-draft', title: 'Draft only', text: 'A draftonlyword lives here.', status: 'draft' })
  ).id;
  expect(first.number).toBe(1);

  const unlisted = await createOwnedBuild(db, {
    owner: { handle: 'unlisted-ulla', display_name: 'Ulla Unlisted' },
    build: { slug: 'quiet-one', title: 'A quiet tractor', visibility: 'unlisted' },
  });
  ids.unlistedBuild = unlisted.build.id;
  ids.unlistedEpisode = (
    await episodeWith(unlisted.build.id, { slug: 'hidden', title: 'Hub seals', text: 'An unlistedword appears here.' })
  ).id;

  const priv = await createOwnedBuild(db, {
    owner: { handle: 'private-pip', display_name: 'Pip Private', email: 'pip@example.test' },
    build: { slug: 'secret', title: 'A private boat', visibility: 'private' },
  });
  ids.privateBuild = priv.build.id;
  ids.privateEpisode = (await episodeWith(priv.build.id, { slug: 'hull', title: 'Hull', text: 'A privateword appears here.' })).id;
  expect(owner.id).toBeGreaterThan(0);
});
afterAll(async () => {
  await app?.stop();
});

const page = async (path: string) => {
  const res = await fetch(`${app.baseUrl}${path}`, { redirect: 'manual' });
  return { status: res.status, html: await res.text(), headers: res.headers };
};

describe('episode page without JavaScript', () => {
  it('carries the write-up, every chapter, the caution, title, description, canonical and Open Graph tags', async () => {
    const { status, html } = await page('/builds/nell-ashdown/harrier-1968/episodes/rear-drums');
    expect(status).toBe(200);
    const [head, body] = html.split('</head>');
    expect(body).toContain('zinctastic rebuild kit');
    for (const t of ['Drums off', 'Adjuster quadrantfix freed', 'Shoes back on']) expect(body).toContain(t);
    // Chapter anchors carry the moment; the video link carries it too (pattern t={seconds}).
    expect(body).toContain('id="at-95"');
    expect(body).toContain('href="#at-95"');
    expect(body).toContain('https://video.example.test/watch?v=abc&amp;t=95');
    // Brakes are safety-critical by flag: the caution bar is in the HTML.
    expect(body).toMatch(/Safety-critical/);
    expect(body).toContain('workshop manual');
    expect(body).toContain('Bleed the rear brakes');
    // Previous episode link.
    expect(body).toContain('/builds/nell-ashdown/harrier-1968/episodes/sills');
    expect(head).toMatch(/<title>Ep\. 2: Rear drums and shoes · 1968 Tollgate Harrier roadster — Rivet &amp; Reel<\/title>/);
    expect(head).toContain('<meta name="description" content="What happened in the garage this time."/>');
    const canonical = `${app.baseUrl}/builds/nell-ashdown/harrier-1968/episodes/rear-drums`;
    expect(head).toContain(`<link rel="canonical" href="${canonical}"/>`);
    expect(head).toContain(`<meta property="og:url" content="${canonical}"/>`);
    expect(head).toContain('<meta property="og:title" content="Ep. 2: Rear drums and shoes · 1968 Tollgate Harrier roadster"/>');
    expect(head).toContain('<meta property="og:type" content="article"/>');
    expect(head).toMatch(/<meta property="og:image" content="http:\/\/127\.0\.0\.1:\d+\/share-card\.png"\/>/);
    expect(head).toContain(`<link rel="alternate" type="application/atom+xml"`);
    expect(head).not.toContain('noindex');
  });

  it('answers 404 for a draft to a visitor and shows it to its build team', async () => {
    expect((await page('/builds/nell-ashdown/harrier-1968/episodes/secret-draft')).status).toBe(404);
    expect((await visitor.get(`/api/episodes/${ids.draft}/reading`)).status).toBe(404);
    const owner = await signedInClient(app, 'nell@example.test');
    const res = await owner.get(`/api/episodes/${ids.draft}/reading`);
    expect(res.status).toBe(200);
    expect(res.body.status).toBe('draft');
  });

  it('redirects a former episode slug with 301 to the current address', async () => {
    await app.deps.db
      .insertInto('episode_slugs')
      .values({ episode_id: ids.episode, build_id: ids.publicBuild, slug: 'old-drums' })
      .execute();
    const res = await page('/builds/nell-ashdown/harrier-1968/episodes/old-drums');
    expect(res.status).toBe(301);
    expect(res.headers.get('location')).toBe('/builds/nell-ashdown/harrier-1968/episodes/rear-drums');
  });
});

describe('build, directory and creator pages', () => {
  it('build page lists episodes in order, open items and hours worked, with noindex only when unlisted', async () => {
    const { status, html } = await page('/builds/nell-ashdown/harrier-1968');
    expect(status).toBe(200);
    expect(html.indexOf('Sills cut out')).toBeLessThan(html.indexOf('Rear drums and shoes'));
    expect(html).not.toContain('Draft only');
    expect(html).toContain('Bleed the rear brakes');
    // 2 published episodes × 150 minutes = 5 h; the draft does not count.
    expect(html).toContain('5 h');
    expect(html).not.toContain('noindex');
    const api = await visitor.get(`/api/builds/${ids.publicBuild}/overview`);
    expect(api.body.hoursWorked).toBe(5);
    expect(api.body.episodes.map((e: { number: number }) => e.number)).toEqual([1, 2]);
  });

  it('directory filters by kind, make and decade, and pages on the server', async () => {
    const all = await visitor.get('/api/builds');
    expect(all.status).toBe(200);
    expect(all.body.items.map((b: { slug: string }) => b.slug)).toEqual(['harrier-1968']);
    expect(all.body.makes).toEqual(['Tollgate']);
    expect(all.body.decades).toEqual([1960]);
    expect((await visitor.get('/api/builds?decade=1960&make=tollgate&kind=car')).body.total).toBe(1);
    expect((await visitor.get('/api/builds?decade=1970')).body.total).toBe(0);
    expect((await visitor.get('/api/builds?kind=boat')).body.total).toBe(0);
    const bad = await visitor.get('/api/builds?decade=1965');
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields).toHaveProperty('decade');
    const html = (await page('/builds')).html;
    expect(html).toContain('1968 Tollgate Harrier roadster');
  });

  it("creator page shows the creator's public builds and latest episodes", async () => {
    const { status, html } = await page('/creators/nell-ashdown');
    expect(status).toBe(200);
    expect(html).toContain('Nell Ashdown');
    expect(html).toContain('1968 Tollgate Harrier roadster');
    expect(html).toContain('Rear drums and shoes');
    expect((await page('/creators/nobody-here')).status).toBe(404);
    // A creator's private build stays off their page.
    expect((await page('/creators/private-pip')).html).not.toContain('A private boat');
  });
});

describe('unlisted and private builds', () => {
  it('an unlisted build is readable by link, with noindex, and absent from front page, directory, site feed and search', async () => {
    const build = await page('/builds/unlisted-ulla/quiet-one');
    expect(build.status).toBe(200);
    expect(build.html).toContain('<meta name="robots" content="noindex"/>');
    const ep = await page('/builds/unlisted-ulla/quiet-one/episodes/hidden');
    expect(ep.status).toBe(200);
    expect(ep.html).toContain('unlistedword');
    expect(ep.html).toContain('<meta name="robots" content="noindex"/>');
    expect((await page('/')).html).not.toContain('Hub seals');
    expect((await visitor.get('/api/builds')).body.items.some((b: { slug: string }) => b.slug === 'quiet-one')).toBe(false);
    expect(await (await fetch(`${app.baseUrl}/feeds/episodes.atom`)).text()).not.toContain('Hub seals');
    expect((await visitor.get('/api/search?q=unlistedword')).body.total).toBe(0);
    // Its own feed works for whoever has the link.
    expect((await fetch(`${app.baseUrl}/feeds/builds/${ids.unlistedBuild}.atom`)).status).toBe(200);
  });

  it('a private build is 404 to everyone outside its team: pages, API and feed', async () => {
    expect((await page('/builds/private-pip/secret')).status).toBe(404);
    expect((await page('/builds/private-pip/secret/episodes/hull')).status).toBe(404);
    expect((await visitor.get(`/api/builds/${ids.privateBuild}/overview`)).status).toBe(404);
    expect((await visitor.get(`/api/episodes/${ids.privateEpisode}/reading`)).status).toBe(404);
    expect((await fetch(`${app.baseUrl}/feeds/builds/${ids.privateBuild}.atom`)).status).toBe(404);
    const team = await signedInClient(app, 'pip@example.test');
    expect((await team.get(`/api/builds/${ids.privateBuild}/overview`)).status).toBe(200);
  });
});

describe('feeds', () => {
  const parser = new XMLParser({ ignoreAttributes: false, attributeNamePrefix: '@' });
  const asList = <T>(v: T | T[] | undefined): T[] => (v === undefined ? [] : Array.isArray(v) ? v : [v]);
  /** Text of an element the parser may give as a string or as { '#text', '@type' }. */
  const text = (v: unknown): string =>
    typeof v === 'object' && v !== null && '#text' in v ? String((v as { '#text': unknown })['#text']) : String(v);

  it('the site feed is valid Atom with absolute links, summaries and the sanitised write-up', async () => {
    const res = await fetch(`${app.baseUrl}/feeds/episodes.atom`);
    expect(res.headers.get('content-type')).toContain('application/atom+xml');
    const xml = await res.text();
    expect(XMLValidator.validate(xml)).toBe(true);
    const feed = parser.parse(xml).feed;
    expect(feed['@xmlns']).toBe('http://www.w3.org/2005/Atom');
    const entries = asList(feed.entry);
    expect(entries.map((e: { title: unknown }) => text(e.title))).toContain('1968 Tollgate Harrier roadster — Ep. 2: Rear drums and shoes');
    expect(xml).not.toContain('Draft only');
    expect(xml).not.toContain('privateword');
    for (const e of entries) {
      const links = asList(e.link as { '@href': string }[]);
      for (const l of links) expect(l['@href']).toMatch(/^http:\/\/127\.0\.0\.1:\d+\//);
      expect(String(e.id)).toMatch(/^http:\/\//);
    }
    const drums = entries.find((e: { title: unknown }) => text(e.title).endsWith('Rear drums and shoes'));
    expect(text(drums.summary)).toBe('What happened in the garage this time.');
    expect(text(drums.content)).toContain('zinctastic rebuild kit');
  });

  it('the build feed lists that build only; the pages link their feeds', async () => {
    const xml = await (await fetch(`${app.baseUrl}/feeds/builds/${ids.publicBuild}.atom`)).text();
    expect(XMLValidator.validate(xml)).toBe(true);
    const entries = asList(parser.parse(xml).feed.entry);
    expect(entries).toHaveLength(2);
    expect((await page('/builds/nell-ashdown/harrier-1968')).html).toContain(`href="${app.baseUrl}/feeds/builds/${ids.publicBuild}.atom"`);
    expect((await fetch(`${app.baseUrl}/feeds/builds/nope.atom`)).status).toBe(404);
  });
});

describe('search', () => {
  it('finds a word from a write-up and from a chapter title, with the match marked', async () => {
    const fromWriteUp = await visitor.get('/api/search?q=zinctastic');
    expect(fromWriteUp.body.total).toBe(1);
    expect(fromWriteUp.body.items[0].title).toBe('Rear drums and shoes');
    expect(fromWriteUp.body.items[0].snippet).toContain('\u0002zinctastic\u0003');
    // Past the last page: no items, but the count is still there for "page 3 of 1" and a way back.
    const past = await visitor.get('/api/search?q=zinctastic&page=3');
    expect(past.body).toMatchObject({ items: [], total: 1, page: 3 });
    const fromChapter = await visitor.get('/api/search?q=quadrantfix');
    expect(fromChapter.body.items.map((h: { title: string }) => h.title)).toEqual(['Rear drums and shoes']);
    const build = await visitor.get('/api/search?q=Tollgate');
    expect(build.body.items.some((h: { kind: string }) => h.kind === 'build')).toBe(true);
  });

  it('keeps chapter titles in step when chapters change', async () => {
    await app.deps.db
      .updateTable('chapters')
      .set({ title: 'Adjuster wobblenut freed' })
      .where('episode_id', '=', ids.episode)
      .where('position', '=', 1)
      .execute();
    expect((await visitor.get('/api/search?q=wobblenut')).body.total).toBe(1);
    expect((await visitor.get('/api/search?q=quadrantfix')).body.total).toBe(0);
  });

  it('does not find drafts or private builds', async () => {
    expect((await visitor.get('/api/search?q=draftonlyword')).body.total).toBe(0);
    expect((await visitor.get('/api/search?q=privateword')).body.total).toBe(0);
  });

  it('survives hostile query strings', async () => {
    for (const q of [
      '"',
      "'",
      '&',
      '|',
      '!',
      ':*',
      'a & | ! :* b',
      '"unclosed quote',
      '(((',
      '\\',
      '-',
      'or',
      '<script>alert(1)</script>',
      '%00',
      '😀',
    ]) {
      const res = await visitor.get(`/api/search?q=${encodeURIComponent(q)}`);
      expect(res.status, q).toBe(200);
      expect(Array.isArray(res.body.items)).toBe(true);
    }
    expect((await visitor.get(`/api/search?q=${'x'.repeat(201)}`)).status).toBe(400);
    const html = await page(`/search?q=${encodeURIComponent('"zinctastic')}`);
    expect(html.status).toBe(200);
    expect(html.html).toContain('Rear drums and shoes');
  });
});

describe('membership of the team shows in the build page', () => {
  it('names the editors', async () => {
    const ed = await createUser(app.deps.db, { display_name: 'Rafe Editor', handle: 'rafe-editor' });
    await addBuildMember(app.deps.db, ids.publicBuild, ed.id, 'editor');
    expect((await page('/builds/nell-ashdown/harrier-1968')).html).toContain('Rafe Editor');
  });
});
