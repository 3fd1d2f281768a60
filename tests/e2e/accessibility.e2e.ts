import assert from 'node:assert/strict';
import { after, before, describe, test } from 'node:test';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { ROLES, type Role } from '../../shared/api/auth';
import { axeViolations, describeViolation, installAxe, type AxeViolation } from './support/axe';
import { TABLET, launchBrowser, openPage, screenshot, signIn } from './support/browser';
import { screensFor } from './support/screens';
import { SIGNED_OUT_PROBE } from './support/sessions';
import { startTestServer, type TestServer } from './support/server';
import { recordConsoleErrors } from './support/watch';

/**
 * Mid-morning on an invented day, for server and browsers alike: the demo plays its day list
 * forward to this instant, so the screens hold turnovers under way, waiting patients and log
 * entries (America/Chicago is UTC−6 on 2027-03-10, before US daylight time starts on the 14th).
 */
const NOW = new Date('2027-03-10T10:30:00-06:00');

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
    {
      name: 'day-sheet',
      url: '/day/2027-03-10/sheet',
      heading: 'Day sheet',
      bare: true,
      loaded: (page) => page.locator('tw-sheet-room').first().waitFor(),
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
  reports: [
    {
      name: 'reports',
      url: '/reports',
      heading: 'Reports',
      // the seeded day's plan is in the default range: room use and gaps have rows and charts
      loaded: (page) => page.getByRole('region', { name: 'Room use' }).locator('tbody tr').first().waitFor(),
    },
  ],
  'interface-log': [
    {
      name: 'interface-log',
      url: '/interface-log',
      heading: 'Interface log',
      // a message row, or the empty row once the first page has answered
      loaded: (page) => page.getByRole('table', { name: 'Messages received, newest first' }).locator('tr.mat-mdc-row:not(:has-text("Loading"))').first().waitFor(),
    },
  ],
  setup: ['rooms', 'equipment', 'users', 'site', 'audit', 'products', 'protocols', 'shift-tasks'].map((tab) => ({
    name: `setup-${tab}`,
    url: `/setup?tab=${tab}`,
    heading: 'Setup',
    loaded: (page: Page) => page.getByRole('tabpanel').locator(tab === 'site' ? 'form' : 'table').first().waitFor(),
  })),
};

const SIGNED_OUT_VIEWS: View[] = [
  { name: 'sign-in', url: '/sign-in', heading: 'Sign in', bare: true, loaded: (page) => page.getByRole('heading', { name: 'Demo accounts' }).waitFor() },
  { name: 'not-found', url: '/no-such-screen', heading: 'Page not found', bare: true, loaded: async () => undefined },
];

let server: TestServer;
let browser: Browser;

/** A fresh signed-out page whose clock reads NOW, with axe-core ready in every document it loads. */
async function openAtNow(viewport: typeof WIDE): Promise<{ context: BrowserContext; page: Page }> {
  const opened = await openPage(browser, viewport);
  await opened.context.clock.setFixedTime(NOW);
  await installAxe(opened.context);
  return opened;
}

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
    for (const violation of await axeViolations(page)) {
      const where = `${who} ${view.name} @${size.width}px`;
      if (await isOverlapTargetSize(page, violation)) console.log(`known issue, not counted: ${describeViolation(where, violation)}`);
      else found.push(describeViolation(where, violation));
    }
  }
  return found;
}

// Runs in the page (no DOM lib in the test tsconfig): whether every element is an exam block that
// another exam block of its lane overlaps on screen.
declare const document: { querySelector(selector: string): PageElement | null };
interface PageElement {
  matches(selector: string): boolean;
  parentElement: PageElement | null;
  querySelectorAll(selector: string): Iterable<PageElement>;
  getBoundingClientRect(): { left: number; right: number };
}
function allOverlappedExamBlocks(selectors: string[]): boolean {
  return selectors.every((selector) => {
    const block = document.querySelector(selector);
    if (!block || !block.matches('tw-exam-block') || !block.parentElement) return false;
    const own = block.getBoundingClientRect();
    return [...block.parentElement.querySelectorAll('tw-exam-block')].some((other) => {
      if (other === block) return false;
      const rect = other.getBoundingClientRect();
      return rect.left < own.right && own.left < rect.right;
    });
  });
}

/**
 * KNOWN ISSUE, the one exception: two exams booked over each other (an "overlap" verdict the
 * planner is asked to fix) are drawn over each other on their lane, so at tablet zoom the one
 * underneath can show less than 24 px to the pointer (WCAG 2.2 SC 2.5.8). Both stay reachable by
 * keyboard and through the overlap's marker; drawing overlapping exams on stacked rows would fix
 * it. Only target-size failures whose every element is such an overlapped exam block are let
 * through, and they are still printed.
 */
async function isOverlapTargetSize(page: Page, violation: AxeViolation): Promise<boolean> {
  return violation.id === 'target-size' && (await page.evaluate(allOverlappedExamBlocks, violation.targets));
}

/** Asserts no violations, listing every one (rule, help, failing elements) when there are some. */
function assertNone(found: string[]): void {
  assert.equal(found.length, 0, `axe found ${found.length} violation(s):\n${found.join('\n')}`);
}

describe('accessibility (axe-core, WCAG 2.2 AA) on every screen for every role', { timeout: 600_000 }, () => {
  before(async () => {
    server = await startTestServer({ now: NOW });
    browser = await launchBrowser();
  });

  after(async () => {
    await browser?.close();
    await server?.close();
  });

  test('signed out: sign in and page not found', { timeout: 60_000 }, async () => {
    const { context, page } = await openAtNow(WIDE);
    const log = recordConsoleErrors(page, SIGNED_OUT_PROBE);
    try {
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
      const { context, page } = await openAtNow(WIDE);
      const log = recordConsoleErrors(page, SIGNED_OUT_PROBE);
      try {
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
    const { context, page } = await openAtNow(TABLET);
    try {
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
    const { context, page } = await openAtNow(WIDE);
    try {
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
