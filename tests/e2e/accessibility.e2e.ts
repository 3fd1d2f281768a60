import assert from 'node:assert/strict';
import { after, before, describe, test } from 'node:test';
import type { Browser, Page } from 'playwright-core';
import { ROLES, type Role } from '../../shared/api/auth';
import { axeViolations, describeViolation, installAxe } from './support/axe';
import { TABLET, launchBrowser, openPage, screenshot, signIn } from './support/browser';
import { screensFor } from './support/screens';
import { SIGNED_OUT_PROBE } from './support/sessions';
import { startTestServer, type TestServer } from './support/server';
import { recordConsoleErrors } from './support/watch';

/** The two widths the product is used at: a desktop monitor, and a tablet held upright. */
const WIDE = { width: 1440, height: 900 };
const WIDTHS = [WIDE, TABLET];
/** Below this the shell's navigation is an overlay (shell.ts). */
const NARROW_BELOW = 1000;

/** One state of a screen to check: where it is and what shows that it has finished loading. */
interface View {
  name: string;
  url: string;
  heading: string;
  /** Waits until the view's content (not just its heading) is on screen. */
  loaded(page: Page): Promise<void>;
  /** Full-window views have no toolbar or navigation. */
  bare?: boolean;
}

const live = (page: Page) => page.locator('tw-live-indicator[data-status="live"]').waitFor();

/** The views of each screen, by route path (see the client's roles.ts for who may open which). */
const VIEWS: Record<string, View[]> = {
  day: [
    {
      name: 'day-plan',
      url: '/day',
      heading: 'Day plan',
      loaded: async (page) => {
        await page.locator('.tw-exam-block').first().waitFor();
        await page.locator('.live[data-live="live"]').waitFor();
      },
    },
  ],
  import: [{ name: 'import', url: '/import', heading: 'Import', loaded: (page) => page.locator('tw-drop-zone').waitFor() }],
  'rooms-now': [
    {
      name: 'rooms-now',
      url: '/rooms-now',
      heading: 'Rooms now',
      loaded: async (page) => {
        await page.locator('tw-board-card').first().waitFor();
        await live(page);
      },
    },
    {
      name: 'rooms-now-wall',
      url: '/rooms-now?display=wall',
      heading: 'Rooms now',
      bare: true,
      loaded: async (page) => {
        await page.locator('tw-board-card').first().waitFor();
        await page.getByRole('button', { name: 'Leave wall display' }).waitFor();
        await live(page);
      },
    },
  ],
  turnover: [
    {
      name: 'turnover',
      url: '/turnover',
      heading: 'Turnover',
      loaded: async (page) => {
        await page.getByRole('heading', { name: 'Shift tasks' }).waitFor();
        await live(page);
      },
    },
    {
      name: 'cleaning-log',
      url: '/turnover/log',
      heading: 'Cleaning log',
      loaded: (page) => page.getByRole('table', { name: 'Cleaning log entries' }).waitFor(),
    },
  ],
  reports: [{ name: 'reports', url: '/reports', heading: 'Reports', loaded: async () => undefined }],
  setup: [{ name: 'setup', url: '/setup', heading: 'Setup', loaded: async () => undefined }],
};

const SIGNED_OUT_VIEWS: View[] = [
  { name: 'sign-in', url: '/sign-in', heading: 'Sign in', bare: true, loaded: (page) => page.getByRole('heading', { name: 'Demo accounts' }).waitFor() },
  { name: 'not-found', url: '/no-such-screen', heading: 'Page not found', bare: true, loaded: async () => undefined },
];

let server: TestServer;
let browser: Browser;

/**
 * Waits until the shell has taken the layout of the current width: at tablet width the
 * navigation is a closed overlay behind a menu button, at desktop width it stays open.
 */
async function layoutSettled(page: Page, view: View, width: number): Promise<void> {
  if (view.bare) return;
  const menu = page.getByRole('button', { name: 'Open the screen list' });
  const sidenav = page.locator('mat-sidenav');
  if (width < NARROW_BELOW) {
    await menu.waitFor();
    await sidenav.waitFor({ state: 'hidden' });
  } else {
    await menu.waitFor({ state: 'detached' });
    await sidenav.waitFor();
  }
}

/** Checks one view at every width, returning what axe found, each line naming view and width. */
async function checkView(page: Page, view: View, who: string): Promise<string[]> {
  const found: string[] = [];
  for (const size of WIDTHS) {
    await page.setViewportSize(size);
    // A fresh load at each width, as a person arriving on that device would see it.
    await page.goto(`${server.baseUrl}${view.url}`);
    await page.getByRole('heading', { level: 1, name: view.heading }).waitFor();
    await view.loaded(page);
    await layoutSettled(page, view, size.width);
    await screenshot(page, `a11y-${who}-${view.name}-${size.width}`);
    for (const violation of await axeViolations(page)) found.push(describeViolation(`${who} ${view.name} @${size.width}px`, violation));
  }
  return found;
}

/** Asserts no violations, listing every one (rule, help, failing elements) when there are some. */
function assertNone(found: string[]): void {
  assert.equal(found.length, 0, `axe found ${found.length} violation(s):\n${found.join('\n')}`);
}

describe('accessibility (axe-core, WCAG 2.2 AA) on every screen for every role', { timeout: 600_000 }, () => {
  before(async () => {
    server = await startTestServer();
    browser = await launchBrowser();
  });

  after(async () => {
    await browser?.close();
    await server?.close();
  });

  test('signed out: sign in and page not found', { timeout: 60_000 }, async () => {
    const { context, page } = await openPage(browser, WIDE);
    const log = recordConsoleErrors(page, SIGNED_OUT_PROBE);
    try {
      await installAxe(context);
      const found: string[] = [];
      for (const view of SIGNED_OUT_VIEWS) found.push(...(await checkView(page, view, 'signed-out')));
      assertNone(found);
      assert.deepEqual(log.errors, [], 'no console errors (a missing icon logs one)');
    } finally {
      await context.close();
    }
  });

  for (const role of ROLES) {
    test(`${role}: every screen it may open, at 1440 and 768 px`, { timeout: 180_000 }, async () => {
      const { context, page } = await openPage(browser, WIDE);
      const log = recordConsoleErrors(page, SIGNED_OUT_PROBE);
      try {
        await installAxe(context);
        await signIn(page, server.baseUrl, role);
        const views = screensFor(role).flatMap((screen) => VIEWS[screen.path] ?? []);
        assert.ok(views.length >= 2, `${role} has views to check`);
        const found: string[] = [];
        for (const view of views) found.push(...(await checkView(page, view, role)));
        assertNone(found);
        assert.deepEqual(log.errors, [], 'no console errors (a missing icon logs one)');
      } finally {
        await context.close();
      }
    });
  }

  test('the navigation overlay at tablet width, and a screen a role may not open', { timeout: 60_000 }, async () => {
    const { context, page } = await openPage(browser, TABLET);
    try {
      await installAxe(context);
      await signIn(page, server.baseUrl, 'frontdesk' satisfies Role);
      const found: string[] = [];
      await page.getByRole('button', { name: 'Open the screen list' }).click();
      await page.getByRole('navigation', { name: 'Screens' }).getByRole('link').first().waitFor();
      await screenshot(page, 'a11y-frontdesk-nav-open-768');
      for (const violation of await axeViolations(page)) found.push(describeViolation('frontdesk navigation overlay @768px', violation));

      await page.goto(`${server.baseUrl}/reports`);
      await page.getByRole('heading', { level: 1, name: 'Not available for your role' }).waitFor();
      for (const violation of await axeViolations(page)) found.push(describeViolation('frontdesk not-available @768px', violation));
      assertNone(found);
    } finally {
      await context.close();
    }
  });

  test('an error shown in the snack bar (loaded on first use) is announced and passes', { timeout: 60_000 }, async () => {
    const { context, page } = await openPage(browser, WIDE);
    try {
      await installAxe(context);
      await signIn(page, server.baseUrl, 'charge');
      // Signing out fails on the server: the shell says so, then signs out locally anyway.
      await page.route('**/api/auth/logout', (route) =>
        route.fulfill({ status: 500, contentType: 'application/json', body: JSON.stringify({ error: { code: 'internal', message: 'The server is having a moment.' } }) }),
      );
      await page.getByRole('button', { name: 'Sign out' }).click();
      const snackBar = page.locator('.mat-mdc-snack-bar-container');
      await snackBar.getByText('The server is having a moment.').waitFor();
      await page.getByRole('button', { name: 'Dismiss' }).waitFor();
      await screenshot(page, 'a11y-error-snack-bar-1440');
      const found = (await axeViolations(page)).map((violation) => describeViolation('error snack bar @1440px', violation));
      assertNone(found);
    } finally {
      await context.close();
    }
  });
});
