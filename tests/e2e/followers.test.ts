// A follower asks on chapter 2 at a moment inside it; the build team answers from the inbox by
// keyboard and marks it answered; the follower sees the reply and gets the e-mail. Every page goes
// through visit(): hydration, screenshots at 1280 and 375 px, axe and phone width.
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { renderWriteUp } from '../../server/services/write-up-html';
import type { WriteUpDoc } from '../../src/shared/write-up';
import { createOwnedBuild } from '../helpers/accounts';
import { expectOnlyLoopback, launchBrowser, visit, type TrackedPage } from '../helpers/browser';
import { createEpisode, createUser } from '../helpers/factories';
import { signInByEmail, TestClient } from '../helpers/http-client';
import { startTestApp, type TestApp } from '../helpers/test-app';
import { TEST_DIST_DIR } from '../setup/build-global';

let app: TestApp;
let browser: Browser;
let follower: TrackedPage;
let owner: TrackedPage;
const EPISODE = '/builds/hedda-vorn/tarrow-1968/episodes/caliper-day';

const writeUp: WriteUpDoc = {
  type: 'doc',
  content: [{ type: 'paragraph', content: [{ type: 'text', text: 'Both front calipers off and apart.' }] }],
};

/** A tracked page signed in as the account with this address. */
async function signedInPage(email: string): Promise<TrackedPage> {
  const client = new TestClient(app.baseUrl);
  await signInByEmail(client, app.deps.db, email);
  const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
  const [name, value] = client.cookie!.split('=') as [string, string];
  await context.addCookies([{ name, value, url: app.baseUrl }]);
  const page = await context.newPage();
  const tracked: TrackedPage = { page, context, consoleErrors: [], requests: [], responses: [], close: () => context.close() };
  page.on('console', (m) => void (m.type() === 'error' && tracked.consoleErrors.push(m.text())));
  page.on('pageerror', (e) => tracked.consoleErrors.push(e.message));
  page.on('request', (r) => tracked.requests.push({ url: r.url(), resourceType: r.resourceType() }));
  return tracked;
}

beforeAll(async () => {
  app = await startTestApp({ distDir: TEST_DIST_DIR });
  const db = app.deps.db;
  const { build } = await createOwnedBuild(db, {
    owner: { handle: 'hedda-vorn', display_name: 'Hedda Vorn', email: 'hedda@example.test' },
    build: { slug: 'tarrow-1968', title: '1968 Tarrow Lark estate', vehicle_kind: 'car', vehicle_make: 'Tarrow', vehicle_year: '1968' },
  });
  const reader = await createUser(db, { handle: 'tobin-quarry', display_name: 'Tobin Quarry', email: 'tobin@example.test' });
  await db.insertInto('follows').values({ user_id: reader.id, build_id: build.id }).execute();
  await createUser(db, { handle: 'mod-ines', display_name: 'Ines Moderator', email: 'ines@example.test', is_admin: true });
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
      { episode_id: e.id, position: 2, start_seconds: 400, title: 'Bleeding' },
    ])
    .execute();
  browser = await launchBrowser();
  follower = await signedInPage('tobin@example.test');
  owner = await signedInPage('hedda@example.test');
});

afterAll(async () => {
  await follower?.close();
  await owner?.close();
  await browser?.close();
  await app?.stop();
});

describe('followers', () => {
  it('a follower asks on chapter 2 at a moment; the team answers from the inbox by keyboard; the follower sees it and gets the e-mail', async () => {
    const page = await visit(follower, `${app.baseUrl}${EPISODE}`);
    const form = page.getByRole('form', { name: 'Ask or suggest' });
    await form.getByLabel('Chapter').selectOption({ label: '2:00 Caliper off' });
    await form.getByLabel(/Moment/).fill('2:30');
    await form.getByLabel('Your question').fill('How did you stop the piston twisting? See https://example.test/notes');
    await form.getByRole('button', { name: 'Post question' }).click();
    await page.getByRole('status').filter({ hasText: 'Posted.' }).waitFor();
    const group = page.getByRole('region', { name: 'Posts on Caliper off' });
    await group.getByText('How did you stop the piston twisting?').waitFor();
    expect(await group.getByRole('link', { name: 'At 2:30 in the video' }).getAttribute('href')).toBe('#at-150');
    expect(await group.getByRole('link', { name: 'https://example.test/notes' }).getAttribute('rel')).toContain('nofollow');
    // The chapter rail counts it.
    await expect.poll(() => page.getByRole('navigation', { name: 'Chapters' }).getByText('1 post').count()).toBe(1);

    const inbox = await visit(owner, `${app.baseUrl}/inbox`);
    const first = inbox.getByRole('list', { name: 'Posts to handle' }).locator(':scope > li').first();
    await first.focus();
    await inbox.keyboard.press('j');
    await inbox.keyboard.press('k');
    await inbox.keyboard.press('r');
    const reply = inbox.getByLabel('Your reply');
    await reply.waitFor();
    await expect.poll(() => reply.evaluate((el) => el === document.activeElement)).toBe(true);
    await inbox.keyboard.type('A flat spanner on the piston flats while it winds back in.');
    await inbox.keyboard.press('Tab');
    await inbox.keyboard.press('Enter');
    await first.getByText('A flat spanner on the piston flats').waitFor();
    // Wait for the state change to be saved (the select's own option says "Answered" at once).
    const saved = inbox.waitForResponse((r) => r.url().includes('/api/posts/') && r.request().method() !== 'GET' && r.ok());
    await first.getByLabel('State').selectOption('answered');
    await saved;
    await expect.poll(() => first.getByText('Answered', { exact: true }).count()).toBeGreaterThan(0);

    await visit(follower, `${app.baseUrl}${EPISODE}`);
    const post = page.getByRole('article', { name: /Question by Tobin Quarry/ });
    await post.getByText('A flat spanner on the piston flats').waitFor();
    expect(await post.getByText('Build team').count()).toBe(1);
    expect(await post.getByText('Answered', { exact: true }).count()).toBe(1);

    await app.runJobs();
    const mail = app.smtp.messages().find((m) => m.to.includes('tobin@example.test') && /replied to your question/.test(m.subject));
    expect(mail?.text).toContain('A flat spanner');
    expect(mail?.headers['list-unsubscribe-post']).toBe('List-Unsubscribe=One-Click');
    expect(follower.consoleErrors).toEqual([]);
    expect(owner.consoleErrors).toEqual([]);
  });

  it('following, notifications and notice settings pass the accessibility and phone checks', async () => {
    const following = await visit(follower, `${app.baseUrl}/following`);
    await following.getByRole('link', { name: 'Caliper day' }).waitFor();
    const notes = await visit(follower, `${app.baseUrl}/notifications`);
    await notes.getByText(/A reply to your question/).waitFor();
    expect(await notes.getByText(/unread/).count()).toBeGreaterThan(0);
    await visit(follower, `${app.baseUrl}/account/notices`);
    const workbench = await visit(owner, `${app.baseUrl}/workbench`);
    // The one post was answered from the inbox: nothing waits on the Workbench.
    await workbench.getByText('No unanswered posts.').waitFor();

    // A report reaches the moderation queue, where an admin hides the post with a reason.
    const reporter = new TestClient(app.baseUrl);
    await signInByEmail(reporter, app.deps.db, 'ines@example.test');
    const post = await app.deps.db.selectFrom('posts').select('id').where('parent_id', 'is', null).executeTakeFirstOrThrow();
    expect((await reporter.post(`/api/posts/${post.id}/reports`, { reason: 'Checking the queue' })).status).toBe(204);
    const admin = await signedInPage('ines@example.test');
    const queue = await visit(admin, `${app.baseUrl}/moderation`);
    await queue.getByText(/Reported by Ines Moderator/).waitFor();
    await queue.getByRole('button', { name: 'Hide' }).click();
    await queue.getByLabel('Why hide it? (recorded)').fill('Test of the queue');
    await queue.getByRole('button', { name: 'Hide', exact: true }).last().click();
    await queue.getByText(/Hidden by Ines Moderator/).waitFor();
    expect(admin.consoleErrors).toEqual([]);
    await admin.close();
    expect(follower.consoleErrors).toEqual([]);
    expectOnlyLoopback(follower);
  });
});
