import assert from 'node:assert/strict';
import { after, before, describe, test } from 'node:test';
import type { Browser, Page } from 'playwright-core';
import { choose, chosen, submitDialog } from './support/forms';
import { axeViolations, describeViolation, installAxe } from './support/axe';
import { launchBrowser, openPage, screenshot, signIn, signOut } from './support/browser';
import { startTestServer, type TestServer } from './support/server';
import { recordConsoleErrors } from './support/watch';

const WIDE = { width: 1440, height: 900 };
const TABLET = { width: 768, height: 1024 };
const TABS = ['Rooms', 'Equipment', 'Users', 'Site', 'Audit', 'Products', 'Protocols', 'Shift tasks'];
const FIRST_PASSWORD = 'first-password-for-ava';
const OWN_PASSWORD = 'avas-own-password-2027';

let server: TestServer;
let browser: Browser;

before(async () => {
  server = await startTestServer();
  browser = await launchBrowser();
});
after(async () => {
  await browser?.close();
  await server?.close();
});

describe('Setup', () => {
  test('an admin makes a CT room and a technologist; the technologist must change the password, then sees the room on Rooms now', async () => {
    const { context, page } = await openPage(browser, WIDE);
    // signed out the guard's probe answers 401, and the gated calls 403: Chromium logs both
    const errors = recordConsoleErrors(page, ({ text }) => /status of (401|403)\b/.test(text));
    try {
      await signIn(page, server.baseUrl, 'admin');
      await page.goto(`${server.baseUrl}/setup`);
      await page.getByRole('heading', { level: 1, name: 'Setup' }).waitFor();

      await page.getByRole('button', { name: 'Add a room' }).click();
      const roomDialog = page.getByRole('dialog');
      await roomDialog.getByLabel('Name').fill('CT 7');
      await choose(page, roomDialog, 'Modality', 'CT');
      await chosen(roomDialog, 'Modality', 'CT');
      await roomDialog.getByLabel('Air changes per hour').fill('15');
      await submitDialog(roomDialog, 'Add room');
      await page.getByRole('table', { name: 'Rooms' }).getByRole('cell', { name: 'CT 7', exact: true }).waitFor();

      await page.getByRole('tab', { name: 'Users' }).click();
      await page.getByRole('button', { name: 'Add a user' }).click();
      const userDialog = page.getByRole('dialog');
      await userDialog.getByLabel('Username').fill('ava');
      await userDialog.getByLabel('Display name').fill('Ava Lindqvist');
      await userDialog.getByLabel('E-mail').fill('ava@example.org');
      await choose(page, userDialog, 'Role', 'Technologist');
      await chosen(userDialog, 'Role', 'Technologist');
      await userDialog.getByLabel('First password').fill(FIRST_PASSWORD);
      await submitDialog(userDialog, 'Add user');
      await page.getByRole('table', { name: 'Users' }).getByRole('cell', { name: 'ava', exact: true }).waitFor();
      await signOut(page, server.baseUrl);

      // the new technologist's first sign-in goes to the profile, and nothing else answers yet
      await page.getByLabel('Username').fill('ava');
      await page.getByLabel('Password').fill(FIRST_PASSWORD);
      await page.getByRole('button', { name: 'Sign in', exact: true }).click();
      await page.waitForURL(`${server.baseUrl}/profile`);
      await page.getByText('Choose your own password to continue').waitFor();
      await page.goto(`${server.baseUrl}/rooms-now`);
      await page.waitForURL(`${server.baseUrl}/profile`);
      const gated = await page.context().request.get(`${server.baseUrl}/api/rooms`);
      assert.equal(gated.status(), 403);
      assert.equal((await gated.json()).error.code, 'password_change_required');

      await page.getByLabel('Current password').fill(FIRST_PASSWORD);
      await page.getByLabel('New password', { exact: true }).fill(OWN_PASSWORD);
      await page.getByLabel('New password again').fill(OWN_PASSWORD);
      await page.getByRole('button', { name: 'Change password' }).click();
      await page.waitForURL(`${server.baseUrl}/turnover`);

      await page.goto(`${server.baseUrl}/rooms-now`);
      await page.locator('tw-board-card', { hasText: 'CT 7' }).waitFor();
      assert.deepEqual(errors.errors, []);
    } finally {
      await context.close();
    }
  });

  test('every Setup tab at 1440 and 768 px (screenshots to look at)', async () => {
    for (const viewport of [WIDE, TABLET]) {
      const { context, page } = await openPage(browser, viewport);
      try {
        await signIn(page, server.baseUrl, 'admin');
        await page.goto(`${server.baseUrl}/setup`);
        for (const tab of TABS) {
          await page.getByRole('tab', { name: tab }).click();
          const panel = page.getByRole('tabpanel');
          if (['Rooms', 'Equipment', 'Users', 'Audit', 'Shift tasks'].includes(tab)) await panel.getByRole('table').locator('tbody tr').first().waitFor();
          if (tab === 'Site') await page.waitForFunction(`document.querySelector('input[formcontrolname="timezone"]')?.value === 'America/Chicago'`);
          await screenshot(page, `setup-${tab.toLowerCase().replace(' ', '-')}-${viewport.width}`);
        }
      } finally {
        await context.close();
      }
    }
  });

  test('an admin builds a shift task rule (next occurrences shown live) and edits an MR room’s week and zones, at 1440 and 768 px, axe-clean', async () => {
    for (const viewport of [WIDE, TABLET]) {
      const { context, page } = await openPage(browser, viewport);
      await installAxe(context);
      const found: string[] = [];
      const sweep = async (where: string) => {
        for (const violation of await axeViolations(page)) found.push(describeViolation(`${where} @${viewport.width}px`, violation));
      };
      try {
        await signIn(page, server.baseUrl, 'admin');
        await page.goto(`${server.baseUrl}/setup?tab=shift-tasks`);
        await page.getByRole('table', { name: 'Shift tasks' }).locator('tbody tr').first().waitFor();

        await page.getByRole('button', { name: 'Add shift task' }).click();
        const dialog = page.getByRole('dialog');
        await choose(page, dialog, 'Room', 'MR 1');
        await dialog.getByLabel('Task', { exact: true }).fill(`Coil cart wipe-down ${viewport.width}`);
        await choose(page, dialog, 'Repeats', 'Weekly');
        await dialog.getByRole('spinbutton', { name: 'Every' }).fill('2');
        await dialog.getByRole('checkbox', { name: 'Monday' }).check();
        await dialog.getByRole('checkbox', { name: 'Friday' }).check();
        await dialog.getByRole('heading', { name: /^Every 2 weeks on Monday and Friday at 07:00/ }).waitFor();
        const next = await dialog.locator('.preview .next li').allTextContents();
        assert.equal(next.length, 5);
        for (const when of next) assert.match(when, /^(Mon|Fri) \d{1,2} [A-Z][a-z]{2} \d{4}, 07:00$/);
        await sweep('shift task dialog');
        await screenshot(page, `setup-shift-task-dialog-${viewport.width}`);
        await submitDialog(dialog, 'Add task');
        await page.getByRole('cell', { name: `Coil cart wipe-down ${viewport.width}`, exact: true }).waitFor();
        await page.getByRole('row', { name: new RegExp(`Coil cart wipe-down ${viewport.width}`) }).getByText('Every 2 weeks on Monday and Friday at 07:00').waitFor();
        await screenshot(page, `setup-shift-tasks-added-${viewport.width}`);

        // at 768 px the tab row pages and Rooms is scrolled out of reach: open it by its link
        await page.goto(`${server.baseUrl}/setup?tab=rooms`);
        await page.getByRole('button', { name: 'Edit MR 1' }).click();
        const room = page.getByRole('dialog');
        await room.getByRole('group', { name: 'Opening hours' }).waitFor();
        await room.getByLabel('Sunday opens at').waitFor();
        await room.getByRole('group', { name: 'MR zones' }).waitFor();
        await sweep('room dialog (week, MR zones)');
        await screenshot(page, `setup-room-dialog-${viewport.width}`);
        await room.getByRole('button', { name: 'Cancel' }).click();
        await room.waitFor({ state: 'detached' });
        assert.deepEqual(found, []);
      } finally {
        await context.close();
      }
    }
  });
});
