import assert from 'node:assert/strict';
import { after, before, describe, test } from 'node:test';
import type { Browser, BrowserContext, Locator, Page } from 'playwright-core';
import { EXAM_LIST_HEADER, toCsv } from '../fixtures/exam-lists';
import { installAxe, axeViolations, describeViolation } from './support/axe';
import { STEP_TIMEOUT_MS, TABLET, launchBrowser, screenshot, signIn } from './support/browser';
import { importDayList, xsrfHeader } from './support/day-api';
import { startTestServer, type TestServer } from './support/server';
import { boardCard, openLive } from './support/turnover';

const DAY = '2027-03-10';
/** The demo site's zone is America/Chicago: UTC−6 on 2027-03-10, before US daylight time starts on the 14th (15 U.S.C. § 260a). */
const at = (hhmm: string) => new Date(`${DAY}T${hhmm}:00-06:00`);
const row = (acc: string, room: string, start: string, dur: number, precaution = 'none') =>
  [acc, room, start, String(dur), 'MR knee without contrast', 'knee', precaution, 'ambulatory', 'no', ''];

/**
 * An invented day seen at 08:31: MR 1 and MR 2 turning over (MR 2 after an airborne case, its
 * air hold running), MR 3 in exam, CT 1 with no exam at all (open, so ready). Patients due in
 * the coming hour in three rooms.
 */
const DAY_LIST = toCsv([
  EXAM_LIST_HEADER,
  row('WD-1', 'MR 1', '07:45', 30),
  row('WD-2', 'MR 1', '09:00', 30),
  row('WD-3', 'MR 2', '07:30', 30, 'airborne'),
  row('WD-4', 'MR 2', '09:15', 30),
  row('WD-5', 'MR 3', '08:15', 45),
  row('WD-6', 'MR 3', '09:20', 30),
]);
/** The wall screen the issue names: 1920 × 1080, a touch screen. */
const WALL = { width: 1920, height: 1080 };
const DESKTOP_WIDE = { width: 1440, height: 900 };

let server: TestServer;
let browser: Browser;

async function openSignedIn(role: 'frontdesk' | 'tech' | 'charge', viewport: { width: number; height: number }, touch = false): Promise<{ context: BrowserContext; page: Page }> {
  const context = await browser.newContext({ viewport, locale: 'en-US', hasTouch: touch });
  context.setDefaultTimeout(STEP_TIMEOUT_MS);
  context.setDefaultNavigationTimeout(2 * STEP_TIMEOUT_MS);
  await installAxe(context);
  const page = await context.newPage();
  await page.clock.setFixedTime(server.clock!.now());
  await signIn(page, server.baseUrl, role);
  return { context, page };
}

/** The font size in px of the first element `selector` finds in `scope`. */
function fontPx(scope: Locator, selector: string): Promise<number> {
  return scope.locator(selector).first().evaluate((element) => parseFloat(getComputedStyle(element as Element).fontSize));
}

declare function getComputedStyle(element: object, pseudo?: string): { fontSize: string; backgroundColor: string; backgroundImage: string; opacity: string };
declare interface Element {
  getBoundingClientRect(): { left: number; right: number; top: number; bottom: number; width: number; height: number };
}

describe('Rooms now on the wall, the arrivals list and the cleaning log on a tablet', { timeout: 120_000 }, () => {
  before(async () => {
    server = await startTestServer({ now: at('07:00'), seedDay: false });
    browser = await launchBrowser();
    const { context, page } = await openSignedIn('charge', DESKTOP_WIDE);
    try {
      await importDayList(context, server.baseUrl, DAY, DAY_LIST);
      const finish = async (accession: string, when: string) => {
        server.clock!.set(at(when));
        const exam = await server.db('exams').where({ day: DAY, accession }).first('id');
        const response = await context.request.post(`${server.baseUrl}/api/exams/${exam.id}/finished`, { headers: await xsrfHeader(context), data: {} });
        assert.equal(response.status(), 201, await response.text());
      };
      await finish('WD-3', '08:00');
      await finish('WD-1', '08:20');
      void page;
    } finally {
      await context.close();
    }
    server.clock!.set(at('08:31'));
  });
  after(async () => {
    await browser?.close();
    await server?.close();
  });

  test('the wall display reads from across the room and can be left by touch', async () => {
    const { context, page } = await openSignedIn('frontdesk', WALL, true);
    try {
      await openLive(page, `${server.baseUrl}/rooms-now?display=wall`);
      await boardCard(page, 'MR 2', 'turning over').waitFor();
      await boardCard(page, 'MR 3', 'in exam').waitFor();
      await boardCard(page, 'CT 1', 'ready').waitFor(); // open, no exam today: ready, not closed
      assert.match(await boardCard(page, 'CT 1').innerText(), /No more exams today/);
      await screenshot(page, 'rooms-now-wall-frontdesk-1920');

      // The cards fill the screen: four rooms in two rows reaching the bottom of the window.
      const boxes = await page.locator('tw-board-card').evaluateAll((cards) => cards.map((card) => (card as Element).getBoundingClientRect()));
      assert.equal(boxes.length, 4);
      assert.ok(Math.max(...boxes.map((b) => b.bottom)) > WALL.height * 0.9, `cards reach the bottom: ${JSON.stringify(boxes)}`);
      assert.ok(Math.min(...boxes.map((b) => b.width)) > WALL.width * 0.4, 'two cards a row, each nearly half the screen wide');

      for (const room of ['MR 1', 'MR 2', 'MR 3', 'CT 1']) {
        const card = boardCard(page, room);
        const state = await fontPx(card, '.state-band .word');
        const sizes = await card.locator('*').evaluateAll((all) => all.map((element) => parseFloat(getComputedStyle(element).fontSize)));
        assert.equal(Math.max(...sizes), state, `${room}: the state is the largest text on the card`);
        // 3 m from a 1920 × 1080 screen: the state word at least 64 px, ready-at at least 48 px (practice, no source)
        assert.ok(state >= 64, `${room}: state ${state}px`);
        if ((await card.locator('.ready .time').count()) > 0) assert.ok((await fontPx(card, '.ready .time')) >= 48, `${room}: ready-at is big`);
        assert.equal(await card.locator('.state-band mat-icon').count(), 1, `${room}: an icon beside the colour`);
      }
      // Each state its own pattern as well as its own tint: turning over, in exam and ready differ in both.
      const looks = [];
      for (const room of ['MR 1', 'MR 3', 'CT 1']) {
        looks.push(await boardCard(page, room).locator('.state-band').evaluate((band) => [getComputedStyle(band).backgroundColor, getComputedStyle(band, '::after').backgroundImage]));
      }
      assert.equal(new Set(looks.map((look) => look[0])).size, 3, `three tints: ${JSON.stringify(looks)}`);
      assert.equal(new Set(looks.map((look) => look[1])).size, 3, `three patterns: ${JSON.stringify(looks)}`);
      assert.match(await boardCard(page, 'MR 1').locator('.countdown').innerText(), /^(in \d+ min|overdue by \d+ min|due now)$/);

      const violations = await axeViolations(page);
      assert.deepEqual(violations.map((v) => describeViolation('wall display', v)), [], 'WCAG 2.2 AA on the wall display');

      const leave = page.getByRole('button', { name: 'Leave wall display' });
      const box = (await leave.boundingBox())!;
      assert.ok(box.height >= 48 && box.y >= 0 && box.y + box.height <= WALL.height, `the way out is in view and finger-sized: ${JSON.stringify(box)}`);
      assert.equal(await leave.evaluate((button) => getComputedStyle(button).opacity), '1', 'visible without hovering (a touch screen has no hover)');
      await leave.tap();
      await page.waitForURL((url) => !url.search.includes('display=wall'));
      await page.getByRole('button', { name: 'Wall display' }).waitFor();
    } finally {
      await context.close();
    }
  });

  test('the front desk marks an arrival from the coming hour\'s list, beyond each room\'s next patient', async () => {
    const { context, page } = await openSignedIn('frontdesk', DESKTOP_WIDE);
    try {
      await openLive(page, `${server.baseUrl}/rooms-now`);
      const list = page.locator('tw-arrivals-list');
      await list.locator('li').first().waitFor();
      assert.deepEqual(await list.locator('li .accession').allInnerTexts(), ['WD-2', 'WD-4', 'WD-6']);
      await list.getByRole('button', { name: 'Mark arrived: WD-6, MR 3' }).click();
      await list.locator('li', { hasText: 'WD-6' }).getByText('Waiting since 08:31').waitFor();
      await screenshot(page, 'rooms-now-arrivals-frontdesk-1440');
    } finally {
      await context.close();
    }
  });

  test('the cleaning log on a tablet shows who, the early reason and corrections without scrolling sideways', async () => {
    const { context, page } = await openSignedIn('tech', TABLET);
    try {
      await page.goto(`${server.baseUrl}/turnover/log`);
      await page.locator('tr.mat-mdc-row').first().waitFor();
      // the same day picker as every other screen: the day in words, not the browser's locale format
      assert.match(await page.locator('tw-day-picker .long').innerText(), /^Wednesday 10 March 2027$/);
      for (const header of ['Who', 'Early reason', 'Corrections']) {
        const box = (await page.getByRole('columnheader', { name: header }).boundingBox())!;
        assert.ok(box.x >= 0 && box.x + box.width <= TABLET.width, `${header} is on screen at 768 px: ${JSON.stringify(box)}`);
      }
      const wrap = await page.locator('.table-wrap').evaluate((element) => {
        const el = element as unknown as { scrollWidth: number; clientWidth: number };
        return { scroll: el.scrollWidth, client: el.clientWidth };
      });
      assert.ok(wrap.scroll <= wrap.client + 1, `no sideways scrolling: ${JSON.stringify(wrap)}`);
      const background = await page.locator('td.mat-column-at').first().evaluate((cell) => getComputedStyle(cell).backgroundColor);
      assert.notEqual(background, 'rgba(0, 0, 0, 0)', 'the fixed time column is opaque');
      await screenshot(page, 'cleaning-log-tech-768');

      await page.goto(`${server.baseUrl}/turnover`);
      await page.locator('tw-checklist-step-row').first().waitFor();
      await screenshot(page, 'turnover-checklist-tech-768');
    } finally {
      await context.close();
    }
  });
});
