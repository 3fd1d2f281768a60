/// <reference lib="dom" />
import assert from 'node:assert/strict';
import { after, before, describe, test } from 'node:test';
import type { Browser } from 'playwright-core';
import { EXAM_LIST_HEADER, plainExamRow, toCsv } from '../fixtures/exam-lists';
import { TABLET, openPage, screenshot, signIn } from './support/browser';
import { importDayList } from './support/day-api';
import { serverAndBrowser, stopServerAndBrowser } from './support/imported-day';
import type { TestServer } from './support/server';
import { examBlock } from './support/timeline';

const WIDE = { width: 1440, height: 900 };

/**
 * Invented lists: in MR 1 the second exam starts 10 min after the first ends (short, a turnover
 * needs 20 with one person) and the third is back to back with it; MR 2 has room.
 */
const listFor = (p: string) =>
  toCsv([EXAM_LIST_HEADER, plainExamRow(`${p}-1`, 'MR 1', '08:00', 30), plainExamRow(`${p}-2`, 'MR 1', '08:40', 30), plainExamRow(`${p}-3`, 'MR 1', '09:20', 30), plainExamRow(`${p}-4`, 'MR 2', '08:00', 30)]);

let server: TestServer;
let browser: Browser;

describe('make the day fit: proposal, preview, apply and undo', { timeout: 240_000 }, () => {
  before(async () => {
    ({ server, browser } = await serverAndBrowser());
  });
  after(() => stopServerAndBrowser({ server, browser }));

  for (const [name, viewport, day, prefix] of [['1440', WIDE, '2027-03-10', 'FA'], ['768', TABLET, '2027-03-11', 'FB']] as const) {
    test(`at ${name} px: a charge technologist previews the proposal, applies it and undoes it`, { timeout: 120_000 }, async () => {
      const { context, page } = await openPage(browser, viewport);
      try {
        await signIn(page, server.baseUrl, 'charge');
        await importDayList(context, server.baseUrl, day, listFor(prefix));
        await page.goto(`${server.baseUrl}/day/${day}`);
        await page.getByRole('heading', { level: 1, name: 'Day plan' }).waitFor();
        await examBlock(page, `${prefix}-1`).waitFor();
        const before = await server.db('exams').where({ day }).orderBy('id').select('accession', 'room_id', 'start_at');

        await page.getByRole('button', { name: 'Make the day fit' }).click();
        const panel = page.getByRole('region', { name: 'Make the day fit' });
        await panel.waitFor({ timeout: 60_000 });
        await panel.getByText('Clears every short and overlapping gap').waitFor();
        assert.ok(await page.locator('.fit-ghost').count() >= 1, 'the old place of a moved exam is drawn');
        assert.ok(await page.locator('tw-exam-block.fit-proposed').count() >= 1, 'the new place is marked');
        await screenshot(page, `day-fit-proposal-${name}`);
        // Previewing saved nothing.
        assert.deepEqual(await server.db('exams').where({ day }).orderBy('id').select('accession', 'room_id', 'start_at'), before);

        await panel.getByRole('button', { name: 'Apply' }).click();
        await panel.waitFor({ state: 'detached' });
        assert.notDeepEqual(await server.db('exams').where({ day }).orderBy('id').select('accession', 'room_id', 'start_at'), before);
        await page.getByRole('button', { name: 'Undo' }).click();
        for (let i = 0; i < 50; i++) {
          const now = await server.db('exams').where({ day }).orderBy('id').select('accession', 'room_id', 'start_at');
          if (JSON.stringify(now) === JSON.stringify(before)) break;
          await page.waitForTimeout(200);
        }
        assert.deepEqual(await server.db('exams').where({ day }).orderBy('id').select('accession', 'room_id', 'start_at'), before);
        await screenshot(page, `day-fit-undone-${name}`);
      } finally {
        await context.close();
      }
    });
  }
});
