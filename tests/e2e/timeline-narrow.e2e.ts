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
const row = (acc: string, room: string, start: string, dur: number) => [acc, room, start, String(dur), 'MR knee without contrast', 'knee', 'none', 'ambulatory', 'no', ''];
const at = (minutes: number) => `${String(Math.floor(minutes / 60)).padStart(2, '0')}:${String(minutes % 60).padStart(2, '0')}`;

/** Invented list: MR 1 books 30-min exams every 35 min from 08:00, so eleven short gaps in a row (20 min needed, 5 there). */
const LIST = toCsv([EXAM_LIST_HEADER, ...Array.from({ length: 12 }, (_, i) => row(`NW-${i + 1}`, 'MR 1', at(8 * 60 + i * 35), 30)), row('NW-20', 'MR 2', '08:00', 30)]);

let server: TestServer;
let browser: Browser;

describe('Day plan on narrow lanes, side panel open', { timeout: 120_000 }, () => {
  before(async () => {
    server = await startTestServer();
    browser = await launchBrowser();
  });
  after(async () => {
    await browser?.close();
    await server?.close();
  });

  for (const [name, viewport] of [['1440', WIDE], ['768', TABLET]] as const) {
    test(`at ${name} px, whole day, Changes open: badges never cover each other and slots stay readable`, { timeout: 60_000 }, async () => {
      const { context, page } = await openPage(browser, viewport);
      try {
        await signIn(page, server.baseUrl, 'scheduler');
        await importDayList(context, server.baseUrl, DAY, LIST);
        await page.goto(`${server.baseUrl}/day/${DAY}`);
        await page.getByRole('heading', { level: 1, name: 'Day plan' }).waitFor();
        await page.locator('.zoom button', { hasText: 'Whole day' }).click();
        await page.getByRole('button', { name: 'Changes' }).click();
        await page.getByRole('region', { name: 'Changes to this day' }).waitFor();
        await page.locator('tw-gap-marker .badge').first().waitFor();
        await screenshot(page, `day-plan-narrow-badges-${name}`);

        const layout = await page.evaluate(() => {
          const lanes = Array.from(document.querySelectorAll('tw-room-lane'));
          const badges = lanes.map((lane) => Array.from(lane.querySelectorAll('tw-gap-marker .badge')).map((b) => b.getBoundingClientRect()));
          const blocks = Array.from(document.querySelectorAll('tw-exam-block')).map((b) => b.getBoundingClientRect().width);
          const counted = Array.from(document.querySelectorAll('tw-gap-marker .badge .more')).reduce((n, m) => n + Number(m.textContent!.replace(/\D/g, '')), 0);
          return { badges, narrowest: Math.min(...blocks), counted };
        });
        for (const lane of layout.badges) {
          const sorted = [...lane].sort((a, b) => a.left - b.left);
          for (let i = 1; i < sorted.length; i++) assert.ok(sorted[i]!.left >= sorted[i - 1]!.right, `badge ${i} starts at ${sorted[i]!.left}, the one before ends at ${sorted[i - 1]!.right}`);
        }
        // Every one of MR 1's eleven short gaps is drawn or counted on a badge.
        assert.equal(layout.badges[0]!.length + layout.counted, 11);
        assert.ok(layout.narrowest >= 44, `the narrowest slot is ${layout.narrowest} px wide`);
      } finally {
        await context.close();
      }
    });
  }
});
