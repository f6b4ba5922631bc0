import { readFile } from 'node:fs/promises';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it, onTestFailed } from 'vitest';
import { createUser } from '../helpers/factories';
import {
  checkAccessibility,
  checkPhoneWidth,
  expectOnlyLoopback,
  launchBrowser,
  openPage,
  visit,
  type TrackedPage,
} from '../helpers/browser';
import { signInByEmail, TestClient } from '../helpers/http-client';
import { startTestApp, type TestApp } from '../helpers/test-app';
import { TEST_DIST_DIR } from '../setup/build-global';

// The parts journey: a creator types five part lines with the keyboard alone, sees the episode's
// totals and then the build's on the ledger page, and exports the ledger as CSV.

const CSV_HEADER =
  'episode,kind,description,part_number,supplier,system,at,source,status,quantity,unit,unit_price,currency,tax_rate,tax_included,fx_rate,avoided_cost,buy_url,affiliate,support,sponsor,list_price';

let app: TestApp;
let browser: Browser;
let tracked: TrackedPage;
let client: TestClient;

beforeAll(async () => {
  app = await startTestApp({ distDir: TEST_DIST_DIR });
  await createUser(app.deps.db, { handle: 'tova-rudd', display_name: 'Tova Rudd', email: 'tova@example.test' });
  client = new TestClient(app.baseUrl);
  await signInByEmail(client, app.deps.db, 'tova@example.test');
  browser = await launchBrowser();
  tracked = await openPage(browser, { signedIn: { cookie: client.cookie!, url: app.baseUrl }, acceptDownloads: true });
});

afterAll(async () => {
  await tracked?.close();
  await browser?.close();
  await app?.stop();
});

interface Line {
  description: string;
  supplier?: string;
  quantity: string;
  price: string;
  tax?: string;
  /** Presses of ArrowUp on the status select (arrived → on order is one). */
  statusUp?: number;
}

/**
 * Types one line from the description cell with the keyboard only. Tab order of the new row:
 * description, kind, part number, supplier, system, chapter, source, status, quantity, unit,
 * unit price, currency, tax %.
 */
async function typeLine(page: Page, line: Line) {
  const k = page.keyboard;
  await k.type(line.description);
  await k.press('Tab'); // kind
  await k.press('Tab'); // part number
  await k.press('Tab'); // supplier
  if (line.supplier) {
    await k.type(line.supplier);
    await page.getByRole('option', { name: `Create supplier “${line.supplier}”` }).waitFor({ timeout: 10_000 });
    await k.press('Enter');
    await page
      .getByRole('combobox', { name: 'Supplier' })
      .and(page.locator(`[value="${line.supplier}"]`))
      .waitFor({ timeout: 10_000 });
  }
  await k.press('Tab'); // system
  await k.type('Brakes');
  await k.press('Tab'); // chapter
  await k.press('Tab'); // source
  await k.press('Tab'); // status
  for (let i = 0; i < (line.statusUp ?? 0); i++) await k.press('ArrowUp');
  await k.press('Tab'); // quantity (its text is selected on Tab, so typing replaces it)
  await k.type(line.quantity);
  await k.press('Tab'); // unit
  await k.press('Tab'); // unit price
  await k.type(line.price);
  if (line.tax) {
    await k.press('Tab'); // currency
    await k.press('Tab'); // tax %
    await k.type(line.tax);
  }
  await k.press('Enter');
  await page
    .getByRole('table', { name: 'Part lines of this episode' })
    .getByText(line.description, { exact: true })
    .waitFor({ timeout: 10_000 });
  await page.waitForFunction(
    () => document.activeElement?.getAttribute('aria-label') === null && (document.activeElement as HTMLInputElement | null)?.value === '',
    undefined,
    { timeout: 10_000 },
  );
}

/** A figure of a totals strip: the ledger's spend summary, or the totals of a set of lines (episode, filter). */
async function figure(page: Page, strip: 'summary' | 'lines', label: string): Promise<string> {
  const dl = page.locator(strip === 'lines' ? 'dl[aria-labelledby]' : 'dl:not([aria-labelledby])').first();
  const cell = dl.locator('div').filter({ has: page.locator('dt', { hasText: new RegExp(`^${label}$`) }) });
  return (await cell.locator('dd').first().textContent()) ?? '';
}

describe('parts', () => {
  it('enters five lines from the keyboard, sees episode and build totals, and exports the ledger', async () => {
    onTestFailed(async () => {
      await tracked.page.screenshot({ path: '.data/screenshots/parts-failure.png', fullPage: true });
    });
    const build = await client.post('/api/builds', {
      title: '1977 Kestrel hatch, brakes first',
      vehicleKind: 'car',
      currency: 'EUR',
      budgetMinor: 150000,
      visibility: 'public',
    });
    expect(build.status).toBe(201);
    const buildId = build.body.id as number;
    const episode = await client.post(`/api/builds/${buildId}/episodes`, { title: 'Front brakes, all round' });
    expect(episode.status).toBe(201);
    const id = episode.body.id as number;
    const chapters = await client.patch(`/api/episodes/${id}`, {
      version: episode.body.version,
      chapters: [
        { startSeconds: 0, title: 'Up on stands', systemKey: null, notes: null },
        { startSeconds: 95, title: 'Calipers off', systemKey: 'brakes', notes: null },
      ],
    });
    expect(chapters.status).toBe(200);

    // The ledger before any line: nothing spent.
    let ledger = await visit(tracked, `${app.baseUrl}/workbench/builds/${buildId}/ledger`);
    await ledger.getByText('No part lines yet.').waitFor({ timeout: 10_000 });
    expect(await figure(ledger, 'summary', 'Spent')).toBe('€0.00');

    const page = await visit(tracked, `${app.baseUrl}/workbench/episodes/${id}/edit`);
    const newRow = page.getByRole('form', { name: 'New part line' });
    await newRow.getByLabel('Description').focus();
    await typeLine(page, {
      description: 'Brake fluid DOT 4, 500 ml',
      supplier: 'Harwick Lane Spares',
      quantity: '2',
      price: '6.90',
      tax: '20',
    });
    await typeLine(page, { description: 'Caliper seal kit, 38 mm', quantity: '1', price: '14.40' });
    await typeLine(page, { description: 'Bolts M10 x 1.25 x 30, class 8.8', supplier: 'Ostry Fasteners', quantity: '4', price: '2.60' });
    await typeLine(page, { description: 'Brake pipe union', quantity: '1', price: '3.25' });
    await typeLine(page, { description: 'Front pads, sintered', quantity: '1', price: '18.50', statusUp: 1 });

    const rows = await app.deps.db
      .selectFrom('part_lines')
      .select(['description', 'unit_price_minor', 'tax_rate_bp', 'status', 'at_seconds', 'system_key'])
      .where('episode_id', '=', id)
      .orderBy('position')
      .execute();
    expect(rows.map((r) => r.description)).toEqual([
      'Brake fluid DOT 4, 500 ml',
      'Caliper seal kit, 38 mm',
      'Bolts M10 x 1.25 x 30, class 8.8',
      'Brake pipe union',
      'Front pads, sintered',
    ]);
    expect(rows.map((r) => r.unit_price_minor)).toEqual([690, 1440, 260, 325, 1850]);
    expect(rows.every((r) => r.tax_rate_bp === 2000 && r.system_key === 'brakes')).toBe(true);
    expect(rows.at(-1)!.status).toBe('on-order');

    // The episode's totals on screen agree with the server's SQL totals.
    const server = await client.get(`/api/episodes/${id}/part-lines`);
    expect(server.body.totals.spent.grossMinor).toBe(4185);
    expect(server.body.totals.committedMinor).toBe(1850);
    await page.waitForFunction(() => document.body.innerText.includes('€41.85'));
    expect(await figure(page, 'lines', 'Spent')).toBe('€41.85');
    expect(await figure(page, 'lines', 'Tax')).toBe(`€${(server.body.totals.spent.taxMinor / 100).toFixed(2)}`);
    expect(await figure(page, 'lines', 'On order')).toBe('€18.50');
    await checkAccessibility(page);
    await checkPhoneWidth(page);

    // The ledger now: the build's totals, five lines, a filter in the URL, and the CSV.
    ledger = await visit(tracked, `${app.baseUrl}/workbench/builds/${buildId}/ledger`);
    expect(await figure(ledger, 'summary', 'Spent')).toBe('€41.85');
    expect(await figure(ledger, 'summary', 'On order')).toBe('€18.50');
    await ledger.getByText('5 lines; page 1 of 1.').waitFor({ timeout: 10_000 });
    ledger = await visit(tracked, `${app.baseUrl}/workbench/builds/${buildId}/ledger?status=on-order&sort=gross&dir=desc`);
    await ledger.getByText('One line matches the filter; page 1 of 1.').waitFor({ timeout: 10_000 });
    expect(await figure(ledger, 'lines', 'On order')).toBe('€18.50');
    expect(await figure(ledger, 'lines', 'Spent')).toBe('€0.00');
    const download = ledger.waitForEvent('download');
    await ledger.getByRole('link', { name: 'Export CSV' }).click();
    const file = await (await download).path();
    const csv = await readFile(file, 'utf8');
    expect(csv.replace(/^\uFEFF/, '').split(/\r?\n/)[0]).toBe(CSV_HEADER);
    expect(csv).toContain('Front pads, sintered');

    expect(tracked.consoleErrors).toEqual([]);
    expectOnlyLoopback(tracked);
  }, 180_000);
});
