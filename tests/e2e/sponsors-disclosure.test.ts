// A supported episode as a reader meets it: the disclosure is the first thing on the page at phone
// width (375 px), before the title and the write-up (CAP/ASA influencers' guide: up front, visible on
// every device; FTC 16 CFR Part 255: hard to miss); the share card says it too; the build page
// credits the sponsor. visit() runs axe and the phone-width check on each page.
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { renderWriteUp } from '../../server/services/write-up-html';
import type { WriteUpDoc } from '../../src/shared/write-up';
import { createOwnedBuild } from '../helpers/accounts';
import { createEpisode } from '../helpers/factories';
import { signInByEmail, TestClient } from '../helpers/http-client';
import { expectOnlyLoopback, launchBrowser, openPage, visit, type TrackedPage } from '../helpers/browser';
import { startTestApp, type TestApp } from '../helpers/test-app';
import { TEST_DIST_DIR } from '../setup/build-global';

let app: TestApp;
let browser: Browser;
let tracked: TrackedPage;
let buildId: number;
let draftId: number;
let sponsorName: string;

const writeUp: WriteUpDoc = {
  type: 'doc',
  content: [{ type: 'paragraph', content: [{ type: 'text', text: 'The new clutch cable went in without a fight this time.' }] }],
};
const EPISODE_URL = '/builds/hollis-quarry/ashby-1971/episodes/clutch-cable';

beforeAll(async () => {
  app = await startTestApp({ distDir: TEST_DIST_DIR });
  const db = app.deps.db;
  const { build } = await createOwnedBuild(db, {
    owner: { handle: 'hollis-quarry', display_name: 'Hollis Quarry', email: 'hollis@example.test' },
    build: { slug: 'ashby-1971', title: '1971 Ashby Kestrel estate', vehicle_kind: 'car', currency: 'GBP' },
  });
  const sponsor = await db
    .insertInto('sponsors')
    .values({ slug: 'wendle-cables', name: 'Wendle Cables', website: 'https://wendle-cables.example' })
    .returning('id')
    .executeTakeFirstOrThrow();
  const e = await createEpisode(db, {
    build_id: build.id,
    slug: 'clutch-cable',
    title: 'A clutch cable that fits',
    summary: 'Out with the frayed one.',
    write_up: JSON.stringify(writeUp),
    write_up_html: renderWriteUp(writeUp),
    video_disclosure_confirmed: true,
  });
  await db
    .insertInto('part_lines')
    .values({
      build_id: build.id,
      episode_id: e.id,
      position: 0,
      kind: 'part',
      description: 'Clutch cable, adjustable',
      source: 'new',
      status: 'fitted',
      quantity: '1',
      unit_price_minor: 0,
      currency: 'GBP',
      support_kind: 'gifted',
      sponsor_id: sponsor.id,
      list_price_minor: 1899,
    })
    .execute();
  buildId = build.id;
  sponsorName = 'Wendle Cables';
  draftId = (
    await createEpisode(db, {
      build_id: build.id,
      slug: 'gearbox-mount',
      title: 'Gearbox mount',
      status: 'draft',
      published_at: null,
      write_up: JSON.stringify(writeUp),
      write_up_html: renderWriteUp(writeUp),
    })
  ).id;
  await db
    .insertInto('part_lines')
    .values({
      build_id: build.id,
      episode_id: draftId,
      position: 0,
      kind: 'part',
      description: 'Gearbox mount, rubber',
      source: 'new',
      status: 'fitted',
      quantity: '1',
      unit_price_minor: 1200,
      currency: 'GBP',
      support_kind: 'discounted',
      sponsor_id: sponsor.id,
      list_price_minor: 1600,
    })
    .execute();
  browser = await launchBrowser();
  tracked = await openPage(browser);
});

afterAll(async () => {
  await tracked?.close();
  await browser?.close();
  await app?.stop();
});

describe('a supported episode', () => {
  it('shows the disclosure first, at 375 px, before the title and the write-up', async () => {
    const page = await visit(tracked, `${app.baseUrl}${EPISODE_URL}`);
    const desktop = page.viewportSize();
    await page.setViewportSize({ width: 375, height: 812 });
    const disclosure = page.getByRole('region', { name: 'Disclosure' });
    expect(await disclosure.textContent()).toContain('Gifted');
    expect(await disclosure.textContent()).toContain('Wendle Cables gave one part shown here free of charge.');
    // First in the main content after the breadcrumbs, in the DOM and on the screen.
    const order = await page.evaluate(() => {
      const main = document.getElementById('main')!;
      const first = [...main.querySelectorAll('nav[aria-label="Breadcrumbs"] ~ *')][0];
      return first?.getAttribute('aria-label') ?? first?.tagName ?? null;
    });
    expect(order).toBe('Disclosure');
    const box = (await disclosure.boundingBox())!;
    const title = (await page.getByRole('heading', { level: 1 }).boundingBox())!;
    const writeUpBox = (await page.getByText('The new clutch cable went in').boundingBox())!;
    expect(box.y).toBeLessThan(title.y);
    expect(box.y).toBeLessThan(writeUpBox.y);
    // Readable without scrolling on a phone: inside the first screen, within the width.
    expect(box.y + box.height).toBeLessThan(812);
    expect(box.x + box.width).toBeLessThanOrEqual(375);
    // The share card's description opens with it too.
    expect(await page.locator('meta[property="og:description"]').getAttribute('content')).toMatch(
      /^Gifted: supported by Wendle Cables\. Out with the frayed one\./,
    );
    if (desktop) await page.setViewportSize(desktop);
    expect(tracked.consoleErrors).toEqual([]);
  });

  it('credits the sponsor on the build page', async () => {
    const page = await visit(tracked, `${app.baseUrl}/builds/hollis-quarry/ashby-1971`);
    const credits = page.getByRole('region', { name: 'Supported by' });
    expect(await credits.getByRole('link', { name: 'Wendle Cables' }).getAttribute('href')).toBe('https://wendle-cables.example');
    expect(tracked.consoleErrors).toEqual([]);
    expectOnlyLoopback(tracked);
  });
});

describe('the owner', () => {
  let owner: TrackedPage;
  beforeAll(async () => {
    const client = new TestClient(app.baseUrl);
    await signInByEmail(client, app.deps.db, 'hollis@example.test');
    owner = await openPage(browser, { signedIn: { cookie: client.cookie!, url: app.baseUrl } });
  });
  afterAll(async () => {
    await owner?.close();
  });

  it('adds a sponsorship in the build settings and removes it after confirming', async () => {
    const page = await visit(owner, `${app.baseUrl}/workbench/builds/${buildId}/settings`);
    const section = page.getByRole('region', { name: 'Sponsors' });
    await section.getByText('No sponsorships yet.').waitFor();
    const form = section.getByRole('form', { name: 'Add sponsorship' });
    await form.getByLabel('Sponsor').selectOption({ label: sponsorName });
    await form.getByLabel('Kind of support').selectOption('paid');
    await form.getByLabel('Starts on').fill('2026-11-01');
    await form.getByRole('button', { name: 'Add sponsorship' }).click();
    await section.getByText('from 2026-11-01').waitFor();
    await section.getByRole('button', { name: `Remove the sponsorship by ${sponsorName}` }).click();
    const dialog = page.getByRole('dialog', { name: `Remove the sponsorship by ${sponsorName}?` });
    await dialog.getByRole('button', { name: 'Remove sponsorship' }).click();
    await section.getByText('No sponsorships yet.').waitFor();
    expect(owner.consoleErrors).toEqual([]);
  });

  it('sees the disclosure in the editor and publishes once the video is confirmed to disclose it', async () => {
    const page = await visit(owner, `${app.baseUrl}/workbench/episodes/${draftId}/edit`);
    const panel = page.getByRole('region', { name: 'Disclosure' });
    await panel.getByText('Wendle Cables sold one part shown here at a discount.').waitFor();
    await page.getByRole('button', { name: 'Publish now' }).click();
    await page
      .getByRole('alert')
      .getByText(/Confirm that the video discloses this too/)
      .waitFor();
    await panel.getByLabel('The video discloses this too').check();
    await page.getByRole('button', { name: 'Publish now' }).click();
    await page.getByText('Published. Readers can see it now.').waitFor();
    const row = await app.deps.db
      .selectFrom('episodes')
      .select(['status', 'video_disclosure_confirmed'])
      .where('id', '=', draftId)
      .executeTakeFirstOrThrow();
    expect(row).toEqual({ status: 'published', video_disclosure_confirmed: true });
    // The one refused publish (422) is the browser's only complaint.
    expect(owner.consoleErrors).toEqual(['Failed to load resource: the server responded with a status of 422 (Unprocessable Entity)']);
  });
});
