import type { BrowserContext, Page, Request } from 'playwright-core';

/** Hosts the test server answers on; anything else means the page reached off the machine. */
const LOCAL_HOSTS = new Set(['127.0.0.1', 'localhost', '[::1]']);

export interface RequestLog {
  /** Every URL requested so far, in order. */
  readonly urls: string[];
  /** The requested URLs whose host is not this machine. */
  offsite(): string[];
  /** Throws, listing them, if any request left the machine. */
  assertAllLocal(): void;
}

/**
 * Records every request made by the pages of `target` (a context covers pages opened later).
 * @example const requests = recordRequests(context); …; requests.assertAllLocal();
 */
export function recordRequests(target: BrowserContext | Page): RequestLog {
  const urls: string[] = [];
  target.on('request', (request: Request) => urls.push(request.url()));
  const offsite = () => urls.filter((url) => !isLocal(url));
  return {
    urls,
    offsite,
    assertAllLocal() {
      const away = offsite();
      if (away.length > 0) throw new Error(`${away.length} request(s) left the machine:\n  ${away.join('\n  ')}`);
    },
  };
}

function isLocal(url: string): boolean {
  const parsed = new URL(url);
  // Inline resources never touch the network.
  if (parsed.protocol === 'data:' || parsed.protocol === 'blob:') return true;
  return LOCAL_HOSTS.has(parsed.hostname);
}

export interface ConsoleLog {
  /** Console errors and uncaught page errors, each prefixed with the page URL. */
  readonly errors: string[];
  /** Every API answer of 400 or more, with its body: what a "Failed to load resource" line was about. */
  readonly refusals: string[];
}

/** A console error the caller expects, e.g. Chromium logging a 401 the app asked for on purpose. */
export type ExpectedConsoleError = (error: { text: string; sourceUrl: string }) => boolean;

/**
 * Collects console errors and uncaught exceptions of `page`, to assert on at the end of a test.
 * Only errors matched by `expected` are left out; keep those matchers narrow.
 * @example const log = recordConsoleErrors(page); …; assert.deepEqual(log.errors, []);
 */
export function recordConsoleErrors(page: Page, expected: ExpectedConsoleError = () => false): ConsoleLog {
  const errors: string[] = [];
  const refusals: string[] = [];
  page.on('response', (response) => {
    const url = new URL(response.url());
    if (response.status() < 400 || !url.pathname.startsWith('/api/')) return;
    const line = `${response.request().method()} ${url.pathname}${url.search} → ${response.status()}`;
    refusals.push(line);
    response.text().then(
      (body) => (refusals[refusals.indexOf(line)] = `${line} ${body.slice(0, 300)}`),
      () => undefined,
    );
  });
  page.on('console', (message) => {
    if (message.type() !== 'error') return;
    if (expected({ text: message.text(), sourceUrl: message.location().url })) return;
    errors.push(`${page.url()}: console.error: ${message.text()}`);
  });
  page.on('pageerror', (error) => errors.push(`${page.url()}: uncaught: ${error.message}`));
  return { errors, refusals };
}

/**
 * Sums what the page downloads (response headers + bodies as sent on the wire) for every
 * request that has finished by the time `total()` is called.
 * @example const transfer = recordTransfer(page); await page.goto(url); console.log(await transfer.total());
 */
export function recordTransfer(page: Page): { total(): Promise<number>; perUrl: Map<string, number> } {
  const perUrl = new Map<string, number>();
  const pending: Promise<void>[] = [];
  page.on('requestfinished', (request) => {
    pending.push(
      request.sizes().then((sizes) => {
        perUrl.set(request.url(), (perUrl.get(request.url()) ?? 0) + sizes.responseHeadersSize + sizes.responseBodySize);
      }),
    );
  });
  return {
    perUrl,
    async total() {
      await Promise.all(pending);
      return [...perUrl.values()].reduce((sum, bytes) => sum + bytes, 0);
    },
  };
}
