import assert from 'node:assert/strict';
import { after, before, describe, test } from 'node:test';
import type { Browser, Locator, Page } from 'playwright-core';
import type { DayPlan } from '../../shared/turnover/day-plan-types';
import { EXAM_LIST_HEADER, toCsv } from '../fixtures/exam-lists';
import { axeViolations, describeViolation, installAxe } from './support/axe';
import { choose, chosen, submitDialog } from './support/forms';
import { launchBrowser, openPage, screenshot, signOut, STEP_TIMEOUT_MS } from './support/browser';
import { startTestServer, type TestServer } from './support/server';
import { recordConsoleErrors } from './support/watch';

const WIDE = { width: 1440, height: 900 };
const TABLET = { width: 768, height: 1024 };
const ADMIN = { username: 'firstadmin', password: 'first-admin-password-1' };
const SCHEDULER = { username: 'sami', first: 'first-password-for-sami', own: 'samis-own-password-2027' };
const DAY = '2027-03-10';
const TABS = ['Rooms', 'Equipment', 'Users', 'Site', 'Audit', 'Products', 'Protocols', 'Shift tasks'];

/**
 * The protocol set up below, one person: "Wipe the table" 2 min hands-on with a 3 min contact
 * product and 1 min dry → dry at 2 + 3 + 1 = 6; "Fresh linen" needs it dry, 1 min → done at 7.
 * Derived by hand from the engine's rule (a step's surface is dry at its end + contact + dry).
 */
const REQUIRED = 7;

/** An invented list for the new CT room: a 5-minute gap (short by 2) and a 10-minute one. */
const row = (acc: string, start: string, dur: number) => [acc, 'CT 1', start, String(dur), 'CT head without contrast', '', 'none', 'ambulatory', 'no', ''];
const LIST = toCsv([EXAM_LIST_HEADER, row('NEW-1', '08:00', 15), row('NEW-2', '08:20', 20), row('NEW-3', '08:50', 20)]);

let server: TestServer;
let browser: Browser;

async function signInAs(page: Page, username: string, password: string): Promise<void> {
  await page.goto(`${server.baseUrl}/sign-in`);
  await page.getByLabel('Username').fill(username);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in', exact: true }).click();
}

async function addUser(page: Page, username: string, name: string, role: string, password: string): Promise<void> {
  await page.getByRole('button', { name: 'Add a user' }).click();
  const dialog = page.getByRole('dialog');
  await dialog.getByLabel('Username').fill(username);
  await dialog.getByLabel('Display name').fill(name);
  await dialog.getByLabel('E-mail').fill(`${username}@example.org`);
  await choose(page, dialog, 'Role', role);
  await chosen(dialog, 'Role', role);
  await dialog.getByLabel('First password').fill(password);
  await submitDialog(dialog, 'Add user');
}

describe('a new department from nothing', { timeout: 240_000 }, () => {
  before(async () => {
    server = await startTestServer({ demo: false, firstAdmin: ADMIN });
    browser = await launchBrowser();
  }, { timeout: 60_000 });
  after(async () => {
    await browser?.close();
    await server?.close();
  }, { timeout: 30_000 });

  test('an admin sets up a CT room, a product, a protocol and accounts; a scheduler imports a list and the plan follows that protocol', { timeout: 180_000 }, async () => {
    const { context, page } = await openPage(browser, WIDE);
    await installAxe(context);
    const inaccessible: string[] = [];
    const axe = async (where: string) => inaccessible.push(...(await axeViolations(page)).map((v) => describeViolation(where, v)));
    // signed out the guard's probe answers 401, a new account's gated calls 403; outside demo
    // mode the sign-in page's look-up of demo accounts answers 204, which logs nothing
    const errors = recordConsoleErrors(page, ({ text }) => /status of (401|403)\b/.test(text));
    try {
      await signInAs(page, ADMIN.username, ADMIN.password);
      await page.waitForURL(`${server.baseUrl}/day`);
      // where an admin lands: what is still missing
      const checklist = page.getByRole('region', { name: 'Setting up Turnwise' });
      await checklist.getByText('at least one room').waitFor();
      await screenshot(page, 'department-checklist-1440');
      await axe('setup checklist on the day plan');
      await checklist.getByRole('link', { name: 'Rooms' }).click();
      await page.waitForURL(/\/setup\?tab=rooms/);

      await page.getByRole('button', { name: 'Add a room' }).click();
      const roomDialog = page.getByRole('dialog');
      await roomDialog.getByLabel('Name').fill('CT 1');
      await choose(page, roomDialog, 'Modality', 'CT');
      await roomDialog.getByRole('button', { name: 'Add room' }).click();
      await roomDialog.waitFor({ state: 'detached' });

      await page.getByRole('tab', { name: 'Products' }).click();
      await page.getByRole('button', { name: 'Add a product' }).click();
      const productDialog = page.getByRole('dialog');
      await productDialog.getByLabel('Name').fill('Quat wipe (invented)');
      await productDialog.getByLabel('Label contact time (min)').fill('3');
      await productDialog.getByLabel('Stays wet for (min)').fill('1.5');
      // common practice, no source: kept wet for the whole contact time, so ⌈3 ÷ 1.5⌉ = 2 applications
      await productDialog.getByText(/wetted 2 times/).waitFor();
      await axe('product dialog');
      await productDialog.getByLabel('Stays wet for (min)').fill('');
      await productDialog.getByLabel('Registration number').fill('DEMO-0000-7');
      await productDialog.getByRole('button', { name: 'Add product' }).click();
      await productDialog.waitFor({ state: 'detached' });
      await page.getByRole('table', { name: 'Products' }).getByRole('cell', { name: /^Quat wipe \(invented\)/ }).waitFor();

      await page.getByRole('tab', { name: 'Protocols' }).click();
      await page.getByText('No protocol for CT').waitFor();
      await page.getByRole('button', { name: 'Add a protocol' }).click();
      const editor = page.getByRole('dialog');
      await choose(page, editor, 'Modality', 'CT');
      const first = editor.locator('[data-step="0"]').first();
      await first.getByLabel('Key').fill('wipe');
      await first.getByLabel('Label').fill('Wipe the table');
      await first.getByLabel('Hands-on (min)').fill('2');
      await first.getByLabel('Dry (min)').fill('1');
      await first.getByText("Disinfects (waits the product's contact time)").click();
      await choose(page, first, 'Product', 'Quat wipe (invented) (3 min)');
      await editor.getByRole('button', { name: 'Add step' }).click();
      const second = editor.locator('[data-step="1"]').first();
      await second.getByLabel('Label').fill('Fresh linen');
      await second.getByLabel('Hands-on (min)').fill('1');
      await choose(page, second, 'Add a need', 'after Wipe the table is dry');
      await second.getByText('after Wipe the table is dry').waitFor();
      await screenshot(page, 'department-protocol-editor-1440');
      await axe('protocol editor');

      await editor.getByRole('button', { name: 'Preview effect' }).click();
      const required = editor.getByRole('table', { name: 'Required minutes, before and after' });
      const routine = required.getByRole('row').filter({ hasText: 'Routine gap' });
      await routine.waitFor();
      assert.deepEqual(await routine.getByRole('cell').allInnerTexts(), ['CT', 'Routine gap', 'no protocol', `${REQUIRED} min`]);
      await axe('protocol editor with its effect preview');
      await editor.getByRole('button', { name: 'Save version' }).click();
      await editor.waitFor({ state: 'detached' });
      await page.getByRole('table', { name: 'Protocols' }).getByText(/Version 1, from/).waitFor();
      await page.getByRole('button', { name: 'Versions of the CT protocol' }).click();
      await page.getByRole('dialog').getByText('Wipe the table').first().waitFor();
      await screenshot(page, 'department-protocol-view-1440');
      await axe('protocol version view');
      await page.keyboard.press('Escape');
      await page.getByRole('dialog').waitFor({ state: 'detached' });

      await page.getByRole('tab', { name: 'Users' }).click();
      await addUser(page, 'tara', 'Tara Okafor', 'Technologist', 'first-password-for-tara');
      await addUser(page, SCHEDULER.username, 'Sami Brandt', 'Scheduler', SCHEDULER.first);
      await page.getByRole('table', { name: 'Users' }).getByRole('cell', { name: 'tara', exact: true }).waitFor();

      for (const viewport of [WIDE, TABLET]) {
        await page.setViewportSize(viewport);
        for (const tab of TABS) {
          await page.getByRole('tab', { name: tab }).click();
          const panel = page.getByRole('tabpanel');
          if (['Rooms', 'Users', 'Products', 'Protocols'].includes(tab)) await panel.getByRole('table').locator('tbody tr').first().waitFor();
          await screenshot(page, `department-setup-${tab.toLowerCase().replace(' ', '-')}-${viewport.width}`);
        }
      }
      await page.getByRole('tab', { name: 'Protocols' }).click();
      await page.getByRole('button', { name: 'New version of the CT protocol' }).click();
      await page.getByRole('dialog').locator('[data-step="1"]').first().waitFor();
      await screenshot(page, 'department-protocol-editor-768');
      await axe('protocol editor at 768 px');
      // keyboard only: Add step puts the keyboard in the new step's label, its needs are a select away
      await page.getByRole('dialog').getByRole('button', { name: 'Add step' }).focus();
      await page.keyboard.press('Enter');
      // the new step's label takes the keyboard once it is drawn; type only then
      await page.waitForFunction(() => document.activeElement?.tagName === 'INPUT' && !!document.activeElement.closest('[data-step="2"]'), undefined, { timeout: STEP_TIMEOUT_MS });
      await page.keyboard.type('Check the injector');
      const added = page.getByRole('dialog').locator('[data-step="2"]').first();
      assert.equal(await added.getByLabel('Label').inputValue(), 'Check the injector');
      await added.getByRole('combobox', { name: 'Add a need' }).focus();
      await page.keyboard.press('Enter');
      await page.keyboard.press('Enter');
      await added.getByRole('listitem').or(added.locator('mat-chip')).first().waitFor();
      assert.match(await added.locator('mat-chip').first().innerText(), /^after Wipe the table/);
      // Cancel by its button: on a loaded machine an Escape right after the select closes can land on the closing panel
      await page.getByRole('dialog').getByRole('button', { name: 'Cancel', exact: true }).click();
      await page.getByRole('dialog').waitFor({ state: 'detached' });
      await page.setViewportSize(WIDE);
      await signOut(page, server.baseUrl);

      // the scheduler's first sign-in: their own password, then the import
      await signInAs(page, SCHEDULER.username, SCHEDULER.first);
      await page.waitForURL(`${server.baseUrl}/profile`);
      await page.getByLabel('Current password').fill(SCHEDULER.first);
      await page.getByLabel('New password', { exact: true }).fill(SCHEDULER.own);
      await page.getByLabel('New password again').fill(SCHEDULER.own);
      await page.getByRole('button', { name: 'Change password' }).click();
      await page.waitForURL(`${server.baseUrl}/day`);
      assert.equal(await page.getByRole('region', { name: 'Setting up Turnwise' }).count(), 0, 'only an admin sees the setup checklist');

      await page.goto(`${server.baseUrl}/import?date=${DAY}`);
      await page.locator('input[type="file"]').setInputFiles({ name: 'ct.csv', mimeType: 'text/csv', buffer: Buffer.from(LIST) });
      await page.getByRole('button', { name: /Import 3 exams/ }).click();
      await page.getByRole('heading', { name: /Imported 3 exams/ }).waitFor();
      await page.getByRole('link', { name: 'Open the day plan' }).click();
      await page.waitForURL(/\/day/);
      // 5 min between NEW-1 and NEW-2 where the protocol needs 7
      await page.getByText(`short by ${REQUIRED - 5} min`).first().waitFor();
      await screenshot(page, 'department-day-plan-1440');

      const answer = await context.request.get(`${server.baseUrl}/api/days/${DAY}/plan`);
      assert.equal(answer.status(), 200);
      const body = (await answer.json()) as { plan?: DayPlan } & Partial<DayPlan>;
      const plan = (body.plan ?? body) as DayPlan;
      const room = plan.rooms.find((r) => r.name === 'CT 1')!;
      assert.equal(room.protocol?.modality, 'CT');
      assert.equal(room.protocol?.version, 1);
      const between = room.gaps.filter((g) => g.fromExamId !== null);
      assert.deepEqual(
        between.map((g) => [g.availableMinutes, g.requiredMinutes, g.verdict]),
        [
          [5, REQUIRED, 'short'],
          [10, REQUIRED, between[1]!.verdict],
        ],
      );
      assert.notEqual(between[1]!.verdict, 'short');
      assert.deepEqual(errors.errors, []);
      assert.deepEqual(inaccessible, []);
    } finally {
      await context.close();
    }
  });
});
