import type { BrowserContext } from 'playwright-core';
import type { PlanChangeRecord } from '../../../shared/api/changes';

/**
 * Calls the API with the session of a signed-in browser context, the way the client does:
 * the session cookie rides along and state-changing calls carry the XSRF double-submit header.
 */

/**
 * The `X-XSRF-TOKEN` header from the context's `XSRF-TOKEN` cookie (empty before the server set it).
 * @example await context.request.post(url, { headers: await xsrfHeader(context), data });
 */
export async function xsrfHeader(context: BrowserContext): Promise<Record<string, string>> {
  const cookie = (await context.cookies()).find((candidate) => candidate.name === 'XSRF-TOKEN');
  return cookie ? { 'X-XSRF-TOKEN': cookie.value } : {};
}

/**
 * Imports a day list through `POST /api/days/:date/exams/import` (the real path), throwing with the
 * server's answer when it refuses the file.
 * @example await importDayList(context, server.baseUrl, '2027-03-10', csv);
 */
export async function importDayList(context: BrowserContext, baseUrl: string, date: string, csv: string): Promise<void> {
  const response = await context.request.post(`${baseUrl}/api/days/${date}/exams/import`, {
    headers: await xsrfHeader(context),
    multipart: { file: { name: `${date}.csv`, mimeType: 'text/csv', buffer: Buffer.from(csv) } },
  });
  if (!response.ok()) throw new Error(`import of ${date} answered ${response.status()}: ${await response.text()}`);
}

/**
 * The day's history, newest first (`GET /api/days/:date/history`).
 * @example const [latest] = await dayHistory(context, server.baseUrl, '2027-03-10');
 */
export async function dayHistory(context: BrowserContext, baseUrl: string, date: string): Promise<PlanChangeRecord[]> {
  const response = await context.request.get(`${baseUrl}/api/days/${date}/history`);
  if (!response.ok()) throw new Error(`history of ${date} answered ${response.status()}: ${await response.text()}`);
  return ((await response.json()) as { changes: PlanChangeRecord[] }).changes;
}
