import { queueDayBeforeNotices } from '../../server/services/notices/day-before';
import { queueWeeklySummaries } from '../../server/services/notices/weekly-summary';
import { EXAM_LIST_HEADER, toCsv } from '../fixtures/exam-lists';
import { signedIn, startHarness, type Client, type Harness } from './harness';

/**
 * The day-before notice (charge technologists, at the site's set time) and the weekly summary
 * (admins, Monday morning), driven by an explicit clock: nothing before their time, one per
 * recipient and day (week) after it, never again on a later pass or after a restart.
 * Site zone America/Chicago: CST (-06:00) until 2027-03-14, CDT (-05:00) from then.
 */
const TOMORROW = '2027-03-11';
const PUBLIC_URL = 'https://turnwise.example.test';
const HOOK_MS = 30_000;
const ctx = { publicUrl: PUBLIC_URL, secret: 'test-secret' };

function row(acc: string, room: string, start: string, dur: number, precaution = 'none') {
  return [acc, room, start, String(dur), 'MR exam', 'knee', precaution, 'ambulatory', 'no', ''];
}

// As in notices.spec.ts: after an enteric case the MR protocol needs 24 min and 20 are
// available, so D-2's gap is short by 4 (demo defaults); D-1 is an isolation case.
const TOMORROWS_LIST = toCsv([EXAM_LIST_HEADER, row('D-1', 'MR 1', '09:40', 30, 'enteric'), row('D-2', 'MR 1', '10:30', 30), row('D-3', 'MR 3', '11:00', 30)]);

describe('scheduled notices', () => {
  let h: Harness;
  let admin: Client;
  let charge: Client;
  const queued = (kind: string) => h.db('notices').where({ kind }).orderBy('id');
  /** As after a server restart: a new app on the same file, and the browsers sign in to it. */
  const restart = async () => {
    await h.restart();
    [admin, charge] = await Promise.all([signedIn(h.app, 'admin'), signedIn(h.app, 'charge')]);
  };

  beforeAll(async () => {
    h = await startHarness({ publicUrl: PUBLIC_URL });
    [admin, charge] = await Promise.all([signedIn(h.app, 'admin'), signedIn(h.app, 'charge')]);
    expect((await charge.put('/api/profile/notices', { email: 'charge@example.test', kinds: { 'day-before': true } })).status).toBe(200);
    expect((await admin.put('/api/profile/notices', { email: 'admin@example.test', kinds: { 'weekly-summary': true } })).status).toBe(200);
    expect((await charge.upload(`/api/days/${TOMORROW}/exams/import`, TOMORROWS_LIST, 'tomorrow.csv')).status).toBe(200);
  }, HOOK_MS);
  afterAll(() => h.close(), HOOK_MS);

  it('checks the day-before time as HH:MM in the settings API (422 on its field)', async () => {
    const bad = await admin.put('/api/settings', { timezone: 'America/Chicago', snugMarginMinutes: 3, dayBeforeNoticeAt: '24:00' });
    expect(bad.status).toBe(422);
    expect(bad.body.error.details.problems.map((p: { field: string }) => p.field)).toEqual(['dayBeforeNoticeAt']);
    expect((await admin.get('/api/settings')).body.settings.dayBeforeNoticeAt).toBe('16:00');
    const ok = await admin.put('/api/settings', { timezone: 'America/Chicago', snugMarginMinutes: 3, dayBeforeNoticeAt: '15:30' });
    expect(ok.status).toBe(200);
    expect(ok.body.settings.dayBeforeNoticeAt).toBe('15:30');
  });

  it('sends tomorrow’s problem gaps and isolation cases to charge technologists once the set time has passed, once', async () => {
    expect(await queueDayBeforeNotices(h.db, ctx, new Date('2027-03-10T21:29:00Z'))).toBe(0); // 15:29 CST
    expect(await queued('day-before')).toHaveLength(0);

    expect(await queueDayBeforeNotices(h.db, ctx, new Date('2027-03-10T21:30:00Z'))).toBe(1); // 15:30 CST
    const [notice] = await queued('day-before');
    expect(JSON.parse(notice.recipients)).toEqual(['charge@example.test']);
    expect(notice.idempotency_key).toMatch(new RegExp(`^day-before:${TOMORROW}:\\d+$`));
    expect(notice.subject).toBe(`Turnwise: tomorrow ${TOMORROW}, 1 problem gap and 1 isolation case`);
    expect(notice.text).toContain('MR 1 10:30 before D-2: short by 4 min');
    expect(notice.text).toContain('MR 1 09:40 D-1: enteric precautions');
    expect(notice.text).toContain(`${PUBLIC_URL}/day/${TOMORROW}`);
    expect(notice.text).not.toContain('D-3: ');

    expect(await queueDayBeforeNotices(h.db, ctx, new Date('2027-03-10T23:00:00Z'))).toBe(0);
    await restart();
    expect(await queueDayBeforeNotices(h.db, ctx, new Date('2027-03-10T23:30:00Z'))).toBe(0);
    expect(await queued('day-before')).toHaveLength(1);
  });

  it('respects the switch: with the notice off a charge technologist gets none, on again the next pass sends it', async () => {
    const nextList = TOMORROWS_LIST.replaceAll('D-', 'E-');
    expect((await charge.upload('/api/days/2027-03-12/exams/import', nextList, 'next.csv')).status).toBe(200);
    await charge.put('/api/profile/notices', { email: 'charge@example.test', kinds: { 'day-before': false } });
    const evening = new Date('2027-03-11T22:00:00Z'); // 16:00 CST, for 2027-03-12
    expect(await queueDayBeforeNotices(h.db, ctx, evening)).toBe(0);
    await charge.put('/api/profile/notices', { email: 'charge@example.test', kinds: { 'day-before': true } });
    expect(await queueDayBeforeNotices(h.db, ctx, evening)).toBe(1);
    expect((await queued('day-before')).map((n) => n.idempotency_key)).toEqual([expect.stringMatching(/^day-before:2027-03-11:/), expect.stringMatching(/^day-before:2027-03-12:/)]);
  });

  it('sends admins last week’s summary from the Reports numbers on Monday morning, once', async () => {
    expect(await queueWeeklySummaries(h.db, ctx, new Date('2027-03-14T18:00:00Z'))).toBe(0); // a Sunday
    expect(await queueWeeklySummaries(h.db, ctx, new Date('2027-03-15T11:59:00Z'))).toBe(0); // Monday 06:59 CDT
    const monday = new Date('2027-03-15T12:00:00Z'); // 07:00 CDT
    expect(await queueWeeklySummaries(h.db, ctx, monday)).toBe(1);
    const [notice] = await queued('weekly-summary');
    expect(JSON.parse(notice.recipients)).toEqual(['admin@example.test']);
    expect(notice.idempotency_key).toMatch(/^weekly-summary:2027-03-08:\d+$/);

    h.clock.set(monday);
    const report = (await admin.get('/api/reports?from=2027-03-08&to=2027-03-14')).body;
    // the demo rooms' daily tasks went unticked all week: the summary must say so, in the report's numbers
    expect(report.shiftTasks.missed).toBeGreaterThan(0);
    expect(notice.text).toContain(`${report.shiftTasks.missed} overdue (never ticked off) and ${report.shiftTasks.late} ticked off late, of ${report.shiftTasks.due} due`);
    expect(notice.text).toContain(`${report.earlyCloses.early} of ${report.earlyCloses.closed} turnovers closed with an override reason`);
    expect(notice.text).toContain(`${report.contact.total.below} of ${report.contact.total.steps} disinfection steps below`);

    expect(await queueWeeklySummaries(h.db, ctx, new Date('2027-03-15T20:00:00Z'))).toBe(0);
    await restart();
    expect(await queueWeeklySummaries(h.db, ctx, new Date('2027-03-15T21:00:00Z'))).toBe(0);
    expect(await queued('weekly-summary')).toHaveLength(1);
  });
});
