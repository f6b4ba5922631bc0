// Browser-test helpers for every suite: Debian's Chromium through playwright-core, and the
// checks each visited page must pass (axe: no serious or critical violation; nothing wider
// than a 375 px phone). Screenshots go to the git-ignored .data/screenshots/.
import { mkdirSync } from 'node:fs';
import path from 'node:path';
import { AxeBuilder } from '@axe-core/playwright';
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core';
import { expect } from 'vitest';

export const CHROMIUM_PATH = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';
const CHROMIUM_FLAGS = [
  '--headless',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-quic',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
];
export const SCREENSHOT_DIR = path.resolve('.data/screenshots');
export const PHONE_WIDTH = 375;
const DESKTOP = { width: 1280, height: 900 };

export function launchBrowser(): Promise<Browser> {
  return chromium.launch({ executablePath: CHROMIUM_PATH, args: CHROMIUM_FLAGS, headless: true });
}

/** A page that records console errors, page errors and every request it makes. */
export interface TrackedPage {
  page: Page;
  context: BrowserContext;
  consoleErrors: string[];
  requests: Array<{ url: string; resourceType: string }>;
  responses: Array<{ url: string; status: number }>;
  close(): Promise<void>;
}

export interface OpenPageOptions {
  /** A session to carry: the `name=value` cookie of a signed-in TestClient, for the app at `url`. */
  signedIn?: { cookie: string; url: string };
  acceptDownloads?: boolean;
}

export async function openPage(browser: Browser, opts: OpenPageOptions = {}): Promise<TrackedPage> {
  const context = await browser.newContext({ viewport: DESKTOP, acceptDownloads: opts.acceptDownloads ?? false });
  if (opts.signedIn) {
    const [name, ...rest] = opts.signedIn.cookie.split('=');
    await context.addCookies([{ name: name!, value: rest.join('='), url: opts.signedIn.url }]);
  }
  const page = await context.newPage();
  const tracked: TrackedPage = { page, context, consoleErrors: [], requests: [], responses: [], close: () => context.close() };
  page.on('console', (msg) => {
    if (msg.type() === 'error') tracked.consoleErrors.push(msg.text());
  });
  page.on('pageerror', (err) => tracked.consoleErrors.push(err.message));
  page.on('request', (req) => tracked.requests.push({ url: req.url(), resourceType: req.resourceType() }));
  page.on('response', (res) => tracked.responses.push({ url: res.url(), status: res.status() }));
  return tracked;
}

/** Fails on any serious or critical axe violation, listing each with its targets. */
export async function checkAccessibility(page: Page): Promise<void> {
  const results = await new AxeBuilder({ page }).analyze();
  const bad = results.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical');
  const report = bad.map((v) => `${v.impact} ${v.id}: ${v.help} — ${v.nodes.map((n) => n.target.join(' ')).join(', ')}`);
  expect(report, `axe violations on ${page.url()}`).toEqual([]);
}

/**
 * Fails when the page is wider than a 375 px phone screen (horizontal scrolling), or when axe finds
 * a serious violation at that width (a table that scrolls sideways only on a phone must be reachable
 * by keyboard, for one).
 */
export async function checkPhoneWidth(page: Page): Promise<void> {
  const before = page.viewportSize() ?? DESKTOP;
  await page.setViewportSize({ width: PHONE_WIDTH, height: 812 });
  await page.waitForTimeout(50);
  const width = await page.evaluate(() => document.documentElement.scrollWidth);
  await page.screenshot({ path: screenshotPath(page, 'phone'), fullPage: true });
  try {
    expect(width, `scrollWidth at ${PHONE_WIDTH} px on ${page.url()}`).toBeLessThanOrEqual(PHONE_WIDTH);
    await checkAccessibility(page);
  } finally {
    await page.setViewportSize(before);
  }
}

function screenshotPath(page: Page, suffix: string): string {
  mkdirSync(SCREENSHOT_DIR, { recursive: true });
  const url = new URL(page.url());
  const name =
    `${url.pathname}${url.search}`
      .replace(/[^a-z0-9]+/gi, '_')
      .replace(/^_+|_+$/g, '')
      .slice(0, 60) || 'home';
  return path.join(SCREENSHOT_DIR, `${name}-${suffix}.png`);
}

/**
 * Opens a URL, waits for the page to settle and hydrate, takes a screenshot, and runs the
 * accessibility and phone-width checks. Every browser test visits pages through this.
 */
export async function visit(tracked: TrackedPage, url: string, { status = 200 }: { status?: number } = {}): Promise<Page> {
  const { page } = tracked;
  const response = await page.goto(url, { waitUntil: 'networkidle' });
  expect(response?.status(), `status of ${url}`).toBe(status);
  await page.waitForSelector('html[data-hydrated="true"]', { timeout: 10_000 });
  await page.screenshot({ path: screenshotPath(page, 'desktop'), fullPage: true });
  await checkAccessibility(page);
  await checkPhoneWidth(page);
  return page;
}

/** Every request the page made went to loopback (or stayed in the page: data:, blob:). */
export function expectOnlyLoopback(tracked: TrackedPage): void {
  const outside = tracked.requests
    .map((r) => r.url)
    .filter((u) => {
      const { protocol, hostname } = new URL(u);
      if (protocol === 'data:' || protocol === 'blob:') return false;
      return !['127.0.0.1', 'localhost', '[::1]'].includes(hostname);
    });
  expect(outside).toEqual([]);
}
