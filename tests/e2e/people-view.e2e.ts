import assert from 'node:assert/strict';
import { after, before, describe, test } from 'node:test';
import type { Browser, Page } from 'playwright-core';
import { EXAM_LIST_HEADER, plainExamRow, toCsv } from '../fixtures/exam-lists';
import { axeViolations, describeViolation, installAxe } from './support/axe';
import { openPage, screenshot, signIn } from './support/browser';
import { xsrfHeader } from './support/day-api';
import { importedDay, stopServerAndBrowser } from './support/imported-day';
import type { TestServer } from './support/server';
import { examBlock } from './support/timeline';

const DAY = '2027-03-10';

/**
 * An invented day and roster. One aide covers MR 1 and MR 2 (07:00–15:00, break 11:40–12:10), with
 * the site's walking time between rooms (3 min by default: common practice, no source). MR 2's
 * PV-3 leaves at 09:52 and a plain turnover takes one person 20 min (product brief), so the aide
 * is in MR 2 until 10:12; MR 1's PV-2 at 10:29 then waits for the walk over and is short.
 * Nobody covers MR 3 or CT 1.
 */
const DAY_LIST = toCsv([
  EXAM_LIST_HEADER,
  plainExamRow('PV-1', 'MR 1', '09:00', 60),
  plainExamRow('PV-2', 'MR 1', '10:29', 30),
  plainExamRow('PV-3', 'MR 2', '09:00', 52),
  plainExamRow('PV-4', 'MR 2', '10:20', 30),
  plainExamRow('PV-5', 'MR 2', '11:30', 30),
  plainExamRow('PV-6', 'MR 2', '12:30', 30),
  plainExamRow('PV-7', 'CT 1', '09:00', 15),
]);

let server: TestServer;
let browser: Browser;

/** Opens the test day in the people view and waits for the aide's lane. */
async function openPeople(page: Page): Promise<void> {
  await page.goto(`${server.baseUrl}/day/${DAY}`);
  await page.getByRole('heading', { level: 1, name: 'Day plan' }).waitFor();
  await examBlock(page, 'PV-1').waitFor();
  await page.locator('.view button', { hasText: 'People' }).click();
  await page.locator('tw-person-lane[aria-label^="Aide 1, 07:00–15:00"]').waitFor();
}

async function assertAxeClean(page: Page, where: string): Promise<void> {
  const violations = await axeViolations(page);
  assert.deepEqual(violations.map((violation) => describeViolation(where, violation)), []);
}

describe('people view in the browser', { timeout: 120_000 }, () => {
  before(async () => {
    ({ server, browser } = await importedDay('charge', DAY, DAY_LIST, async (context, started) => {
      const rooms: { id: number; name: string }[] = await started.db('rooms').select('id', 'name');
      const id = (name: string) => rooms.find((room) => room.name === name)!.id;
      const rows = [{ name: null, role: 'aide', count: 1, start: '07:00', end: '15:00', breaks: [{ start: '11:40', end: '12:10' }], roomIds: [id('MR 1'), id('MR 2')] }];
      const response = await context.request.put(`${started.baseUrl}/api/days/${DAY}/roster`, { headers: await xsrfHeader(context), data: { rows } });
      if (!response.ok()) throw new Error(`roster answered ${response.status()}: ${await response.text()}`);
    }));
  }, { timeout: 60_000 });
  after(() => stopServerAndBrowser({ server, browser }), { timeout: 30_000 });

  for (const viewport of [{ width: 1440, height: 900 }, { width: 768, height: 1024 }]) {
    test(`a charge technologist sees the aide's day and why PV-2 is short (${viewport.width} px)`, { timeout: 60_000 }, async () => {
      const { context, page } = await openPage(browser, viewport);
      try {
        await installAxe(context);
        await signIn(page, server.baseUrl, 'charge');
        await openPeople(page);

        const lane = page.locator('tw-person-lane[aria-label^="Aide 1"]');
        assert.match((await lane.getAttribute('aria-label'))!, /^Aide 1, 07:00–15:00, break 11:40–12:10, \d+ turnovers$/);
        assert.equal(await page.getByRole('list', { name: 'People on shift' }).getByRole('listitem').count(), 1);
        assert.match(await page.locator('tw-people-view .notes').innerText(), /Nobody on the roster covers MR 3, CT 1/);
        // The walk from MR 2 to MR 1 after PV-4's turnover.
        await lane.locator('.walk[title="walk MR 2 → MR 1, 3 min"]').waitFor({ state: 'attached' });

        if (viewport.width < 1024) {
          // The lanes scroll sideways under the fixed names, like the room timeline.
          const scroller = page.locator('tw-people-view .scroller');
          await scroller.evaluate((element) => element.scrollBy({ left: 400 }));
          const [name, box] = await Promise.all([lane.locator('.header').boundingBox(), scroller.boundingBox()]);
          assert.ok(name && box && Math.abs(name.x - box.x) <= 2, `the name column stays at the left edge (${name?.x} vs ${box?.x})`);
          assert.ok(await scroller.evaluate((element) => element.scrollWidth > element.clientWidth), 'the lanes scroll sideways');
        }
        await screenshot(page, `people-view-lanes-${viewport.width}`);
        await assertAxeClean(page, `people view lanes at ${viewport.width} px`);

        // Keyboard: the work before PV-2 is a button; Enter opens its gap with the people reason.
        const work = page.getByRole('button', { name: /^MR 1, PV-2, turnover 10:15–10:35, short by \d+ min$/ });
        await work.focus();
        await page.keyboard.press('Enter');
        const panel = page.locator('tw-gap-panel');
        await panel.getByRole('heading', { name: 'Turnover before PV-2' }).waitFor();
        assert.match(await panel.locator('.people-reason').innerText(), /^Short by \d+ min: Aide 1 is in MR 2 until 10:12$/);
        assert.equal(await panel.locator('.crew').innerText(), 'Aide 1');
        await panel.locator('.fixes').getByRole('progressbar').waitFor({ state: 'detached' });

        await screenshot(page, `people-view-gap-${viewport.width}`);
        await assertAxeClean(page, `people view with the gap open at ${viewport.width} px`);
      } finally {
        await context.close();
      }
    });
  }
});
