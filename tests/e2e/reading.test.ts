// A visitor's journey on the public side: front page → episode → a chapter's moment → search.
// Every page goes through visit(): hydration, screenshots at 1280 and 375 px, axe and phone width.
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { renderWriteUp } from '../../server/services/write-up-html';
import type { WriteUpDoc } from '../../src/shared/write-up';
import { createOwnedBuild } from '../helpers/accounts';
import { createEpisode } from '../helpers/factories';
import { expectOnlyLoopback, launchBrowser, openPage, visit, type TrackedPage } from '../helpers/browser';
import { startTestApp, type TestApp } from '../helpers/test-app';
import { TEST_DIST_DIR } from '../setup/build-global';

let app: TestApp;
let browser: Browser;
let tracked: TrackedPage;

const writeUp: WriteUpDoc = {
  type: 'doc',
  content: [
    { type: 'heading', attrs: { level: 2 }, content: [{ type: 'text', text: 'Why the pedal sank' }] },
    {
      type: 'paragraph',
      content: [
        { type: 'text', text: 'The master cylinder had a scored bore, and a reconditioned unit from the swap meet went in instead.' },
      ],
    },
  ],
};

beforeAll(async () => {
  app = await startTestApp({ distDir: TEST_DIST_DIR });
  const db = app.deps.db;
  const { build } = await createOwnedBuild(db, {
    owner: { handle: 'bryony-tallis', display_name: 'Bryony Tallis' },
    build: {
      slug: 'corran-1962',
      title: '1962 Corran Wayfarer saloon',
      vehicle_kind: 'car',
      vehicle_make: 'Corran',
      vehicle_model: 'Wayfarer',
      vehicle_year: '1962',
      summary: 'A rounded little saloon, rescued from a hedge.',
    },
  });
  await db
    .insertInto('build_systems')
    .values({ build_id: build.id, key: 'brakes', name: 'Brakes', safety_critical: true, position: 0 })
    .execute();
  await createEpisode(db, { build_id: build.id, slug: 'first-look', title: 'First look under the hedge' });
  const e = await createEpisode(db, {
    build_id: build.id,
    slug: 'master-cylinder',
    title: 'Master cylinder swap',
    summary: 'A sinking pedal traced to a scored bore.',
    video_url: 'https://video.example.test/watch?v=corran-02',
    duration_seconds: 1500,
    minutes_worked: 210,
    write_up: JSON.stringify(writeUp),
    write_up_html: renderWriteUp(writeUp),
  });
  await db
    .insertInto('chapters')
    .values([
      { episode_id: e.id, position: 0, start_seconds: 0, title: 'Where we left off', system_key: null, notes: null },
      {
        episode_id: e.id,
        position: 1,
        start_seconds: 120,
        title: 'Pulling the master cylinder',
        system_key: 'brakes',
        notes: 'Two nuts and the pipes.',
      },
      { episode_id: e.id, position: 2, start_seconds: 600, title: 'Bleeding round the circuit', system_key: 'brakes', notes: null },
    ])
    .execute();
  // A parts line and a torque figure, so the episode page's parts table and figure cards are checked too.
  await db
    .insertInto('part_lines')
    .values({
      build_id: build.id,
      episode_id: e.id,
      position: 0,
      kind: 'part',
      description: 'Master cylinder, reconditioned',
      system_key: 'brakes',
      at_seconds: 130,
      source: 'reconditioned',
      status: 'fitted',
      quantity: '1',
      unit_price_minor: 4250,
      currency: 'EUR',
      tax_rate_bp: 2000,
    })
    .execute();
  await db
    .insertInto('figures')
    .values({
      episode_id: e.id,
      position: 0,
      fastener: 'Master cylinder nuts',
      thread: 'M10',
      grade_fitted: '8.8',
      grade_specified: '8.8',
      method: 'torque',
      value: 25,
      unit: 'N-m',
      source: 'workshop-manual',
      system_key: 'brakes',
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

describe('reading, as a visitor', () => {
  it('lands on the front page, opens an episode and follows a chapter to its moment', async () => {
    const page = await visit(tracked, `${app.baseUrl}/`);
    await page.getByRole('link', { name: 'Master cylinder swap' }).click();
    await page.waitForURL(/\/builds\/bryony-tallis\/corran-1962\/episodes\/master-cylinder$/);
    await visit(tracked, page.url());
    expect(await page.getByRole('heading', { level: 1 }).textContent()).toBe('Master cylinder swap');
    // Brakes are safety-critical: the caution bar sits under the title.
    await expect.poll(() => page.getByRole('note', { name: 'Safety-critical' }).count()).toBe(1);

    // The parts table and the figure, with the reader's unit toggle: 25 N·m ÷ 1.355 818 = 18.4 lbf·ft
    // (NIST SP 811 Appendix B factor, three significant figures).
    await page.getByRole('heading', { name: 'Parts in this episode' }).waitFor();
    expect(await page.getByText('Master cylinder, reconditioned').count()).toBe(1);
    const units = page.getByRole('group', { name: 'Unit for Master cylinder nuts' });
    await units.getByRole('button', { name: 'lbf·ft' }).click();
    await expect.poll(() => units.getByRole('button', { name: 'lbf·ft' }).getAttribute('aria-pressed')).toBe('true');
    await expect.poll(() => page.locator('li', { hasText: 'Master cylinder nuts' }).first().textContent()).toMatch(/18\.4\s*lbf·ft/);
    expect(await page.locator('li', { hasText: 'Master cylinder nuts' }).first().textContent()).toMatch(/Recorded as 25 N·m/);

    const rail = page.getByRole('navigation', { name: 'Chapters' });
    await rail.getByRole('link', { name: /Pulling the master cylinder/ }).click();
    // The address carries the moment, and that chapter becomes the active one.
    await page.waitForURL(/#at-120$/);
    await expect.poll(() => rail.getByRole('link', { name: /Pulling the master cylinder/ }).getAttribute('aria-current')).toBe('location');
    const watch = page.getByRole('link', { name: /Watch from 2:00/ });
    expect(await watch.getAttribute('href')).toBe('https://video.example.test/watch?v=corran-02&t=120');

    // A moment inside a chapter (a shared link) opens at the chapter that holds it.
    await page.goto(`${app.baseUrl}/builds/bryony-tallis/corran-1962/episodes/master-cylinder#at-700`, { waitUntil: 'networkidle' });
    await page.waitForSelector('html[data-hydrated="true"]');
    await expect.poll(() => rail.getByRole('link', { name: /Bleeding round the circuit/ }).getAttribute('aria-current')).toBe('location');
    expect(tracked.consoleErrors).toEqual([]);
  });

  it('searches from the header and finds the episode by a word of its write-up', async () => {
    const page = tracked.page;
    const box = page.getByRole('searchbox', { name: 'Search builds, episodes and chapters' });
    await box.fill('scored bore');
    await box.press('Enter');
    await page.waitForURL(/\/search\?q=scored\+bore/);
    const hit = page.getByRole('link', { name: 'Master cylinder swap' });
    await hit.waitFor();
    expect(await page.locator('mark').first().textContent()).toMatch(/scored|bore/i);
    await visit(tracked, page.url());
    await page.getByRole('link', { name: 'Master cylinder swap' }).click();
    await page.waitForURL(/episodes\/master-cylinder$/);
    expect(tracked.consoleErrors).toEqual([]);
  });

  it('build, builds directory and creator pages pass the accessibility and phone checks', async () => {
    const build = await visit(tracked, `${app.baseUrl}/builds/bryony-tallis/corran-1962`);
    expect(await build.getByRole('heading', { level: 1 }).textContent()).toBe('1962 Corran Wayfarer saloon');
    const directory = await visit(tracked, `${app.baseUrl}/builds`);
    await directory.getByLabel('Decade').selectOption('1960');
    await directory.getByRole('button', { name: 'Show builds' }).click();
    await directory.waitForURL(/decade=1960/);
    await directory.getByRole('link', { name: '1962 Corran Wayfarer saloon' }).waitFor();
    const creator = await visit(tracked, `${app.baseUrl}/creators/bryony-tallis`);
    expect(await creator.getByRole('heading', { level: 1 }).textContent()).toBe('Bryony Tallis');
    await visit(tracked, `${app.baseUrl}/search?q=${encodeURIComponent('"no such words at all')}`);
    expect(tracked.consoleErrors).toEqual([]);
    expectOnlyLoopback(tracked);
  });
});
