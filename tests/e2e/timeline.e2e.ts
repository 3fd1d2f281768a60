import assert from 'node:assert/strict';
import { after, before, describe, test } from 'node:test';
import type { Browser, Page, Response } from 'playwright-core';
import { EXAM_LIST_HEADER, plainExamRow, toCsv } from '../fixtures/exam-lists';
import { DESKTOP, TABLET, screenshot } from './support/browser';
import { dayHistory } from './support/day-api';
import { importedDay, stopServerAndBrowser } from './support/imported-day';
import type { TestServer } from './support/server';
import { withSessions as withSessionsIn, type Session } from './support/sessions';
import { dragBy, examBlock, gapMarker, pxPerMinute, twoFrames } from './support/timeline';

const DAY = '2027-03-10';
/** The demo site's zone is America/Chicago: UTC−6 on 2027-03-10, before US daylight time starts on the second Sunday of March, the 14th (15 U.S.C. § 260a). */
const at = (hhmm: string) => Date.parse(`${DAY}T${hhmm}:00-06:00`);

/**
 * An invented day. With the default MR protocol a plain turnover needs 20 min (product brief), so:
 * MR 1 TL-1→TL-2 has 10 (short by 10), TL-2→TL-3 is wide; MR 2 has room to move TL-5 by keyboard;
 * MR 3 (two people in the demo centre, so 14 needed) TL-6→TL-7 has 5 (short by 9) and stays short
 * for the gap panel and its fixes.
 */
const DAY_LIST = toCsv([
  EXAM_LIST_HEADER,
  plainExamRow('TL-1', 'MR 1', '08:00', 30),
  plainExamRow('TL-2', 'MR 1', '08:40', 30),
  plainExamRow('TL-3', 'MR 1', '10:30', 30),
  plainExamRow('TL-4', 'MR 2', '08:00', 45),
  plainExamRow('TL-5', 'MR 2', '10:00', 30),
  plainExamRow('TL-6', 'MR 3', '08:00', 30),
  plainExamRow('TL-7', 'MR 3', '08:35', 30),
  plainExamRow('TL-8', 'CT 1', '08:00', 15),
]);

let server: TestServer;
let browser: Browser;

/** Opens the test day and waits until its lanes are drawn and its event stream is open. */
async function openDay(page: Page): Promise<void> {
  await page.goto(`${server.baseUrl}/day/${DAY}`);
  await page.getByRole('heading', { level: 1, name: 'Day plan' }).waitFor();
  await examBlock(page, 'TL-1').waitFor();
  // A change made before the stream is open would reach this page only on a reconnect.
  await page.locator('.live[data-live="live"]').waitFor();
}

const isPatch = (response: Response) => response.request().method() === 'PATCH' && new URL(response.url()).pathname.startsWith('/api/exams/');
const withSessions = (roles: Parameters<typeof withSessionsIn>[2], body: (...sessions: Session[]) => Promise<void>) =>
  withSessionsIn(browser, server.baseUrl, roles, body);
const stored = (accession: string) => server.db('exams').where({ day: DAY, accession }).first();

describe('day timeline in the browser', { timeout: 120_000 }, () => {
  before(async () => {
    ({ server, browser } = await importedDay('charge', DAY, DAY_LIST));
  });
  after(() => stopServerAndBrowser({ server, browser }));

  test('a mouse drag fixes a short gap, is saved and logged, and the front desk sees it live', { timeout: 45_000 }, async () => {
    await withSessions([['charge', DESKTOP], ['frontdesk', DESKTOP]], async (charge, desk) => {
      await openDay(charge.page);
      await openDay(desk.page);
      await gapMarker(charge.page, 'TL-2', 'short').and(charge.page.locator('[aria-label*="short by 10 min, needs 20, has 10"]')).waitFor();
      await gapMarker(desk.page, 'TL-2', 'short').waitFor();
      const before = await stored('TL-2');

      // 20 minutes and a bit: the drop snaps to 09:00, leaving TL-1 (ends 08:30) 30 min for its 20.
      const px = await pxPerMinute(examBlock(charge.page, 'TL-2'), 30);
      const patched = charge.page.waitForResponse(isPatch);
      await dragBy(charge.page, examBlock(charge.page, 'TL-2'), 21 * px);
      assert.equal((await patched).status(), 200, 'the server took the move');

      await examBlock(charge.page, 'TL-2').and(charge.page.locator('[aria-label*="09:00–09:30"]')).waitFor();
      await gapMarker(charge.page, 'TL-2', 'fits').waitFor();
      const after = await stored('TL-2');
      assert.equal(after.start_ms, at('09:00'), 'TL-2 is stored at 09:00');
      assert.equal(after.room_id, before.room_id, 'in the same room');
      assert.equal(after.version, before.version + 1, 'as a new version');

      const [latest] = await dayHistory(charge.context, server.baseUrl, DAY);
      assert.equal(latest?.reason, 'drag');
      assert.equal(latest?.username, 'charge');
      const move = latest?.changes[0];
      assert.ok(move?.type === 'move' && move.accession === 'TL-2', 'the history names the moved exam');
      assert.equal(Date.parse(move.from.start), at('08:40'));
      assert.equal(Date.parse(move.to.start), at('09:00'));

      // The front desk did not reload: the event stream told its page to fetch the day again.
      await gapMarker(desk.page, 'TL-2', 'fits').waitFor();
      await examBlock(desk.page, 'TL-2').and(desk.page.locator('[aria-label*="09:00–09:30"]')).waitFor();
      await desk.page.getByText('Updated by Jules Okoro').waitFor();
      const pageLoads = desk.requests.urls.filter((url) => new URL(url).pathname === `/day/${DAY}`);
      assert.equal(pageLoads.length, 1, "the front desk's day page was loaded once, never reloaded");
    });
  });

  test('a keyboard-only move: arrows step 5 minutes, Enter saves', { timeout: 30_000 }, async () => {
    await withSessions([['charge', DESKTOP]], async ({ context, page }) => {
      await openDay(page);
      await examBlock(page, 'TL-5').focus();
      await page.keyboard.press('ArrowRight');
      await page.keyboard.press('ArrowRight');
      await page.locator('.move-status').getByText(/Enter saves, Escape cancels/).waitFor();
      assert.equal((await stored('TL-5')).start_ms, at('10:00'), 'nothing is saved before Enter');

      const patched = page.waitForResponse(isPatch);
      await page.keyboard.press('Enter');
      assert.equal((await patched).status(), 200);
      await examBlock(page, 'TL-5').and(page.locator('[aria-label*="10:10–10:40"]')).waitFor();
      // The keyboard stays on the block it moved.
      await page.locator('.tw-exam-block:focus[aria-label*=", TL-5, "]').waitFor();

      assert.equal((await stored('TL-5')).start_ms, at('10:10'), 'TL-5 is stored 10 minutes later');
      const [latest] = await dayHistory(context, server.baseUrl, DAY);
      assert.equal(latest?.reason, 'keyboard');
      assert.ok(latest?.changes[0]?.type === 'move' && latest.changes[0].accession === 'TL-5');
    });
  });

  test('a technologist sees the timeline read-only: no Undo, and neither a drag nor the keyboard moves a slot', { timeout: 30_000 }, async () => {
    await withSessions([['tech', DESKTOP]], async ({ page, requests }) => {
      await openDay(page);
      await page.getByRole('button', { name: 'Changes' }).waitFor();
      assert.equal(await page.getByRole('button', { name: 'Undo' }).count(), 0, 'no Undo button');
      assert.equal(await page.locator('.tw-exam-block.movable').count(), 0, 'no block offers itself as movable');

      const block = examBlock(page, 'TL-3');
      const px = await pxPerMinute(block, 30);
      await dragBy(page, block, 21 * px);
      await block.focus();
      await page.keyboard.press('ArrowRight');
      await page.keyboard.press('Enter');
      // Both a drop and Enter send their PATCH within the frame that handles them.
      await page.evaluate(twoFrames);

      assert.deepEqual(requests.urls.filter((url) => new URL(url).pathname.startsWith('/api/exams/')), [], 'no request to move an exam');
      assert.equal(await page.locator('.tw-exam-block.moving').count(), 0, 'no block is shown mid-move');
      assert.equal(await page.locator('.move-status.shown').count(), 0, 'no move is announced');
      await block.and(page.locator('[aria-label*="10:30–11:00"]')).waitFor();
      assert.equal((await stored('TL-3')).start_ms, at('10:30'), 'TL-3 stays at 10:30');
    });
  });

  for (const [name, viewport] of [['desktop', DESKTOP], ['tablet', TABLET]] as const) {
    test(`screenshots on a ${name}: the timeline and a short gap's panel with its fixes`, { timeout: 30_000 }, async () => {
      await withSessions([['charge', viewport]], async ({ page }) => {
        await openDay(page);
        await gapMarker(page, 'TL-7', 'short').and(page.locator('[aria-label*="short by 9 min, needs 14, has 5"]')).waitFor();
        await screenshot(page, `timeline-${name}`);

        await gapMarker(page, 'TL-7').click();
        const panel = page.getByRole('region', { name: 'Turnover before TL-7' });
        await panel.getByText('short by 9 min').waitFor();
        await panel.locator('.tw-fix-card').first().waitFor();
        await panel.getByRole('heading', { name: 'Suggested fixes' }).scrollIntoViewIfNeeded();
        await screenshot(page, `timeline-gap-panel-${name}`);
      });
    });
  }
});
