import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createUser } from '../helpers/factories';
import { expectOnlyLoopback, launchBrowser, openPage, visit, type TrackedPage } from '../helpers/browser';
import { signInByEmail, TestClient } from '../helpers/http-client';
import { startTestApp, type TestApp } from '../helpers/test-app';
import { TEST_DIST_DIR } from '../setup/build-global';

let app: TestApp;
let browser: Browser;
let context: BrowserContext;
let tracked: TrackedPage;
let client: TestClient;

beforeAll(async () => {
  app = await startTestApp({ distDir: TEST_DIST_DIR });
  await createUser(app.deps.db, { handle: 'lena-marsh', display_name: 'Lena Marsh', email: 'lena@example.test' });
  client = new TestClient(app.baseUrl);
  await signInByEmail(client, app.deps.db, 'lena@example.test');
  browser = await launchBrowser();
  tracked = await openPage(browser, { signedIn: { cookie: client.cookie!, url: app.baseUrl } });
  context = tracked.context;
});

afterAll(async () => {
  await tracked?.close();
  await browser?.close();
  await app?.stop();
});

async function saved(page: Page) {
  await page
    .getByRole('status')
    .filter({ hasText: /^Saved$/ })
    .first()
    .waitFor({ timeout: 15_000 });
}

async function storedText(episodeId: number): Promise<string> {
  const row = await app.deps.db.selectFrom('episodes').select('write_up').where('id', '=', episodeId).executeTakeFirstOrThrow();
  return JSON.stringify(row.write_up);
}

describe('writing an episode', () => {
  it('writes an episode with three chapters, survives going offline, publishes, and the Workbench shows it', async () => {
    const build = await client.post('/api/builds', {
      title: '1974 Brisbane Wren coupe',
      vehicleKind: 'car',
      currency: 'EUR',
      visibility: 'public',
    });
    expect(build.status).toBe(201);
    const episode = await client.post(`/api/builds/${build.body.id}/episodes`, { title: 'Rear brakes and a stuck handbrake' });
    expect(episode.status).toBe(201);
    const id = episode.body.id as number;

    const page = await visit(tracked, `${app.baseUrl}/workbench/episodes/${id}/edit`);
    // Two chapters from a pasted block, one typed in by hand.
    await page.getByRole('button', { name: 'Paste a block' }).click();
    await page.getByLabel('Chapters block').fill('0:00 Up on stands\n1:30 Drums off');
    await page.getByRole('button', { name: 'Add these chapters' }).click();
    await page.getByRole('button', { name: 'Add a chapter' }).click();
    await page.getByLabel('Start of chapter 3').fill('4:10');
    await page.getByLabel('Title of chapter 3').fill('Freeing the handbrake cable');

    const writeUp = page.locator('.ProseMirror');
    await writeUp.click();
    await page.keyboard.type('Car on axle stands on level ground before anything else. ');
    await saved(page);
    expect(await storedText(id)).toContain('axle stands');
    const chapters = await app.deps.db
      .selectFrom('chapters')
      .select(['start_seconds', 'title'])
      .where('episode_id', '=', id)
      .orderBy('position')
      .execute();
    expect(chapters.map((c) => c.start_seconds)).toEqual([0, 90, 250]);

    await context.setOffline(true);
    await writeUp.click();
    await page.keyboard.press('End');
    await page.keyboard.type('Typed while the garage wifi was down.');
    await page
      .getByRole('status')
      .filter({ hasText: /Offline/ })
      .first()
      .waitFor({ timeout: 15_000 });
    expect(await storedText(id)).not.toContain('wifi was down');
    await context.setOffline(false);
    await saved(page);
    expect(await storedText(id)).toContain('Typed while the garage wifi was down.');

    await page.getByRole('button', { name: 'Publish now' }).click();
    await page.getByText(/Published\. Readers can see it now\./).waitFor();
    const row = await app.deps.db.selectFrom('episodes').select(['status']).where('id', '=', id).executeTakeFirstOrThrow();
    expect(row.status).toBe('published');

    const bench = await visit(tracked, `${app.baseUrl}/workbench`);
    await bench.getByText('1974 Brisbane Wren coupe').first().waitFor();
    expect(tracked.consoleErrors.filter((e) => !/ERR_INTERNET_DISCONNECTED|Failed to fetch|Failed to load resource/.test(e))).toEqual([]);
    expectOnlyLoopback(tracked);
  });
});
