/// <reference lib="dom" />
import assert from 'node:assert/strict';
import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { after, before, describe, test } from 'node:test';
import type { Browser, Page } from 'playwright-core';
import type { PlannedDay } from '../../shared/api/plan';
import { axeViolations, describeViolation, installAxe } from './support/axe';
import { SCREENSHOT_DIR, TABLET, launchBrowser, openPage, screenshot, signIn } from './support/browser';
import { fontsSettled } from './support/in-page';
import { startTestServer, type TestServer } from './support/server';

/**
 * Mid-morning on the invented demo day (America/Chicago, UTC−6 on 2027-03-10): the demo seeds
 * its day list for this date, with every verdict, every precaution and an MR and a CT room.
 */
const NOW = new Date('2027-03-10T10:30:00-06:00');
const DAY = '2027-03-10';
const WIDE = { width: 1440, height: 900 };

/** Debian's poppler-utils (`.ci/run` installs it): PDF → PNG, PDF → text, and the PDF's page facts. */
const POPPLER = ['pdftoppm', 'pdftotext', 'pdfinfo'].map((tool) => `/usr/bin/${tool}`);
const missingPoppler = POPPLER.filter((tool) => !fs.existsSync(tool));
const skipPdf = missingPoppler.length > 0 ? `needs poppler-utils (apt-get install -y poppler-utils); missing ${missingPoppler.join(', ')}` : false;

let server: TestServer;
let browser: Browser;
let workDir: string;

/** Opens the day sheet the way people do: from the Day plan's "Print day sheet". */
async function openSheet(viewport: typeof WIDE): Promise<{ page: Page; close(): Promise<void>; plan: PlannedDay }> {
  const { context, page } = await openPage(browser, viewport);
  await context.clock.setFixedTime(NOW);
  try {
    await installAxe(context);
    await signIn(page, server.baseUrl, 'charge');
    await page.goto(`${server.baseUrl}/day/${DAY}`);
    await page.getByRole('link', { name: 'Print day sheet' }).click();
    await page.waitForURL(`${server.baseUrl}/day/${DAY}/sheet`);
    await page.getByRole('heading', { level: 1, name: 'Day sheet' }).waitFor();
    await page.locator('tw-sheet-room').first().waitFor();
    const answer = await context.request.get(`${server.baseUrl}/api/days/${DAY}/plan`);
    assert.equal(answer.status(), 200);
    const plan = (await answer.json()) as PlannedDay;
    return { page, plan, close: () => context.close() };
  } catch (error) {
    await context.close();
    throw error;
  }
}

/** Chooses paper and orientation on the sheet and prints it to a PDF file, as the browser's print would. */
async function printPdf(page: Page, paper: 'A4' | 'Letter', orientation: 'Portrait' | 'Landscape'): Promise<string> {
  await page.getByRole('radiogroup', { name: 'Paper' }).getByRole('radio', { name: paper }).click();
  await page.getByRole('radiogroup', { name: 'Orientation' }).getByRole('radio', { name: orientation }).click();
  await page.waitForFunction((size) => document.head.querySelector('style[data-tw-page]')?.textContent?.includes(size), `${paper} ${orientation.toLowerCase()}`);
  await page.evaluate(fontsSettled);
  const file = path.join(workDir, `day-sheet-${paper}-${orientation}.pdf`.toLowerCase());
  // preferCSSPageSize: the sheet's own @page rule decides the paper, as a print dialog would take it.
  await page.pdf({ path: file, preferCSSPageSize: true });
  return file;
}

const run = (tool: string, args: string[]) => execFileSync(`/usr/bin/${tool}`, args, { encoding: 'utf8', timeout: 30_000 });

/** Pages and page size in points from pdfinfo, e.g. `{ pages: 3, width: 595.28, height: 841.89 }`. */
function pdfFacts(file: string): { pages: number; width: number; height: number } {
  const info = run('pdfinfo', [file]);
  const size = /Page size:\s+([\d.]+) x ([\d.]+) pts/.exec(info);
  const pages = /Pages:\s+(\d+)/.exec(info);
  assert.ok(size && pages, `pdfinfo answered:\n${info}`);
  return { pages: Number(pages[1]), width: Number(size[1]), height: Number(size[2]) };
}

/** Each page as a PNG beside the screenshots, for people to look at; answers the files. */
function pagesAsPng(file: string, name: string): string[] {
  const prefix = path.join(SCREENSHOT_DIR, name);
  fs.mkdirSync(SCREENSHOT_DIR, { recursive: true });
  for (const old of fs.readdirSync(SCREENSHOT_DIR).filter((entry) => entry.startsWith(`${name}-`))) fs.rmSync(path.join(SCREENSHOT_DIR, old));
  run('pdftoppm', ['-png', '-r', '80', file, prefix]);
  return fs.readdirSync(SCREENSHOT_DIR).filter((entry) => entry.startsWith(`${name}-`) && entry.endsWith('.png')).map((entry) => path.join(SCREENSHOT_DIR, entry));
}

/** What a reader of the printout must find: every room, the verdicts and isolation cases of the day, the cautions; no app chrome. */
function assertSheetText(text: string, plan: PlannedDay, where: string): void {
  for (const room of plan.rooms) assert.match(text, new RegExp(`^\\s*${room.name}\\b`, 'm'), `${where}: room ${room.name} heads its part`);
  const verdicts = new Set(plan.rooms.flatMap((room) => room.gaps.map((gap) => gap.verdict)));
  assert.ok(verdicts.has('short'), 'the demo day has a short gap');
  // The verdict chips print their word in capitals.
  for (const verdict of verdicts) assert.match(text, new RegExp(`\\b${verdict.toUpperCase()}\\b`), `${where}: verdict ${verdict} in words`);
  const shortBy = plan.rooms.flatMap((room) => room.gaps).find((gap) => gap.verdict === 'short')!.shortByMinutes;
  assert.match(text, new RegExp(`short by ${shortBy} min`), `${where}: minutes short`);
  assert.match(text, /ISOLATION: CONTACT PRECAUTIONS/, `${where}: an isolation case in words`);
  assert.match(text, /Person 1/, `${where}: steps by person`);
  const flat = text.replace(/\s+/g, ' ');
  assert.match(flat, /label contact time, your facility's infection-prevention policy and local codes always rule/, `${where}: the infection-control caution`);
  assert.match(flat, /the magnet is always on/, `${where}: the MR rule`);
  assert.match(flat, /Turnwise Demo Imaging Centre/, `${where}: the site`);
  for (const chrome of ['Back to the day plan', 'Rooms now', 'Sign out', 'Landscape']) assert.ok(!flat.includes(chrome), `${where}: no "${chrome}" on paper`);
}

describe('the day sheet: on screen and printed', { timeout: 240_000 }, () => {
  before(async () => {
    server = await startTestServer({ now: NOW });
    browser = await launchBrowser();
    workDir = fs.mkdtempSync(path.join(os.tmpdir(), 'turnwise-sheet-'));
  });
  after(async () => {
    await browser?.close();
    await server?.close();
    if (workDir) fs.rmSync(workDir, { recursive: true, force: true });
  });

  test('opens from the Day plan outside the shell, and reads at 1440 and 768 px (axe-clean)', { timeout: 90_000 }, async () => {
    const { page, plan, close } = await openSheet(WIDE);
    try {
      assert.equal(await page.locator('tw-shell, mat-toolbar, mat-sidenav').count(), 0, 'no app chrome around the sheet');
      assert.deepEqual(await page.locator('tw-sheet-room').evaluateAll((rooms) => rooms.map((room) => room.getAttribute('data-room'))), plan.rooms.map((room) => room.name));
      for (const size of [WIDE, TABLET]) {
        await page.setViewportSize(size);
        await screenshot(page, `day-sheet-${size.width}`);
        await page.screenshot({ path: path.join(SCREENSHOT_DIR, `day-sheet-${size.width}-whole.png`), fullPage: true, animations: 'disabled' });
        const overflow = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
        assert.equal(overflow, 0, `nothing runs off the side at ${size.width} px`);
        const violations = (await axeViolations(page)).map((violation) => describeViolation(`day sheet @${size.width}px`, violation));
        assert.deepEqual(violations, [], 'axe-core (WCAG 2.2 AA) finds nothing');
      }
    } finally {
      await close();
    }
  });

  test('prints on A4 portrait over several pages, every room and the cautions on them', { timeout: 90_000, skip: skipPdf }, async () => {
    const { page, plan, close } = await openSheet(WIDE);
    try {
      const pdf = await printPdf(page, 'A4', 'Portrait');
      const facts = pdfFacts(pdf);
      // A4 is 210 × 297 mm (ISO 216): 595.28 × 841.89 pt.
      assert.deepEqual([Math.round(facts.width), Math.round(facts.height)], [595, 842], 'A4 portrait paper');
      assert.ok(facts.pages > 1, `the demo day takes more than one A4 page (got ${facts.pages})`);
      assertSheetText(run('pdftotext', ['-layout', pdf, '-']), plan, 'A4 portrait');
      // A page in the middle of a room still says which room it is (the repeated header row, or the room's heading).
      const names = plan.rooms.map((room) => room.name);
      for (let at = 2; at <= facts.pages; at++) {
        const first = run('pdftotext', ['-layout', '-f', String(at), '-l', String(at), pdf, '-']).split('\n').map((line) => line.trim()).find(Boolean) ?? '';
        assert.ok(names.some((name) => first.startsWith(name)), `page ${at} starts with its room's name, not "${first}"`);
      }
      const pngs = pagesAsPng(pdf, 'day-sheet-a4-portrait');
      assert.equal(pngs.length, facts.pages, 'a PNG per page');
      for (const png of pngs) assert.ok(fs.statSync(png).size > 10_000, `${path.basename(png)} has something on it`);
    } finally {
      await close();
    }
  });

  test('prints on Letter landscape', { timeout: 90_000, skip: skipPdf }, async () => {
    const { page, plan, close } = await openSheet(WIDE);
    try {
      const pdf = await printPdf(page, 'Letter', 'Landscape');
      const facts = pdfFacts(pdf);
      // US Letter is 8.5 × 11 in: 792 × 612 pt on its side.
      assert.deepEqual([Math.round(facts.width), Math.round(facts.height)], [792, 612], 'Letter landscape paper');
      assertSheetText(run('pdftotext', ['-layout', pdf, '-']), plan, 'Letter landscape');
      const pngs = pagesAsPng(pdf, 'day-sheet-letter-landscape');
      assert.equal(pngs.length, facts.pages, 'a PNG per page');
    } finally {
      await close();
    }
  });
});
