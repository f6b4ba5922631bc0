import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createUser } from '../helpers/factories';
import { expectOnlyLoopback, launchBrowser, openPage, visit, type TrackedPage } from '../helpers/browser';
import { signInByEmail, TestClient } from '../helpers/http-client';
import { startTestApp, type TestApp } from '../helpers/test-app';
import { TEST_DIST_DIR } from '../setup/build-global';

let app: TestApp;
let browser: Browser;
let creator: TrackedPage;
let reader: TrackedPage;
let client: TestClient;

beforeAll(async () => {
  app = await startTestApp({ distDir: TEST_DIST_DIR });
  await createUser(app.deps.db, { handle: 'ida-penrose', display_name: 'Ida Penrose', email: 'ida@example.test' });
  client = new TestClient(app.baseUrl);
  await signInByEmail(client, app.deps.db, 'ida@example.test');
  browser = await launchBrowser();
  creator = await openPage(browser, { signedIn: { cookie: client.cookie!, url: app.baseUrl } });
});

afterAll(async () => {
  await creator?.close();
  await reader?.close();
  await browser?.close();
  await app?.stop();
});

/** Presses Tab until the focused element has this accessible label; fails after 40 presses. */
async function tabTo(page: Page, label: string) {
  for (let i = 0; i < 40; i += 1) {
    await page.keyboard.press('Tab');
    const here = await page.evaluate(() => {
      const el = document.activeElement as HTMLElement | null;
      const id = el?.id;
      return id ? (document.querySelector(`label[for="${CSS.escape(id)}"]`)?.textContent ?? '') : '';
    });
    if (here.trim() === label) return;
  }
  throw new Error(`Tab never reached “${label}”`);
}

describe('figures', () => {
  it('a creator adds a figure with a weaker substitute and sees the warning', async () => {
    const build = await client.post('/api/builds', {
      title: '1969 Corran Ferret van',
      vehicleKind: 'car',
      currency: 'GBP',
      visibility: 'public',
    });
    expect(build.status).toBe(201);
    const episode = await client.post(`/api/builds/${build.body.id}/episodes`, { title: 'Thermostat housing' });
    expect(episode.status).toBe(201);

    const page = await visit(creator, `${app.baseUrl}/workbench/episodes/${episode.body.id}/edit`);
    const form = page.getByRole('form', { name: 'Add a figure' });
    await form.getByLabel('Fastener').fill('Thermostat housing bolts');
    await form.getByLabel('Thread').selectOption('M8');
    await form.getByLabel('Vehicle system').selectOption('cooling');
    await form.getByLabel('Grade fitted').selectOption('A2-70');
    await form.getByLabel('Grade specified').selectOption('8.8');
    await form.getByLabel('Torque', { exact: true }).fill('18');
    await form.getByLabel('From', { exact: true }).fill('15');
    await form.getByLabel('To', { exact: true }).fill('80');
    await form.getByLabel('Wrench unit').selectOption('lbf-ft');
    // The warnings show while typing, before anything is saved.
    await form.getByText('Weaker than specified').waitFor();
    await form.getByText('Below wrench range').waitFor();
    await form.getByRole('button', { name: 'Add figure' }).click();

    const saved = page.getByRole('listitem').filter({ hasText: 'Thermostat housing bolts' });
    await saved.getByText('Weaker than specified').waitFor();
    await expect(saved.getByText(/Stainless A2-70 is weaker than the Class 8\.8 specified/).count()).resolves.toBe(1);
    await saved.getByText(/tightening by feel is not a measured torque/).waitFor();
    const rows = await app.deps.db.selectFrom('figures').select(['grade_fitted', 'value', 'unit', 'wrench_unit']).execute();
    expect(rows).toEqual([{ grade_fitted: 'A2-70', value: '18', unit: 'N-m', wrench_unit: 'lbf-ft' }]);
    // A cooling-system figure makes the episode show its caution.
    await page
      .getByRole('region', { name: 'Safety caution' })
      .getByText(/This episode touches the cooling system/)
      .waitFor();
    await page.screenshot({ path: '.data/screenshots/editor-figures-desktop.png', fullPage: true });
    expect(creator.consoleErrors).toEqual([]);
    expectOnlyLoopback(creator);
  });

  it('the calculators page is server-rendered and works from the keyboard', async () => {
    const html = await (await fetch(`${app.baseUrl}/workshop`)).text();
    expect(html).toContain('Workshop calculators');
    expect(html).toContain('Torque unit converter');
    expect(html).toContain('Estimate — not a specification');

    reader = await openPage(browser);
    const page = await visit(reader, `${app.baseUrl}/workshop`);
    await page.locator('body').click({ position: { x: 5, y: 5 } });

    await tabTo(page, 'Torque');
    await page.keyboard.press('Control+A');
    await page.keyboard.type('40');
    await tabTo(page, 'Unit');
    await page.keyboard.press('ArrowDown'); // N·m → lbf·ft
    const converter = page.getByRole('region', { name: 'Torque unit converter: result' });
    // 40 lbf·ft × 1.355 818 = 54.2 N·m (NIST SP 811 Appendix B).
    await converter.getByText('54.2', { exact: true }).waitFor();

    await tabTo(page, 'Spanner size');
    await page.keyboard.press('Control+A');
    await page.keyboard.type('19');
    const spanner = page.getByRole('region', { name: 'Which bolt does this spanner fit?: result' });
    // 19 mm: M12 in older DIN and the JIS annex, M14 in JIS small hex (REFERENCES.md).
    await spanner.getByText('M12', { exact: true }).waitFor();
    await spanner.getByText('M14', { exact: true }).waitFor();
    await page.keyboard.press('Control+A');
    await page.keyboard.type('15');
    await spanner.getByText(/matches no standard bolt head/).waitFor();

    await tabTo(page, 'Thread');
    await page.keyboard.press('ArrowUp'); // M10 → M8, the coarse thread before it
    const lookup = page.getByRole('region', { name: 'Thread look-up: result' });
    // M8 coarse: 1.25 mm pitch (ISO 261/262); 13 mm in ISO 272, 12 mm JIS small hex; 8.8 proof load 21 200 N (ISO 898-1).
    await lookup.getByText('1.25 mm pitch').waitFor();
    await lookup.getByText('12 mm', { exact: true }).waitFor();
    await lookup.getByText('21,200 N').waitFor();
    const estimate = page.getByRole('region', { name: 'Tightening-torque estimate: result' });
    await estimate.getByText('Estimate — not a specification').waitFor();
    expect(reader.consoleErrors).toEqual([]);
    expectOnlyLoopback(reader);
  });
});
