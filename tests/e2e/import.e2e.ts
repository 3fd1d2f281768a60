import assert from 'node:assert/strict';
import { after, before, describe, test } from 'node:test';
import type { Browser } from 'playwright-core';
import { EXAM_LIST_HEADER, toCsv } from '../fixtures/exam-lists';
import { DESKTOP, launchBrowser, openPage, screenshot, signIn } from './support/browser';
import { startTestServer, type TestServer } from './support/server';
import { recordRequests } from './support/watch';

const DAY = '2027-03-10';
const row = (acc: string, room: string, start: string, dur: number, precaution = 'none') =>
  [acc, room, start, String(dur), 'MR knee without contrast', 'knee', precaution, 'ambulatory', 'no', ''];

/** An invented list: in MR 1 a 10-minute gap where the default protocol needs 20 (short by 10). */
const GOOD = toCsv([
  EXAM_LIST_HEADER,
  row('E2E-1', 'MR 1', '08:00', 30),
  row('E2E-2', 'MR 1', '08:40', 30),
  row('E2E-3', 'MR 1', '09:40', 30),
  row('E2E-4', 'MR 2', '08:00', 45),
]);
const BAD = toCsv([EXAM_LIST_HEADER, row('E2E-1', 'MR 9', '08:00', 30), row('E2E-2', 'MR 1', '25:00', 30)]);

let server: TestServer;
let browser: Browser;

describe('import in the browser', { timeout: 60_000 }, () => {
  before(async () => {
    server = await startTestServer();
    browser = await launchBrowser();
  });
  after(async () => {
    await browser?.close();
    await server?.close();
  });

  test('a scheduler sees every problem of a bad file, then previews and imports a good one and finds the short gap', { timeout: 45_000 }, async () => {
    const { context, page } = await openPage(browser, DESKTOP);
    const requests = recordRequests(context);
    try {
      await signIn(page, server.baseUrl, 'scheduler');
      await page.goto(`${server.baseUrl}/import?date=${DAY}`);
      await page.getByRole('heading', { level: 1, name: 'Import' }).waitFor();
      const fileInput = page.locator('input[type="file"]');

      await fileInput.setInputFiles({ name: 'bad.csv', mimeType: 'text/csv', buffer: Buffer.from(BAD) });
      await page.getByRole('heading', { name: /The file was not imported: 2 problems/ }).waitFor();
      const problems = await page.getByRole('list', { name: 'Problems in the file' }).innerText();
      assert.match(problems, /MR 9/);
      assert.match(problems, /25:00/);
      await screenshot(page, 'import-refused');
      assert.equal((await server.db('exams').where({ day: DAY }).count({ n: '*' }))[0]!['n'], 0, 'nothing was imported');

      await page.reload();
      await page.locator('input[type="file"]').setInputFiles({ name: 'good.csv', mimeType: 'text/csv', buffer: Buffer.from(GOOD) });
      await page.getByRole('heading', { name: /Preview of good\.csv/ }).waitFor();
      await page.getByText(/Gaps the new list would have/).waitFor();
      assert.match(await page.locator('main').innerText(), /short/i);
      await screenshot(page, 'import-preview');

      await page.getByRole('button', { name: /Import 4 exams/ }).click();
      await page.getByRole('heading', { name: /Imported 4 exams/ }).waitFor();
      assert.equal((await server.db('exams').where({ day: DAY }).count({ n: '*' }))[0]!['n'], 4);

      await page.getByRole('link', { name: 'Open the day plan' }).click();
      await page.waitForURL(/\/day/);
      await page.getByText(/short by 10 min/).first().waitFor();
      await screenshot(page, 'import-then-day-plan');
      requests.assertAllLocal();
    } finally {
      await context.close();
    }
  });
});
