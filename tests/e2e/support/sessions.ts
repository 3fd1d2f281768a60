import assert from 'node:assert/strict';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import type { Role } from '../../../shared/api/auth';
import { DESKTOP, openPage, signIn } from './browser';
import { recordConsoleErrors, recordRequests, type ConsoleLog, type ExpectedConsoleError, type RequestLog } from './watch';

/** Signing in starts signed out: the guard's /api/auth/me probe answers 401 by design (as in foundation.e2e.ts). */
export const SIGNED_OUT_PROBE: ExpectedConsoleError = ({ text, sourceUrl }) =>
  new URL(sourceUrl || 'about:blank').pathname === '/api/auth/me' && /status of 401\b/.test(text);

/** A signed-in browser context with one page, and what it has logged and requested so far. */
export interface Session {
  context: BrowserContext;
  page: Page;
  requests: RequestLog;
  console: ConsoleLog;
}

/**
 * Runs `body` with one fresh signed-in session per `[role, viewport]` (each its own cookies, as two
 * people on two machines), then checks that none logged an error or reached off the machine.
 * @example await withSessions(browser, server.baseUrl, [['charge', DESKTOP], ['frontdesk', DESKTOP]], async (charge, desk) => { … });
 */
export async function withSessions(
  browser: Browser,
  baseUrl: string,
  roles: [Role, typeof DESKTOP][],
  body: (...sessions: Session[]) => Promise<void>,
): Promise<void> {
  const sessions: Session[] = [];
  try {
    for (const [role, viewport] of roles) {
      const { context, page } = await openPage(browser, viewport);
      sessions.push({ context, page, requests: recordRequests(context), console: recordConsoleErrors(page, SIGNED_OUT_PROBE) });
      await signIn(page, baseUrl, role);
    }
    await body(...sessions);
    for (const session of sessions) {
      if (session.console.errors.length > 0) {
        assert.fail(`console errors or uncaught exceptions:\n  ${session.console.errors.join('\n  ')}\nAPI refusals seen:\n  ${session.console.refusals.join('\n  ') || 'none'}`);
      }
      session.requests.assertAllLocal();
    }
  } finally {
    for (const session of sessions) await session.context.close();
  }
}
