/// <reference lib="dom" />
import assert from 'node:assert/strict';
import { after, before, describe, test } from 'node:test';
import type { Browser } from 'playwright-core';
import { EXAM_LIST_HEADER, toCsv } from '../fixtures/exam-lists';
import { TABLET, launchBrowser, openPage, screenshot, signIn } from './support/browser';
import { importDayList } from './support/day-api';
import { startTestServer, type TestServer } from './support/server';

const DAY = '2027-03-10';
const WIDE = { width: 1440, height: 900 };
const row = (acc: string, room: string, start: string, dur: number, precaution = 'none') =>
  [acc, room, start, String(dur), 'MR knee without contrast', 'knee', precaution, 'ambulatory', 'no', ''];

/** Invented list: MR 1 has a gap short by 10 at 08:40; MR 2 an air hold the next exam starts inside (09:00). */
const LIST = toCsv([
  EXAM_LIST_HEADER,
  row('PV-1', 'MR 1', '08:00', 30),
  row('PV-2', 'MR 1', '08:40', 30),
  row('PV-3', 'MR 1', '09:40', 30),
  row('PV-4', 'MR 2', '08:00', 30, 'airborne'),
  row('PV-5', 'MR 2', '09:00', 30),
  row('PV-6', 'CT 1', '08:00', 15),
]);

let server: TestServer;
let browser: Browser;

describe('Day plan and Import views at 1440 and 768 px', { timeout: 120_000 }, () => {
  before(async () => {
    server = await startTestServer();
    browser = await launchBrowser();
  });
  after(async () => {
    await browser?.close();
    await server?.close();
  });

  for (const [name, viewport] of [['1440', WIDE], ['768', TABLET]] as const) {
    test(`at ${name} px: Import lists the problem gaps and leads to them; the Day plan steps through problems and lists the patients to call`, { timeout: 60_000 }, async () => {
      const { context, page } = await openPage(browser, viewport);
      try {
        await signIn(page, server.baseUrl, 'scheduler');
        await page.goto(`${server.baseUrl}/import?date=${DAY}`);
        await page.getByRole('heading', { level: 1, name: 'Import' }).waitFor();
        await page.locator('input[type="file"]').setInputFiles({ name: 'list.csv', mimeType: 'text/csv', buffer: Buffer.from(LIST) });
        await page.getByRole('heading', { name: /Preview of list\.csv/ }).waitFor();
        await page.getByRole('heading', { name: 'Problem gaps (2)' }).waitFor();
        await screenshot(page, `import-preview-problems-${name}`);
        // The preview table is readable: the procedure takes at most two lines, and at 1440 px no column is cut off.
        const table = await page.locator('tw-import-preview table').evaluate((element) => {
          const procedure = element.querySelector('td.mat-column-procedure')!;
          const lineHeight = parseFloat(getComputedStyle(procedure).lineHeight);
          return { procedureLines: Math.round((procedure.clientHeight - 12) / lineHeight), overflow: element.scrollWidth - element.parentElement!.clientWidth };
        });
        assert.ok(table.procedureLines <= 2, `procedure on ${table.procedureLines} lines`);
        if (viewport === WIDE) assert.ok(table.overflow <= 0, `the table is ${table.overflow} px wider than its frame`);
        await page.locator('tw-problem-gap-list').scrollIntoViewIfNeeded();
        await screenshot(page, `import-preview-problems-list-${name}`);

        await page.getByRole('button', { name: /exams/ }).filter({ hasText: /Import|Replace/ }).click();
        await page.getByRole('heading', { name: /Imported 6 exams/ }).waitFor();
        await page.getByRole('link', { name: '09:00 before PV-5' }).click();
        await page.waitForURL(/\/day\/2027-03-10\?exam=PV-5/);
        await page.locator('tw-gap-panel').getByText('PV-5').first().waitFor();
        await page.getByText('Problem 2 of 2').waitFor();
        await screenshot(page, `day-plan-problem-from-import-${name}`);

        await page.getByRole('button', { name: 'Previous problem gap' }).click();
        await page.getByText('Problem 1 of 2').waitFor();
        const focused = await page.evaluate(() => document.activeElement?.getAttribute('data-gap-to'));
        assert.ok(focused, 'the keyboard is on the problem gap marker');

        // Move PV-2 later by keyboard: 2 × 5 min, Enter saves.
        const block = page.locator('[data-exam-id]', { hasText: 'PV-2' }).first();
        await block.focus();
        await page.keyboard.press('ArrowRight');
        await page.keyboard.press('ArrowRight');
        await page.keyboard.press('Enter');
        await page.getByRole('region', { name: /Patients to call/ }).getByText('PV-2: MR 1 08:40 → 08:50').waitFor();
        await screenshot(page, `day-plan-patients-to-call-${name}`);
      } finally {
        await context.close();
      }
    });
  }

  test('a list already on the day downloads in the import format', async () => {
    const { context, page } = await openPage(browser, WIDE);
    try {
      await signIn(page, server.baseUrl, 'scheduler');
      await importDayList(context, server.baseUrl, '2027-03-11', LIST.replace(/2027-03-10/g, '2027-03-11'));
      await page.goto(`${server.baseUrl}/import?date=2027-03-11`);
      const href = await page.locator('a.day-list').getAttribute('href');
      const csv = decodeURIComponent(href!.replace(/^data:text\/csv;charset=utf-8,/, ''));
      assert.match(csv, /^accession,room,start,duration_min,/);
      assert.match(csv, /PV-5,MR 2,09:00,30,/);
    } finally {
      await context.close();
    }
  });
});
