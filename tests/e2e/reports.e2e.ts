import assert from 'node:assert/strict';
import fs from 'node:fs';
import { after, before, describe, test } from 'node:test';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import type { Checklist } from '../../shared/api/board';
import { EXAM_LIST_HEADER, toCsv } from '../fixtures/exam-lists';
import { installAxe, axeViolations, describeViolation } from './support/axe';
import { STEP_TIMEOUT_MS, TABLET, launchBrowser, screenshot, signIn } from './support/browser';
import { importDayList, xsrfHeader } from './support/day-api';
import { startTestServer, type TestServer } from './support/server';

/*
 * An invented two days before "today" (Wed 3 March 2027, America/Chicago, −06:00): Monday's list
 * in MR 1 and MR 2 with one turnover recorded after A-1 (08:30 → 09:20), Tuesday's with a short
 * gap that a move then fixes. The Reports screen opens on the last seven days, which hold both.
 */
const MON = '2027-03-01';
const TUE = '2027-03-02';
const at = (day: string, hhmm: string) => new Date(`${day}T${hhmm}:00-06:00`);
const row = (acc: string, room: string, start: string, dur: number, precaution = 'none') =>
  [acc, room, start, String(dur), 'MR knee without contrast', 'knee', precaution, 'ambulatory', 'no', ''];
const WIDE = { width: 1440, height: 900 };

let server: TestServer;
let browser: Browser;

async function openSignedIn(viewport: { width: number; height: number }): Promise<{ context: BrowserContext; page: Page }> {
  const context = await browser.newContext({ viewport, locale: 'en-US', acceptDownloads: true });
  context.setDefaultTimeout(STEP_TIMEOUT_MS);
  context.setDefaultNavigationTimeout(2 * STEP_TIMEOUT_MS);
  await installAxe(context);
  const page = await context.newPage();
  await page.clock.setFixedTime(server.clock!.now());
  await signIn(page, server.baseUrl, 'charge');
  return { context, page };
}

describe('Reports: charts, their tables and CSV for a seeded week', { timeout: 180_000 }, () => {
  before(async () => {
    server = await startTestServer({ now: at(MON, '06:00'), seedDay: false });
    browser = await launchBrowser();
    const { context } = await openSignedIn(WIDE);
    try {
      const api = async (method: 'post' | 'patch', url: string, data: object) => {
        const response = await context.request[method](`${server.baseUrl}${url}`, { headers: await xsrfHeader(context), data });
        assert.ok(response.ok(), `${url}: ${response.status()} ${(await response.text()).slice(0, 300)}`);
        return response.json();
      };
      await importDayList(context, server.baseUrl, MON, toCsv([EXAM_LIST_HEADER, row('A-1', 'MR 1', '08:00', 30), row('A-2', 'MR 1', '09:30', 30), row('B-1', 'MR 2', '08:00', 45)]));
      await importDayList(context, server.baseUrl, TUE, toCsv([EXAM_LIST_HEADER, row('C-1', 'MR 1', '08:00', 30), row('C-2', 'MR 1', '08:35', 30)]));
      // A-1's turnover: finished 08:30, every step ticked once the surfaces it needs are dry, complete 09:20.
      server.clock!.set(at(MON, '08:30'));
      const a1 = await server.db('exams').where({ day: MON, accession: 'A-1' }).first('id');
      let checklist: Checklist = await api('post', `/api/exams/${a1.id}/finished`, {});
      for (const key of checklist.steps.map((s) => s.key)) {
        const step = checklist.steps.find((s) => s.key === key)!;
        const wetUntil = Math.max(0, ...step.needsDry.map((k) => Date.parse(checklist.steps.find((s) => s.key === k)!.wetUntil!)));
        if (wetUntil > server.clock!.now().getTime()) server.clock!.set(new Date(wetUntil));
        checklist = await api('post', `/api/turnovers/${checklist.turnoverId}/steps/${key}/done`, {});
      }
      server.clock!.set(at(MON, '09:20'));
      await api('post', `/api/turnovers/${checklist.turnoverId}/complete`, {});
      // Tuesday's short gap fixed by a drag.
      server.clock!.set(at(TUE, '07:00'));
      const c2 = await server.db('exams').where({ day: TUE, accession: 'C-2' }).first('id', 'version');
      await api('patch', `/api/exams/${c2.id}`, { start: `${TUE}T10:00:00-06:00`, version: c2.version, reason: 'drag' });
    } finally {
      await context.close();
    }
    server.clock!.set(at('2027-03-03', '12:00'));
  });
  after(async () => {
    await browser?.close();
    await server?.close();
  });

  test('charts with their tables at 1440 px, a CSV export, and no axe violations', async () => {
    const { context, page } = await openSignedIn(WIDE);
    try {
      await page.goto(`${server.baseUrl}/reports`);
      const rooms = page.getByRole('region', { name: 'Turnover minutes by room' });
      await rooms.locator('tbody tr').first().waitFor();
      assert.match(await page.locator('.range').innerText(), /25 Feb 2027 to 3 Mar 2027: 7 days, 2 with a day list/);
      // MR 1: one turnover, 50 actual minutes (08:30 → 09:20)
      const mr1 = await rooms.locator('tbody tr').first().locator('th, td').allInnerTexts();
      assert.deepEqual([mr1[0], mr1[1], mr1[3], mr1[5]], ['MR 1', '1', '50', '50'], `MR 1's row: ${mr1.join(' | ')}`);
      assert.match(mr1[2]!, /^\d+$/, 'planned minutes from the plan');
      // Gaps: the short one as imported, none now (moved by a drag)
      const gaps = page.getByRole('region', { name: 'Gaps as imported and now' });
      assert.deepEqual(await gaps.locator('tbody tr').first().locator('th, td').allInnerTexts(), ['Short', '1', '0', '0']);
      const moves = page.getByRole('region', { name: 'Moves by reason' });
      assert.deepEqual(await moves.locator('tbody tr').first().locator('th, td').allInnerTexts(), ['drag', '1', '1']);
      // Every chart drawn beside its table: six charts (rooms, precautions, gaps, moves, room use, shift tasks)
      assert.equal(await page.locator('tw-report-panel canvas').count(), 6);
      for (const canvas of await page.locator('tw-report-panel canvas').all()) {
        const box = (await canvas.boundingBox())!;
        assert.ok(box.width > 200 && box.height > 150, `a chart is drawn at a readable size: ${JSON.stringify(box)}`);
      }
      await screenshot(page, 'reports-charge-1440');
      await page.screenshot({ path: `${await screenshot(page, 'reports-charge-1440')}`.replace('.png', '-full.png'), fullPage: true });

      const downloading = page.waitForEvent('download');
      await page.getByRole('link', { name: 'Export Turnover minutes by room as CSV' }).click();
      const download = await downloading;
      assert.equal(download.suggestedFilename(), 'turnover-rooms.csv');
      const csv = fs.readFileSync((await download.path())!, 'utf8');
      assert.match(csv, /^Room,Turnovers,Planned min,Actual min,Planned avg,Actual avg\r\nMR 1,1,\d+,50,\d+,50\r\n$/);

      const violations = await axeViolations(page);
      assert.deepEqual(violations.map((v) => describeViolation('reports @1440', v)), [], 'WCAG 2.2 AA on Reports');
    } finally {
      await context.close();
    }
  });

  test('a tablet (768 px) gets one column and the room filter narrows the numbers', async () => {
    const { context, page } = await openSignedIn(TABLET);
    try {
      await page.goto(`${server.baseUrl}/reports`);
      await page.getByRole('region', { name: 'Turnover minutes by room' }).locator('tbody tr').first().waitFor();
      const widths = await page.locator('tw-report-panel').evaluateAll((panels) => panels.map((p) => (p as unknown as { getBoundingClientRect(): { width: number; right: number } }).getBoundingClientRect()));
      assert.ok(widths.every((b) => b.right <= TABLET.width), `no panel runs off the screen: ${JSON.stringify(widths)}`);
      const scrollWidth = await page.evaluate(() => (globalThis as unknown as { document: { documentElement: { scrollWidth: number } } }).document.documentElement.scrollWidth);
      assert.ok(scrollWidth <= TABLET.width, `the page does not scroll sideways (${scrollWidth}px)`);
      await screenshot(page, 'reports-charge-768');
      await page.screenshot({ path: (await screenshot(page, 'reports-charge-768')).replace('.png', '-full.png'), fullPage: true });

      await page.getByLabel('Room', { exact: true }).selectOption({ label: 'MR 2' });
      await page.getByRole('region', { name: 'Turnover minutes by room' }).waitFor({ state: 'detached' });
      assert.match(await page.getByText('No turnover was completed in this range.').first().innerText(), /No turnover/);
      const use = page.getByRole('region', { name: 'Room use' });
      assert.deepEqual(await use.locator('tbody th').allInnerTexts(), ['MR 2']);
      const violations = await axeViolations(page);
      assert.deepEqual(violations.map((v) => describeViolation('reports @768', v)), [], 'WCAG 2.2 AA on Reports at tablet width');
    } finally {
      await context.close();
    }
  });
});
