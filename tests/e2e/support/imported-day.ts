import type { Browser, BrowserContext } from 'playwright-core';
import type { Role } from '../../../shared/api/auth';
import { launchBrowser, openPage, signIn } from './browser';
import { importDayList } from './day-api';
import { startTestServer, type TestServer } from './server';

/** The real server and a Chromium to drive it; end both with {@link stopServerAndBrowser}. */
export interface ServerAndBrowser {
  server: TestServer;
  browser: Browser;
}

/**
 * The real server with the demo centre but no demo day list (each test imports its own invented
 * days), and a browser. If the browser does not start, the server is closed before the error goes on.
 * @example before(async () => ({ server, browser } = await serverAndBrowser()));
 */
export async function serverAndBrowser(): Promise<ServerAndBrowser> {
  const server = await startTestServer({ seedDay: false });
  try {
    return { server, browser: await launchBrowser() };
  } catch (error) {
    await server.close();
    throw error;
  }
}

/**
 * {@link serverAndBrowser}, then, signed in as `role` in a context of its own (closed after), imports
 * `csv` as the list of `date` and runs `then` (e.g. to save a roster) with that context.
 * On any failure both are ended before the error goes on.
 * @example before(async () => ({ server, browser } = await importedDay('charge', DAY, DAY_LIST)));
 */
export async function importedDay(
  role: Role,
  date: string,
  csv: string,
  then?: (context: BrowserContext, server: TestServer) => Promise<void>,
): Promise<ServerAndBrowser> {
  const started = await serverAndBrowser();
  const { server, browser } = started;
  try {
    const { context, page } = await openPage(browser);
    try {
      await signIn(page, server.baseUrl, role);
      await importDayList(context, server.baseUrl, date, csv);
      await then?.(context, server);
    } finally {
      await context.close();
    }
    return started;
  } catch (error) {
    await stopServerAndBrowser(started);
    throw error;
  }
}

/** Closes the browser, then the server; either may be missing when `before` failed early. */
export async function stopServerAndBrowser({ server, browser }: Partial<ServerAndBrowser>): Promise<void> {
  await browser?.close();
  await server?.close();
}
