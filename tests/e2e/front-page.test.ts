import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { TEST_DIST_DIR } from '../setup/build-global';
import { createBuild, createEpisode, createUser } from '../helpers/factories';
import { expectOnlyLoopback, launchBrowser, openPage, visit, type TrackedPage } from '../helpers/browser';
import { startTestApp, type TestApp } from '../helpers/test-app';

let app: TestApp;
let browser: Browser;
let tracked: TrackedPage;
const title = 'Seized caliper freed with patience';

beforeAll(async () => {
  app = await startTestApp({ distDir: TEST_DIST_DIR });
  const owner = await createUser(app.deps.db, { handle: 'tamsin-roe', display_name: 'Tamsin Roe' });
  const build = await createBuild(app.deps.db, { owner_id: owner.id, title: '1974 Fenwick Minor hatchback', slug: 'fenwick-minor' });
  await createEpisode(app.deps.db, {
    build_id: build.id,
    title,
    slug: 'seized-caliper',
    summary: 'Front left caliper, a stuck piston and new seals.',
  });
  await createEpisode(app.deps.db, { build_id: build.id, title: 'Draft notes nobody should see', status: 'draft', published_at: null });
  browser = await launchBrowser();
});

afterAll(async () => {
  await tracked?.close();
  await browser?.close();
  await app?.stop();
});

describe('front page', () => {
  it('arrives rendered by the server: content is in the HTML without JavaScript', async () => {
    const res = await fetch(`${app.baseUrl}/`);
    expect(res.status).toBe(200);
    const html = await res.text();
    expect(html).toContain(title);
    expect(html).toContain('1974 Fenwick Minor hatchback');
    expect(html).not.toContain('Draft notes nobody should see');
    expect(html).toMatch(/<title>[^<]*Rivet &amp; Reel[^<]*<\/title>/);
    expect(html).toMatch(/<head>[\s\S]*<meta name="description" content="[^"]+"[\s\S]*<\/head>/);
    // Hydration data travels as JSON, never as an inline script.
    expect(html).toContain('<script type="application/json" id="rr-hydration">');
    expect(html).not.toMatch(/<script>(?!<\/script>)/);
  });

  it('hydrates in Chromium without console errors, fonts from our origin, nothing off loopback', async () => {
    tracked = await openPage(browser);
    const page = await visit(tracked, `${app.baseUrl}/`);
    expect(tracked.consoleErrors).toEqual([]);
    await expect(page.getByRole('link', { name: title })).toBeDefined();
    expect(await page.getByRole('heading', { level: 1 }).count()).toBe(1);
    expect(await page.title()).toContain('Rivet & Reel');
    // The server's <title> is reused on hydration, not duplicated.
    expect(await page.locator('head title').count()).toBe(1);

    const fonts = await page.evaluate(async () => {
      await document.fonts.ready;
      return {
        merriweather: document.fonts.check('700 27px Merriweather'),
        loaded: [...document.fonts].filter((f) => f.status === 'loaded').map((f) => f.family.replace(/"/g, '')),
      };
    });
    expect(fonts.merriweather).toBe(true);
    expect(fonts.loaded).toContain('Merriweather');
    const fontResponses = tracked.responses.filter((r) => /\.woff2?(\?|$)/.test(r.url));
    expect(fontResponses.length).toBeGreaterThan(0);
    for (const r of fontResponses) {
      expect(new URL(r.url).origin).toBe(app.baseUrl);
      expect(r.status).toBe(200);
    }
    expectOnlyLoopback(tracked);
  });

  it('serves hashed assets with long-cache headers', async () => {
    const html = await (await fetch(`${app.baseUrl}/`)).text();
    const asset = /src="(\/assets\/[^"]+\.js)"/.exec(html)?.[1];
    expect(asset).toBeDefined();
    const res = await fetch(`${app.baseUrl}${asset}`);
    expect(res.status).toBe(200);
    expect(res.headers.get('cache-control')).toMatch(/max-age=31536000/);
    expect(res.headers.get('cache-control')).toMatch(/immutable/);
  });

  it('answers an unknown page with a 404 page in the shell', async () => {
    const page = await visit(tracked, `${app.baseUrl}/no/such/page`, { status: 404 });
    expect(await page.getByRole('heading', { level: 1 }).textContent()).toBeTruthy();
    expect(await page.getByRole('link', { name: /front page|latest|home/i }).count()).toBeGreaterThan(0);
    // Chromium reports the document's own 404 status in the console; nothing else may appear.
    expect(tracked.consoleErrors.filter((e) => !/status of 404/.test(e))).toEqual([]);
  });
});
