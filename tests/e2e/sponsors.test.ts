import { readFile } from 'node:fs/promises';
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it, onTestFailed } from 'vitest';
import { createOwnedBuild } from '../helpers/accounts';
import {
  checkAccessibility,
  checkPhoneWidth,
  expectOnlyLoopback,
  launchBrowser,
  openPage,
  visit,
  type TrackedPage,
} from '../helpers/browser';
import { createEpisode, createUser } from '../helpers/factories';
import { signInByEmail, TestClient } from '../helpers/http-client';
import { addSponsorMember, createPartLine, createSponsor } from '../helpers/sponsors';
import { startTestApp, type TestApp } from '../helpers/test-app';
import { TEST_DIST_DIR } from '../setup/build-global';

// The sponsor's journey: a member signs in by e-mailed link, opens the summary from the account
// menu, filters to one build, follows a line to its moment in the episode, and exports the CSV.

let app: TestApp;
let browser: Browser;
let tracked: TrackedPage;

beforeAll(async () => {
  app = await startTestApp({ distDir: TEST_DIST_DIR });
  const db = app.deps.db;
  const sponsor = await createSponsor(db, { name: 'Sump & Seal', slug: 'sump-and-seal' });
  const member = await createUser(db, { handle: 'nell-ostrander', display_name: 'Nell Ostrander', email: 'nell@example.test' });
  await addSponsorMember(db, sponsor.id, member.id);
  const hatch = await createOwnedBuild(db, { build: { title: 'Kestrel hatch', slug: 'kestrel-hatch' } });
  const moto = await createOwnedBuild(db, { build: { title: 'Vantor two-stroke', slug: 'vantor-two-stroke' } });
  const ep = await createEpisode(db, {
    build_id: hatch.build.id,
    title: 'Front brakes',
    slug: 'front-brakes',
    published_at: new Date('2026-11-10T12:00:00Z'),
  });
  await db
    .insertInto('chapters')
    .values([
      { episode_id: ep.id, position: 0, start_seconds: 0, title: 'Up on stands' },
      { episode_id: ep.id, position: 1, start_seconds: 300, title: 'Calipers off' },
    ])
    .execute();
  const ep2 = await createEpisode(db, { build_id: moto.build.id, title: 'Carb clean', published_at: new Date('2026-11-12T12:00:00Z') });
  await createPartLine(db, {
    build_id: hatch.build.id,
    episode_id: ep.id,
    sponsor_id: sponsor.id,
    support_kind: 'gifted',
    description: 'Caliper seal kit',
    list_price_minor: 1440,
    at_seconds: 320,
  });
  await createPartLine(db, {
    build_id: hatch.build.id,
    episode_id: ep.id,
    sponsor_id: sponsor.id,
    support_kind: 'discounted',
    description: 'Front pads',
    list_price_minor: 2400,
    unit_price_minor: 1800,
  });
  await createPartLine(db, {
    build_id: moto.build.id,
    episode_id: ep2.id,
    sponsor_id: sponsor.id,
    support_kind: 'gifted',
    description: 'Float bowl gasket',
    list_price_minor: 350,
  });
  browser = await launchBrowser();
  tracked = await openPage(browser, { acceptDownloads: true });
});

afterAll(async () => {
  await tracked?.close();
  await browser?.close();
  await app?.stop();
});

describe('sponsor summary', () => {
  it('signs in, filters to one build, follows a line to its moment and exports the CSV', async () => {
    onTestFailed(async () => {
      await tracked.page.screenshot({ path: '.data/screenshots/sponsors-failure.png', fullPage: true });
    });
    let page = await visit(tracked, `${app.baseUrl}/sign-in?returnTo=%2F`);
    await page.getByRole('textbox', { name: 'E-mail address' }).fill('nell@example.test');
    await page.getByRole('button', { name: /send|e-mail me|link/i }).click();
    await page.getByText(/check your inbox/i).waitFor();
    await app.runJobs();
    const mail = app.smtp.messages().find((m) => m.to.includes('nell@example.test'));
    const link = /(http:\/\/\S+\/sign-in\/link#token=[\w-]+)/.exec(mail?.text ?? '')?.[1];
    expect(link).toBeDefined();
    page = await visit(tracked, link!);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL(`${app.baseUrl}/`);

    // From the account menu to the summary.
    await page.getByRole('button', { name: /Nell Ostrander/ }).click();
    await page.getByRole('link', { name: 'Sponsor summary' }).click();
    await page.waitForURL(`${app.baseUrl}/sponsors/sump-and-seal`);
    page = await visit(tracked, `${app.baseUrl}/sponsors/sump-and-seal`);
    await page.getByText('3 lines; page 1 of 1.').waitFor();
    // Two currencies would be two cards; here all is EUR: 14.40 + 6.00 + 3.50 = €23.90 given.
    await page.getByText('€23.90').first().waitFor();

    // Filter to one build: the URL holds the filter, the table shows that build's lines only.
    await page.getByRole('combobox', { name: 'Build' }).selectOption({ label: 'Kestrel hatch' });
    await page.getByRole('button', { name: 'Filter' }).click();
    await page.waitForURL(/build=\d+/);
    await page.getByText('2 lines; page 1 of 1.').waitFor();
    const table = page.getByRole('region', { name: 'Supported part lines' });
    expect(await table.getByText('Float bowl gasket').count()).toBe(0);
    await checkAccessibility(page);
    await checkPhoneWidth(page);
    const filteredUrl = page.url();

    // The CSV of the filter: the same two lines.
    const download = page.waitForEvent('download');
    await page.getByRole('link', { name: 'Export CSV' }).click();
    const csv = await readFile(await (await download).path(), 'utf8');
    const rows = csv.trim().split(/\r?\n/);
    expect(rows[0]).toBe(
      'published_on,build,episode_number,episode,chapter,at,moment_url,description,quantity,currency,list_price,price_paid,value_given,support,status',
    );
    expect(rows).toHaveLength(3);
    expect(csv).toContain('Caliper seal kit');
    expect(csv).toContain('Front pads');
    expect(csv).not.toContain('Float bowl gasket');
    expect(csv).toContain('#at-320');

    // Straight to the moment in the episode.
    await table.getByRole('link', { name: /Front brakes at 5:20/ }).click();
    await page.waitForURL(/\/episodes\/front-brakes#at-320$/);
    await page.getByRole('heading', { level: 1, name: 'Front brakes' }).waitFor();
    await page.getByText('Calipers off').first().waitFor();
    // Reached by a link inside the app (same document): the checks visit() runs, run here.
    await checkAccessibility(page);
    await checkPhoneWidth(page);

    // Back on the summary, the filter is still in the address.
    page = await visit(tracked, filteredUrl);
    await page.getByText('2 lines; page 1 of 1.').waitFor();
    expect(tracked.consoleErrors).toEqual([]);
    expectOnlyLoopback(tracked);
  });

  it('admin screens: add an organisation, link a supplier, invite a member, confirm before removing', async () => {
    const db = app.deps.db;
    await createUser(db, { handle: 'ada-admin', display_name: 'Ada Admin', email: 'ada@example.test', is_admin: true });
    await db.insertInto('suppliers').values({ name: 'Harwick Lane Spares', website: null, created_by: null }).execute();
    const client = new TestClient(app.baseUrl);
    await signInByEmail(client, db, 'ada@example.test');
    const admin = await openPage(browser, { signedIn: { cookie: client.cookie!, url: app.baseUrl } });
    try {
      let page = await visit(admin, `${app.baseUrl}/admin/sponsors`);
      await page.getByRole('textbox', { name: 'Name' }).fill('Gauge & Dial');
      await page.getByRole('textbox', { name: /Address slug/ }).fill('gauge-and-dial');
      await page.getByRole('button', { name: 'Add organisation' }).click();
      await page.getByRole('link', { name: 'Gauge & Dial' }).click();
      await page.waitForURL(/\/admin\/sponsors\/\d+$/);
      page = await visit(admin, page.url());
      await page.getByRole('searchbox', { name: 'Find a supplier to link' }).fill('Harwick');
      await page.getByRole('button', { name: 'Link Harwick Lane Spares to Gauge & Dial' }).click();
      await page.getByRole('button', { name: 'Unlink Harwick Lane Spares' }).waitFor();
      await page.getByRole('textbox', { name: 'Invite a member by e-mail' }).fill('new-member@example.test');
      await page.getByRole('button', { name: 'Send invitation' }).click();
      await page.getByText('Invitation sent to new-member@example.test.').waitFor();
      // Removing asks first; cancelling keeps the link.
      await page.getByRole('button', { name: 'Unlink Harwick Lane Spares' }).click();
      const dialog = page.getByRole('dialog', { name: /Unlink Harwick Lane Spares/ });
      await dialog.waitFor();
      await checkAccessibility(page);
      await dialog.getByRole('button', { name: 'Keep it' }).click();
      expect(await db.selectFrom('sponsor_suppliers').selectAll().execute()).toHaveLength(1);
      await page.getByRole('button', { name: 'Unlink Harwick Lane Spares' }).click();
      await dialog.getByRole('button', { name: 'Unlink supplier' }).click();
      await page.getByText('No linked suppliers.').waitFor();
      expect(await db.selectFrom('sponsor_suppliers').selectAll().execute()).toHaveLength(0);
      await checkAccessibility(page);
      await checkPhoneWidth(page);
      expect(admin.consoleErrors).toEqual([]);
    } finally {
      await admin.close();
    }
  });
});
