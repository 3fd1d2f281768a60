/// <reference lib="dom" />
import { DateTime } from 'luxon';
import assert from 'node:assert/strict';
import { after, before, describe, test } from 'node:test';
import type { Browser, Locator, Page } from 'playwright-core';
import { EXAM_LIST_HEADER, plainExamRow, toCsv } from '../fixtures/exam-lists';
import { axeViolations, describeViolation, installAxe } from './support/axe';
import { TABLET, openPage, screenshot, signIn } from './support/browser';
import { importDayList } from './support/day-api';
import { serverAndBrowser, stopServerAndBrowser } from './support/imported-day';
import type { TestServer } from './support/server';
import { gapMarker } from './support/timeline';

const WIDE = { width: 1440, height: 900 };

/**
 * Invented lists: MR 2's patient leaves at 09:52, MR 1's at 10:00, MR 1's next is booked at 10:29.
 * With one aide for both rooms (3 minutes' walk) MR 1's turnover is short by 6 minutes.
 */
const listFor = (prefix: string) =>
  toCsv([EXAM_LIST_HEADER, plainExamRow(`${prefix}-1`, 'MR 1', '09:00', 60), plainExamRow(`${prefix}-2`, 'MR 1', '10:29', 30), plainExamRow(`${prefix}-3`, 'MR 2', '09:00', 52), plainExamRow(`${prefix}-4`, 'MR 2', '10:20', 30)]);

let server: TestServer;
let browser: Browser;

const dialog = (page: Page) => page.getByRole('dialog');
const rosterRow = (page: Page, n: number): Locator => dialog(page).locator('li.row').nth(n);

describe('the roster: a charge technologist says who is on shift and sees the clash between rooms', { timeout: 240_000 }, () => {
  before(async () => {
    ({ server, browser } = await serverAndBrowser());
  });
  after(() => stopServerAndBrowser({ server, browser }));

  for (const [name, viewport, day, prefix] of [['1440', WIDE, '2027-03-16', 'RS'], ['768', TABLET, '2027-03-17', 'RT']] as const) {
    test(`at ${name} px: a 422 under its field, then one aide for MR 1 and MR 2 makes MR 1 short, and the gap says why`, { timeout: 120_000 }, async () => {
      const { context, page } = await openPage(browser, viewport);
      try {
        await installAxe(context);
        await signIn(page, server.baseUrl, 'charge');
        await importDayList(context, server.baseUrl, day, listFor(prefix));
        await page.goto(`${server.baseUrl}/day/${day}`);
        await page.getByRole('heading', { level: 1, name: 'Day plan' }).waitFor();
        await gapMarker(page, `${prefix}-2`, 'fits').waitFor();

        await page.getByRole('button', { name: 'Roster' }).click();
        await dialog(page).getByRole('heading', { name: `Roster for ${DateTime.fromISO(day, { locale: 'en-GB' }).toFormat('cccc d LLLL yyyy')}` }).waitFor();
        await dialog(page).getByText('No roster for this day').waitFor();
        await dialog(page).getByRole('button', { name: 'Count of aides' }).click();
        const first = rosterRow(page, 0);
        await first.getByLabel('How many', { exact: true }).fill('1');
        await first.getByLabel('Start', { exact: true }).fill('07:00');
        await first.getByLabel('End', { exact: true }).fill('15:00');
        await first.getByLabel('Rooms covered', { exact: true }).click();
        await page.getByRole('option', { name: 'MR 1' }).click();
        await page.getByRole('option', { name: 'MR 2' }).click();
        await page.keyboard.press('Escape');
        // A break outside the shift: the server's 422 shows under the break's field.
        await first.getByRole('button', { name: 'Break' }).click();
        await first.getByLabel('Break from', { exact: true }).fill('06:00');
        await first.getByLabel('to', { exact: true }).fill('06:30');
        await dialog(page).getByRole('button', { name: 'Save roster' }).click();
        const breakError = first.locator('mat-form-field', { has: page.getByLabel('Break from', { exact: true }) }).locator('mat-error');
        await breakError.filter({ hasText: 'the break is outside the shift (07:00–15:00)' }).waitFor();
        await screenshot(page, `roster-dialog-422-${name}`);
        const violations = (await axeViolations(page)).map((v) => describeViolation(`roster dialog @${name}px`, v));
        assert.deepEqual(violations, []);
        assert.equal(await server.db('day_rosters').where({ day }).first(), undefined);

        await first.getByRole('button', { name: /Remove break 1/ }).click();
        await dialog(page).getByRole('button', { name: 'Save roster' }).click();
        await dialog(page).waitFor({ state: 'detached' });

        // MR 1's next patient: short by 6 min, the aide busy in MR 2 until 10:12.
        await gapMarker(page, `${prefix}-2`, 'short').click();
        await page.getByText('Short by 6 min: Aide 1 is in MR 2 until 10:12').waitFor();
        await screenshot(page, `roster-gap-panel-${name}`);
        const history = await server.db('plan_changes').where({ day, reason: 'roster' });
        assert.equal(history.length, 1);
      } finally {
        await context.close();
      }
    });
  }

  test('an admin sets the weekly roster in Setup → Rooms (the tab row still fits at 768 px)', { timeout: 90_000 }, async () => {
    const { context, page } = await openPage(browser, TABLET);
    try {
      await installAxe(context);
      await signIn(page, server.baseUrl, 'admin');
      await page.goto(`${server.baseUrl}/setup`);
      await page.getByRole('button', { name: 'Weekly roster' }).click();
      await dialog(page).getByRole('heading', { name: 'Weekly roster' }).waitFor();
      await dialog(page).getByRole('radio', { name: 'Wednesday' }).click();
      await dialog(page).getByRole('button', { name: 'Person' }).click();
      await rosterRow(page, 0).getByLabel('Name', { exact: true }).fill('Sam Example');
      await rosterRow(page, 0).getByLabel('Rooms covered', { exact: true }).click();
      await page.getByRole('option', { name: 'CT 1' }).click();
      await page.keyboard.press('Escape');
      await dialog(page).getByRole('button', { name: 'Save Wednesday' }).click();
      await dialog(page).getByText('Saved the Wednesday roster.').waitFor();
      await screenshot(page, 'roster-weekly-768');
      const violations = (await axeViolations(page)).map((v) => describeViolation('weekly roster @768px', v));
      assert.deepEqual(violations, []);
      const stored = await server.db('weekly_rosters').where({ weekday: 3 }).first();
      assert.match(String(stored.rows), /Sam Example/);
    } finally {
      await context.close();
    }
  });
});
