// The followers' posts load in a chunk of their own (src/features/posts/components/lazy-episode-posts.tsx).
// The server's HTML still carries them, and hydration keeps that HTML, unchanged and in place, while the
// chunk is late; once it arrives the section works. This suite holds the chunk back with page.route, so
// it opens pages itself instead of through visit() (which waits for the network to go quiet); the
// other suites visit the same page with visit().
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { renderWriteUp } from '../../server/services/write-up-html';
import type { WriteUpDoc } from '../../src/shared/write-up';
import { createOwnedBuild } from '../helpers/accounts';
import { launchBrowser, openPage } from '../helpers/browser';
import { createEpisode, createUser } from '../helpers/factories';
import { signInByEmail, TestClient } from '../helpers/http-client';
import { startTestApp, type TestApp } from '../helpers/test-app';
import { TEST_DIST_DIR } from '../setup/build-global';

let app: TestApp;
let browser: Browser;
const BUILD = '/builds/hedda-vorn/tarrow-1968';
const EPISODE = `${BUILD}/episodes/caliper-day`;
const POSTS = 'section[aria-labelledby="posts-heading"]';

const writeUp: WriteUpDoc = {
  type: 'doc',
  content: [{ type: 'paragraph', content: [{ type: 'text', text: 'Both front calipers off and apart.' }] }],
};

async function cookieOf(email: string): Promise<string> {
  const client = new TestClient(app.baseUrl);
  await signInByEmail(client, app.deps.db, email);
  return client.cookie!;
}

beforeAll(async () => {
  app = await startTestApp({ distDir: TEST_DIST_DIR });
  const db = app.deps.db;
  const { build } = await createOwnedBuild(db, {
    owner: { handle: 'hedda-vorn', display_name: 'Hedda Vorn', email: 'hedda@example.test' },
    build: { slug: 'tarrow-1968', title: '1968 Tarrow Lark estate', vehicle_kind: 'car', vehicle_make: 'Tarrow', vehicle_year: '1968' },
  });
  const reader = await createUser(db, { handle: 'tobin-quarry', display_name: 'Tobin Quarry', email: 'tobin@example.test' });
  const e = await createEpisode(db, {
    build_id: build.id,
    slug: 'caliper-day',
    title: 'Caliper day',
    duration_seconds: 900,
    write_up: JSON.stringify(writeUp),
    write_up_html: renderWriteUp(writeUp),
  });
  await db
    .insertInto('chapters')
    .values([
      { episode_id: e.id, position: 0, start_seconds: 0, title: 'On the stands' },
      { episode_id: e.id, position: 1, start_seconds: 120, title: 'Caliper off' },
    ])
    .execute();
  await db
    .insertInto('posts')
    .values({
      episode_id: e.id,
      build_id: build.id,
      author_id: reader.id,
      kind: 'question',
      state: 'open',
      chapter_start_seconds: 120,
      body: 'Which seal kit? Mine came from https://parts.example.test/kit and fitted well.',
    })
    .execute();
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
  await app?.stop();
});

describe('the lazily loaded posts section', () => {
  for (const who of ['visitor', 'tobin@example.test', 'hedda@example.test']) {
    it(`is in the server's HTML and stays put until its chunk hydrates it (${who})`, async () => {
      const tracked = await openPage(browser, who === 'visitor' ? {} : { signedIn: { cookie: await cookieOf(who), url: app.baseUrl } });
      const { page } = tracked;
      let release!: () => void;
      const late = new Promise<void>((resolve) => (release = resolve));
      let chunkAsked = false;
      await page.route(/\/assets\/episode-posts-[^/]*\.js$/, async (route) => {
        chunkAsked = true;
        await late;
        await route.continue();
      });

      const res = await page.goto(`${app.baseUrl}${EPISODE}`, { waitUntil: 'domcontentloaded' });
      const html = await res!.text();
      expect(html).toContain('Which seal kit?');
      expect(html).toContain('href="https://parts.example.test/kit"');
      await page.waitForSelector('html[data-hydrated="true"]', { timeout: 10_000 });
      await expect.poll(() => chunkAsked).toBe(true);

      // Hydrated, the chunk still held back: the server's section, not the fallback.
      const section = page.locator(POSTS);
      const box = await section.boundingBox();
      expect(await page.getByText('Loading posts…').count()).toBe(0);
      expect(await section.innerHTML()).toContain('Which seal kit?');
      // React's ids from the server (`_R_…`); a section rendered afresh in the browser would get `_r_…` ones.
      const serverIds = await section.locator('[id^="_R_"]').evaluateAll((els) => els.map((e) => e.id));

      release();
      await page.waitForLoadState('networkidle');
      expect(await section.boundingBox()).toEqual(box);
      // The kind filter answers once the section has hydrated.
      await section.locator('select').first().selectOption('suggestion');
      await section.getByText('No posts match these filters.').waitFor();
      await section.locator('select').first().selectOption('');
      await section.getByText('Which seal kit?').waitFor();
      // The form was hydrated, not rendered again: it keeps the server's ids.
      const formIds = serverIds.filter((id) => id.endsWith('-body') || id.endsWith('-h'));
      if (who !== 'visitor') expect(formIds.length).toBeGreaterThan(0);
      for (const id of formIds) expect(await page.locator(`[id="${id}"]`).count(), id).toBe(1);
      expect(tracked.consoleErrors).toEqual([]);
      await tracked.close();
    });
  }

  it('renders on a navigation inside the app', async () => {
    const tracked = await openPage(browser);
    const { page } = tracked;
    await page.goto(`${app.baseUrl}${BUILD}`, { waitUntil: 'networkidle' });
    await page.waitForSelector('html[data-hydrated="true"]');
    await page
      .getByRole('link', { name: /Caliper day/ })
      .first()
      .click();
    await page.waitForURL(`${app.baseUrl}${EPISODE}`);
    await page.locator(POSTS).getByText('Which seal kit?').waitFor();
    expect(tracked.consoleErrors).toEqual([]);
    await tracked.close();
  });
});
