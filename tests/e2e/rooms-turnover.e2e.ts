import assert from 'node:assert/strict';
import { after, before, describe, test } from 'node:test';
import type { Browser, Page } from 'playwright-core';
import { DEMO_ACCOUNTS } from '../../seeds/support/demo-accounts';
import { EXAM_LIST_HEADER, toCsv } from '../fixtures/exam-lists';
import { DESKTOP, TABLET, launchBrowser, openPage, screenshot, signIn } from './support/browser';
import { importDayList } from './support/day-api';
import { startTestServer, type TestServer } from './support/server';
import { withSessions } from './support/sessions';
import { boardCard, openLive, stepRow, tickStep } from './support/turnover';

const DAY = '2027-03-10';
/** The demo site's zone is America/Chicago: UTC−6 on 2027-03-10, before US daylight time starts on the 14th (15 U.S.C. § 260a). */
const at = (hhmm: string) => new Date(`${DAY}T${hhmm}:00-06:00`);
const row = (acc: string, room: string, start: string, dur: number) =>
  [acc, room, start, String(dur), 'MR knee without contrast', 'knee', 'none', 'ambulatory', 'no', ''];

/** An invented day: RT-1 in MR 1 has run over its 08:30 end when the test starts at 08:31. */
const DAY_LIST = toCsv([
  EXAM_LIST_HEADER,
  row('RT-1', 'MR 1', '08:00', 30),
  row('RT-2', 'MR 1', '09:00', 30),
  row('RT-3', 'MR 2', '08:00', 45),
]);
const EARLY = 'Next patient on the table edge only; wiped the wet strip dry';
const TECH_NAME = DEMO_ACCOUNTS.find((account) => account.username === 'tech')!.displayName;

let server: TestServer;
let browser: Browser;

/** Sets the server's and the browsers' clocks to the same instant, so both agree what is wet. */
async function setTime(when: Date, ...pages: Page[]): Promise<void> {
  server.clock!.set(when);
  for (const page of pages) await page.clock.setFixedTime(when);
}

describe('Rooms now and the turnover checklist in the browser', { timeout: 120_000 }, () => {
  before(async () => {
    server = await startTestServer({ now: at('07:00'), seedDay: false });
    browser = await launchBrowser();
    const { context, page } = await openPage(browser);
    try {
      await signIn(page, server.baseUrl, 'charge');
      await importDayList(context, server.baseUrl, DAY, DAY_LIST);
    } finally {
      await context.close();
    }
    server.clock!.set(at('08:31'));
  });
  after(async () => {
    await browser?.close();
    await server?.close();
  });

  test('a technologist works a turnover to the end while the front desk watches the room turn ready', { timeout: 90_000 }, async () => {
    const mr1 = await server.db('rooms').where({ name: 'MR 1' }).first('id');
    await withSessions(browser, server.baseUrl, [['tech', TABLET], ['frontdesk', DESKTOP]], async (tech, desk) => {
      await setTime(at('08:31'), tech.page, desk.page);
      await openLive(desk.page, `${server.baseUrl}/rooms-now`);
      await boardCard(desk.page, 'MR 1', 'in exam').waitFor();
      // Marks the page: a reload would lose it, so finding it at the end proves the board updated live.
      await desk.page.evaluate(() => ((globalThis as unknown as { boardNeverReloaded: boolean }).boardNeverReloaded = true));

      await openLive(tech.page, `${server.baseUrl}/turnover?room=${mr1.id}`);
      await tech.page.getByRole('button', { name: 'Exam finished' }).click();
      await stepRow(tech.page, 'clear').locator('button.tick:enabled').waitFor();
      await boardCard(desk.page, 'MR 1', 'turning over').waitFor();
      await screenshot(desk.page, 'rooms-now-turning-over-frontdesk-desktop');

      // The front desk marks RT-2's patient arrived; the tech's checklist shows them waiting.
      await boardCard(desk.page, 'MR 1').getByRole('button', { name: 'Patient arrived' }).click();
      await boardCard(desk.page, 'MR 1').getByText('Patient waiting since 08:31').waitFor();
      await tech.page.locator('tw-turnover-exams .waiting').getByText('Patient waiting since 08:31').waitFor();

      await tickStep(tech.page, 'clear');
      await tickStep(tech.page, 'bore', { product: /^Sporicidal wipe/ });
      for (const key of ['table', 'coils', 'cushions', 'comfort', 'touch']) await tickStep(tech.page, key);
      // The table was wiped at 08:31: standard wipe, 2 min contact + 2 min dry (demo protocol, product brief).
      assert.match(await stepRow(tech.page, 'linen').locator('.blocked').innerText(), /Needs table top and rails dry: wet until 08:35/);
      await tickStep(tech.page, 'linen', { earlyReason: EARLY });
      assert.match(await stepRow(tech.page, 'linen').locator('.early').innerText(), new RegExp(`ticked early: ${EARLY}`));
      await screenshot(tech.page, 'turnover-checklist-tech-tablet');

      // Ten minutes on, every surface is dry (the sporicidal bore's 4 + 4 min included): no more reasons asked.
      await setTime(at('08:41'), tech.page, desk.page);
      await stepRow(tech.page, 'coilset').locator('button.tick', { hasText: 'Done' }).waitFor();
      for (const key of ['coilset', 'covers', 'cushionset', 'hygiene']) await tickStep(tech.page, key);
      assert.equal(await boardCard(desk.page, 'MR 1').getAttribute('data-state'), 'turning over', 'not ready before the tech closes it');

      await tech.page.getByRole('button', { name: 'Turnover complete' }).click();
      await tech.page.getByText('Turnover after RT-1 complete at 08:41: MR 1 shows ready on the board.').waitFor();
      await boardCard(desk.page, 'MR 1', 'ready').waitFor();
      assert.equal(await desk.page.evaluate(() => (globalThis as unknown as { boardNeverReloaded?: boolean }).boardNeverReloaded), true, 'the board was not reloaded');
      assert.match(await boardCard(desk.page, 'MR 1').innerText(), /Ready since\s+08:41/);
      await screenshot(desk.page, 'rooms-now-ready-frontdesk-desktop');

      await desk.page.getByRole('button', { name: 'Wall display' }).click();
      await desk.page.waitForURL(/display=wall/);
      await boardCard(desk.page, 'MR 1', 'ready').and(desk.page.locator('.wall')).waitFor();
      assert.equal(await desk.page.getByRole('button', { name: 'Patient arrived' }).count(), 0, 'the wall display has no controls');
      await screenshot(desk.page, 'rooms-now-wall-frontdesk-desktop');

      await tech.page.getByRole('tab', { name: 'Cleaning log' }).click();
      await tech.page.getByLabel('Room').selectOption({ label: 'MR 1' });
      const entry = (step: string) => tech.page.locator('tr.mat-mdc-row').filter({ has: tech.page.locator('.mat-column-step', { hasText: step }) });
      await entry('Bore, from both ends').waitFor();
      const bore = await entry('Bore, from both ends').innerText();
      assert.match(bore, new RegExp(TECH_NAME), 'who');
      assert.match(bore, /Sporicidal wipe/, 'product used');
      // Required: the sporicidal wipe's 4 min contact (demo product, product brief). Achieved: 08:31 tick to the 08:41 close.
      assert.match(bore, /4 min \/ 10 min/, 'contact required and achieved');
      // The table was needed dry by the sheet at 08:31, the same minute: 0 of 2 min, shown short.
      assert.match(await entry('Table top and rails').innerText(), /2 min \/ 0 min/);
      assert.equal(await entry('Table top and rails').locator('.contact.short').count(), 1);
      assert.match(await entry('Fresh sheet and pillow').innerText(), new RegExp(EARLY), 'the early reason is logged');
      await tech.page.locator('tr.mat-mdc-row', { hasText: 'turnover complete' }).waitFor();
      await screenshot(tech.page, 'cleaning-log-tech-tablet');

      const logged = await server.db('cleaning_log').where({ day: DAY, kind: 'step', room_name: 'MR 1' }).select('step_key', 'username', 'early_reason');
      assert.equal(logged.length, 12, 'one entry per step of a plain MR turnover (12 steps, product brief)');
      assert.deepEqual(logged.filter((e) => e.early_reason !== null).map((e) => e.step_key), ['linen']);
    });
  });
});
