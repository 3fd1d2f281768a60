import fs from 'node:fs';
import path from 'node:path';
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core';
import { DEMO_PASSWORD } from '../../../seeds/support/demo-accounts';
import type { Role } from '../../../shared/api/auth';
import { fontsSettled } from './in-page';
import { homeFor } from './screens';

/** Git-ignored; the screenshots are for people to look at, not compared pixel by pixel. */
export const SCREENSHOT_DIR = path.resolve(__dirname, '..', 'screenshots');

/**
 * Per-step ceiling: a step that hangs fails in seconds instead of stalling the run. Generous,
 * because CI runs on a busy 2-core machine where a first page load alone can take five seconds.
 */
export const STEP_TIMEOUT_MS = 15_000;

export const DESKTOP = { width: 1280, height: 800 };
export const TABLET = { width: 768, height: 1024 };

/**
 * Debian's Chromium (never a downloaded browser), with everything that phones home switched
 * off so the "no request leaves the machine" check measures the app, not the browser.
 */
export function launchBrowser(): Promise<Browser> {
  return chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    args: [
      '--no-sandbox',
      '--disable-gpu',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
      '--no-first-run',
      '--disable-quic',
      '--disable-dev-shm-usage',
    ],
  });
}

/** A fresh context (own cookies, so signed out) with one page and short timeouts. */
export async function openPage(browser: Browser, viewport = DESKTOP): Promise<{ context: BrowserContext; page: Page }> {
  const context = await browser.newContext({ viewport, locale: 'en-US' });
  context.setDefaultTimeout(STEP_TIMEOUT_MS);
  context.setDefaultNavigationTimeout(2 * STEP_TIMEOUT_MS);
  const page = await context.newPage();
  return { context, page };
}

/**
 * Signs in through the real form as the demo account of `role` and waits for the role's home.
 * @example await signIn(page, server.baseUrl, 'charge'); // now on /day
 */
export async function signIn(page: Page, baseUrl: string, role: Role): Promise<void> {
  await page.goto(`${baseUrl}/sign-in`);
  await page.getByLabel('Username').fill(role);
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in', exact: true }).click();
  await page.waitForURL(`${baseUrl}${homeFor(role)}`);
}

/**
 * Signs out from the toolbar and waits for the sign-in page.
 * @example await signOut(page, server.baseUrl);
 */
export async function signOut(page: Page, baseUrl: string): Promise<void> {
  await page.getByRole('button', { name: 'Sign out' }).click();
  await page.waitForURL(`${baseUrl}/sign-in`);
}

/**
 * Saves the visible viewport to `tests/e2e/screenshots/<name>.png` and returns the path.
 * @example await screenshot(page, 'day-plan-charge-desktop');
 */
export async function screenshot(page: Page, name: string): Promise<string> {
  fs.mkdirSync(SCREENSHOT_DIR, { recursive: true });
  const file = path.join(SCREENSHOT_DIR, `${name}.png`);
  // Fonts that are still swapping in would make the picture lie about the layout.
  await page.evaluate(fontsSettled);
  await page.screenshot({ path: file, animations: 'disabled' });
  return file;
}
