import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startGithubOAuthFake, type GithubOAuthFake } from '../../fakes/github-oauth';
import { createBuild, createUser } from '../helpers/factories';
import {
  checkAccessibility,
  checkPhoneWidth,
  expectOnlyLoopback,
  launchBrowser,
  openPage,
  visit,
  type TrackedPage,
} from '../helpers/browser';
import { startTestApp, type TestApp } from '../helpers/test-app';
import { TEST_DIST_DIR } from '../setup/build-global';

let app: TestApp;
let fake: GithubOAuthFake;
let browser: Browser;
let tracked: TrackedPage;

beforeAll(async () => {
  fake = await startGithubOAuthFake({ port: 0 });
  app = await startTestApp({
    distDir: TEST_DIST_DIR,
    env: {
      GITHUB_AUTHORIZATION_URL: `${fake.url}/login/oauth/authorize`,
      GITHUB_TOKEN_URL: `${fake.url}/login/oauth/access_token`,
      GITHUB_USER_PROFILE_URL: `${fake.url}/user`,
      GITHUB_USER_EMAIL_URL: `${fake.url}/user/emails`,
    },
  });
  browser = await launchBrowser();
  tracked = await openPage(browser);
});

afterAll(async () => {
  await tracked?.close();
  await browser?.close();
  await app?.stop();
  await fake?.stop();
});

async function waitHydrated(page: Page) {
  await page.waitForSelector('html[data-hydrated="true"]', { timeout: 10_000 });
}

describe('signing in', () => {
  it('signs in as a demo creator through the GitHub stand-in, shows the account menu, signs out', async () => {
    const page = await visit(tracked, `${app.baseUrl}/sign-in?returnTo=%2F`);
    await page.getByRole('link', { name: 'Continue with GitHub' }).click();

    // The stand-in's account picker: a page of the fake, checked like every page we visit.
    await page.waitForURL(`${fake.url}/**`);
    await checkAccessibility(page);
    await checkPhoneWidth(page);
    await page.locator('button[name="login"][value="marta-kettleby"]').click();

    await page.waitForURL(`${app.baseUrl}/`);
    await waitHydrated(page);
    const menuButton = page.getByRole('button', { name: /Marta Kettleby/ });
    await menuButton.waitFor();
    await checkAccessibility(page);
    await checkPhoneWidth(page);

    await menuButton.click();
    await page.getByRole('link', { name: 'Account settings' }).waitFor();
    await checkAccessibility(page);
    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.getByRole('link', { name: 'Sign in' }).waitFor();
    const session = await (await page.request.get(`${app.baseUrl}/api/session`)).json();
    expect(session).toEqual({ account: null });
    expect(tracked.consoleErrors).toEqual([]);
    expectOnlyLoopback(tracked);
  });

  it('signs in by e-mailed link: the page asks before it signs in, then lands on the account settings', async () => {
    await createUser(app.deps.db, { handle: 'pria-castellane', display_name: 'Pria Castellane', email: 'pria@example.test' });
    const page = await visit(tracked, `${app.baseUrl}/sign-in?returnTo=%2Faccount`);
    await page.getByRole('textbox', { name: 'E-mail address' }).fill('pria@example.test');
    await page.getByRole('button', { name: /send|e-mail me|link/i }).click();
    await page.getByText(/check your inbox/i).waitFor();
    await checkAccessibility(page);

    await app.runJobs();
    const mail = app.smtp.messages().find((m) => m.to.includes('pria@example.test'));
    const link = /(http:\/\/\S+\/sign-in\/link#token=[\w-]+)/.exec(mail?.text ?? '')?.[1];
    expect(link).toBeDefined();

    await visit(tracked, link!);
    expect((await (await page.request.get(`${app.baseUrl}/api/session`)).json()).account).toBeNull();
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL(`${app.baseUrl}/account`);
    await page.getByRole('heading', { level: 1 }).waitFor();
    await waitHydrated(page);
    await checkAccessibility(page);
    await checkPhoneWidth(page);
    await page.getByRole('button', { name: /Pria Castellane/ }).waitFor();
    expect(tracked.consoleErrors).toEqual([]);
  });

  it('lets an owner see the build team page and an admin the accounts list', async () => {
    const owner = await createUser(app.deps.db, {
      handle: 'owner-person',
      display_name: 'Owner Person',
      email: 'owner@example.test',
      is_admin: true,
    });
    const build = await createBuild(app.deps.db, { owner_id: owner.id, title: '1976 Marlowe Pipit hatchback' });
    await app.deps.db.insertInto('build_members').values({ build_id: build.id, user_id: owner.id, role: 'owner' }).execute();
    const context = await browser.newContext();
    const cookies = await signedInCookies(owner.email!);
    await context.addCookies(cookies);
    const page = await context.newPage();
    const own: TrackedPage = { page, context, consoleErrors: [], requests: [], responses: [], close: () => context.close() };
    page.on('console', (m) => void (m.type() === 'error' && own.consoleErrors.push(m.text())));
    await visit(own, `${app.baseUrl}/account/builds/${build.id}/team`);
    await page.getByRole('heading', { level: 1, name: /Marlowe Pipit/ }).waitFor();
    await visit(own, `${app.baseUrl}/admin/accounts`);
    await page.getByRole('rowheader', { name: /owner-person/ }).waitFor();
    expect(own.consoleErrors).toEqual([]);
    await own.close();
  });

  it('accepts an editor invitation from the e-mailed link, with a notice that does not come back on reload', async () => {
    const { createOwnedBuild, linkFromMail, signedInClient } = await import('../helpers/accounts');
    const { owner, build } = await createOwnedBuild(app.deps.db, {
      owner: { handle: 'inviting-owner', email: 'inviting-owner@example.test' },
      build: { title: '1959 Tarrow Kestrel roadster' },
    });
    const invitee = await createUser(app.deps.db, { handle: 'new-editor', display_name: 'New Editor', email: 'new-editor@example.test' });
    const ownerClient = await signedInClient(app, owner.email!);
    expect((await ownerClient.post(`/api/builds/${build.id}/invitations`, { email: invitee.email })).status).toBe(201);
    await app.runJobs();
    const link = linkFromMail(app.smtp, invitee.email!, '/invitations/accept');

    const context = await browser.newContext();
    await context.addCookies(await signedInCookies(invitee.email!));
    const page = await context.newPage();
    const guest: TrackedPage = { page, context, consoleErrors: [], requests: [], responses: [], close: () => context.close() };
    page.on('console', (m) => void (m.type() === 'error' && guest.consoleErrors.push(m.text())));
    await visit(guest, `${link.url}#token=${link.token}`);
    await page.getByRole('button', { name: 'Accept' }).click();
    const notice = page.getByText('You joined the build team of 1959 Tarrow Kestrel roadster.');
    await notice.waitFor();
    await page.waitForURL(`**/account/builds/${build.id}/team`);
    await page.reload();
    await waitHydrated(page);
    await page.getByRole('heading', { level: 1, name: /Tarrow Kestrel/ }).waitFor();
    expect(await notice.count()).toBe(0);
    expect(guest.consoleErrors).toEqual([]);
    await guest.close();
  });
});

/** A session cookie for the account with this address, made through a real sign-in link. */
async function signedInCookies(email: string) {
  const { signInByEmail, TestClient } = await import('../helpers/http-client');
  const client = new TestClient(app.baseUrl);
  await signInByEmail(client, app.deps.db, email);
  const [name, value] = client.cookie!.split('=') as [string, string];
  return [{ name, value, url: app.baseUrl }];
}
