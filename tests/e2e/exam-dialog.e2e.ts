/// <reference lib="dom" />
import assert from 'node:assert/strict';
import { after, before, describe, test } from 'node:test';
import type { Browser, Locator, Page } from 'playwright-core';
import { EXAM_LIST_HEADER, plainExamRow, toCsv } from '../fixtures/exam-lists';
import { TABLET, openPage, screenshot, signIn } from './support/browser';
import { importDayList } from './support/day-api';
import { serverAndBrowser, stopServerAndBrowser } from './support/imported-day';
import type { TestServer } from './support/server';
import { examBlock } from './support/timeline';

const WIDE = { width: 1440, height: 900 };

/** Invented lists, one day per screen width: ED-1 is the first exam of MR 1, reachable only from its block. */
const listFor = (prefix: string) =>
  toCsv([EXAM_LIST_HEADER, plainExamRow(`${prefix}-1`, 'MR 1', '08:00', 30), plainExamRow(`${prefix}-2`, 'MR 1', '09:00', 30), plainExamRow(`${prefix}-3`, 'MR 2', '08:00', 30)]);

let server: TestServer;
let browser: Browser;

const dialog = (page: Page) => page.getByRole('dialog');
const field = (page: Page, label: string): Locator => dialog(page).getByLabel(label, { exact: true });
const stored = (day: string, accession: string) => server.db('exams').where({ day, accession }).first();

describe('the exam dialog: add, edit and cancel from the timeline', { timeout: 180_000 }, () => {
  before(async () => {
    ({ server, browser } = await serverAndBrowser());
  });
  after(() => stopServerAndBrowser({ server, browser }));

  for (const [name, viewport, day, prefix] of [['1440', WIDE, '2027-03-10', 'ED'], ['768', TABLET, '2027-03-11', 'EE']] as const) {
    test(`at ${name} px: a scheduler adds an exam (a 422 under its field first), edits the lane's first exam from its block, cancels one by keyboard`, { timeout: 90_000 }, async () => {
      const { context, page } = await openPage(browser, viewport);
      try {
        await signIn(page, server.baseUrl, 'scheduler');
        await importDayList(context, server.baseUrl, day, listFor(prefix));
        await page.goto(`${server.baseUrl}/day/${day}`);
        await page.getByRole('heading', { level: 1, name: 'Day plan' }).waitFor();
        await examBlock(page, `${prefix}-1`).waitFor();

        // Add, with an accession the day already has: the server's 422 appears under Accession.
        await page.getByRole('button', { name: 'Add exam' }).click();
        await dialog(page).getByRole('heading', { name: `Add an exam to ${day}` }).waitFor();
        await field(page, 'Accession').fill(`${prefix}-1`);
        await field(page, 'Room').click();
        await page.getByRole('option', { name: 'MR 2' }).click();
        await field(page, 'Start').fill('11:00');
        await field(page, 'Duration (min)').fill('40');
        await field(page, 'Procedure').fill('MR shoulder without contrast');
        await dialog(page).getByRole('button', { name: 'Add exam' }).click();
        const accessionError = dialog(page).locator('mat-form-field', { has: page.getByLabel('Accession', { exact: true }) }).locator('mat-error');
        await accessionError.filter({ hasText: `Accession "${prefix}-1" is already on the list for ${day}.` }).waitFor();
        // The whole message shows: it wraps under the field instead of being cut at one line.
        const clipped = await accessionError.evaluate((error) => {
          const wrapper = error.closest('.mat-mdc-form-field-subscript-wrapper')!;
          return { error: error.scrollHeight, shown: wrapper.clientHeight, wrapperScroll: wrapper.scrollHeight };
        });
        assert.ok(clipped.wrapperScroll <= clipped.shown + 1 && clipped.error <= clipped.shown + 1, `the 422 message is cut: ${JSON.stringify(clipped)}`);
        await screenshot(page, `exam-dialog-422-${name}`);
        assert.equal(await stored(day, `${prefix}-9`), undefined);

        await field(page, 'Accession').fill(`${prefix}-9`);
        await dialog(page).getByRole('button', { name: 'Add exam' }).click();
        await dialog(page).waitFor({ state: 'detached' });
        await examBlock(page, `${prefix}-9`).waitFor();
        const added = await stored(day, `${prefix}-9`);
        assert.equal(added.duration_minutes, 40);

        // Edit the first exam of MR 1 from its own block (no gap before it to open a panel on).
        await examBlock(page, `${prefix}-1`).click();
        await dialog(page).getByRole('heading', { name: `Edit ${prefix}-1` }).waitFor();
        await screenshot(page, `exam-dialog-edit-${name}`);
        await field(page, 'Procedure').fill('MR knee with contrast');
        await field(page, 'Start').fill('07:45');
        await dialog(page).getByRole('button', { name: 'Save exam' }).click();
        await dialog(page).waitFor({ state: 'detached' });
        // The stored start first, then the block showing it: a failure says which side lagged.
        let saved = '';
        for (let i = 0; i < 75 && !saved.includes('T07:45'); i++) {
          saved = String((await stored(day, `${prefix}-1`)).start_at);
          if (!saved.includes('T07:45')) await page.waitForTimeout(200);
        }
        assert.match(saved, /T07:45/, 'the edited start is stored');
        await page.locator(`.tw-exam-block[aria-label*=", ${prefix}-1, "][aria-label*="07:45"]`).waitFor();
        assert.match(String((await stored(day, `${prefix}-1`)).procedure), /with contrast/);

        // Cancel MR 2's first exam from the keyboard: focus its block, Enter, then the cancel button.
        await examBlock(page, `${prefix}-3`).focus();
        await page.keyboard.press('Enter');
        await dialog(page).getByRole('heading', { name: `Edit ${prefix}-3` }).waitFor();
        await dialog(page).getByRole('button', { name: `Cancel exam ${prefix}-3` }).click();
        await dialog(page).waitFor({ state: 'detached' });
        await examBlock(page, `${prefix}-3`).waitFor({ state: 'detached' });
        assert.equal(await stored(day, `${prefix}-3`), undefined);
        await screenshot(page, `exam-dialog-after-${name}`);
      } finally {
        await context.close();
      }
    });
  }

  test('a technologist opens an exam from its block read-only', { timeout: 60_000 }, async () => {
    const { page } = await openPage(browser, WIDE);
    try {
      await signIn(page, server.baseUrl, 'tech');
      await page.goto(`${server.baseUrl}/day/2027-03-10`);
      await examBlock(page, 'ED-2').click();
      await dialog(page).getByRole('heading', { name: 'ED-2' }).waitFor();
      assert.equal(await field(page, 'Accession').isDisabled(), true);
      assert.equal(await dialog(page).getByRole('button', { name: /Save exam|Cancel exam/ }).count(), 0);
      await dialog(page).getByRole('button', { name: 'Close' }).click();
      await dialog(page).waitFor({ state: 'detached' });
    } finally {
      await page.context().close();
    }
  });
});
