import { DateTime } from 'luxon';
import type { BoardShiftTask } from '../../shared/api/board';
import { occurrencesOn, ruleOccurrences } from '../../server/services/shift-task-rules';
import { signedIn, startHarness, type Client, type Harness } from './harness';
import { at, DAY, local, roomId } from './turnover-day';

const iso = (times: DateTime[]) => times.map((t) => t.toISO({ suppressMilliseconds: true }));
const year1997 = { zone: 'UTC', from: '1997-01-01', to: '1998-01-01' };

describe('recurrence rules (RFC 5545 section 3.8.5.3 examples)', () => {
  it('Daily for 10 occurrences → 2–11 September 1997, 09:00 EDT', () => {
    const rule = 'DTSTART;TZID=America/New_York:19970902T090000\nRRULE:FREQ=DAILY;COUNT=10';
    expect(iso(ruleOccurrences(rule, year1997))).toEqual(
      [2, 3, 4, 5, 6, 7, 8, 9, 10, 11].map((d) => `1997-09-${String(d).padStart(2, '0')}T09:00:00-04:00`),
    );
  });

  it('Weekly for 10 occurrences → stays at 09:00 local across the end of DST (from memory)', () => {
    // RFC 5545 3.8.5.3, "Weekly for 10 occurrences" — expected dates from memory:
    // (9:00 AM EDT) September 2,9,16,23,30; October 7,14,21 (9:00 AM EST) October 28; November 4
    const rule = 'DTSTART;TZID=America/New_York:19970902T090000\nRRULE:FREQ=WEEKLY;COUNT=10';
    expect(iso(ruleOccurrences(rule, year1997))).toEqual([
      ...['09-02', '09-09', '09-16', '09-23', '09-30', '10-07', '10-14', '10-21'].map((d) => `1997-${d}T09:00:00-04:00`),
      ...['10-28', '11-04'].map((d) => `1997-${d}T09:00:00-05:00`),
    ]);
  });

  it('Every other week on Monday, Wednesday and Friday until 24 December 1997 (from memory)', () => {
    // RFC 5545 3.8.5.3 — expected dates from memory: Sep 1,3,5,15,17,19,29; Oct 1,3,13,15,17,27,29,31;
    // Nov 10,12,14,24,26,28; Dec 8,10,12,22 — 25 occurrences, all 9:00 AM local.
    const rule = 'DTSTART;TZID=America/New_York:19970901T090000\nRRULE:FREQ=WEEKLY;INTERVAL=2;UNTIL=19971224T000000Z;WKST=SU;BYDAY=MO,WE,FR';
    const dates = ruleOccurrences(rule, year1997).map((t) => t.toFormat('MM-dd HH:mm'));
    expect(dates).toHaveLength(25);
    expect(dates.slice(0, 7)).toEqual(['09-01', '09-03', '09-05', '09-15', '09-17', '09-19', '09-29'].map((d) => `${d} 09:00`));
    expect(dates.slice(-4)).toEqual(['12-08', '12-10', '12-12', '12-22'].map((d) => `${d} 09:00`));
  });

  it('gives the same days when asked one day at a time (DTSTART moved forward by whole periods)', () => {
    const rule = 'DTSTART;TZID=America/New_York:19970901T090000\nRRULE:FREQ=WEEKLY;INTERVAL=2;UNTIL=19971224T000000Z;WKST=SU;BYDAY=MO,WE,FR';
    const december = Array.from({ length: 31 }, (_, i) => `1997-12-${String(i + 1).padStart(2, '0')}`);
    const days = december.filter((date) => occurrencesOn(rule, date, 'UTC').length > 0);
    expect(days).toEqual(['1997-12-08', '1997-12-10', '1997-12-12', '1997-12-22']);
  });
});

describe('shift-task occurrences across daylight saving (America/Chicago, 2027)', () => {
  const daily0700 = 'DTSTART:20260101T070000\nRRULE:FREQ=DAILY';
  const on = (date: string) => iso(occurrencesOn(daily0700, date, 'America/Chicago'));

  it('keeps a daily 07:00 task at 07:00 local on both sides of spring-forward (14 March) and fall-back (7 November)', () => {
    expect([on('2027-03-13'), on('2027-03-14'), on('2027-03-15')]).toEqual([['2027-03-13T07:00:00-06:00'], ['2027-03-14T07:00:00-05:00'], ['2027-03-15T07:00:00-05:00']]);
    expect([on('2027-11-06'), on('2027-11-07'), on('2027-11-08')]).toEqual([['2027-11-06T07:00:00-05:00'], ['2027-11-07T07:00:00-06:00'], ['2027-11-08T07:00:00-06:00']]);
    // so the real time between them is 23 hours across spring-forward and 25 across fall-back
    const hours = (a: string, b: string) => (Date.parse(on(b)[0]!) - Date.parse(on(a)[0]!)) / 3_600_000;
    expect([hours('2027-03-13', '2027-03-14'), hours('2027-11-06', '2027-11-07')]).toEqual([23, 25]);
  });

  it('moves a time skipped by spring-forward (02:30 on 14 March) forward, and gives exactly one per day', () => {
    expect(iso(occurrencesOn('DTSTART:20260101T023000\nRRULE:FREQ=DAILY', '2027-03-14', 'America/Chicago'))).toEqual(['2027-03-14T03:30:00-05:00']);
    expect(iso(occurrencesOn('DTSTART:20260101T013000\nRRULE:FREQ=DAILY', '2027-11-07', 'America/Chicago'))).toHaveLength(1);
  });

  it('refuses a rule without DTSTART', () => {
    expect(() => occurrencesOn('RRULE:FREQ=DAILY', '2027-03-14', 'America/Chicago')).toThrow(RangeError);
  });
});

describe('shift tasks through the API', () => {
  let h: Harness;
  let tech: Client;
  let mr1: number;

  beforeAll(async () => {
    h = await startHarness();
    tech = await signedIn(h.app, 'tech');
    mr1 = await roomId(h, 'MR 1');
  });
  afterAll(() => h.close());

  const tasks = async (date = DAY): Promise<BoardShiftTask[]> => {
    const res = await tech.get(`/api/rooms/${mr1}/tasks?date=${date}`);
    expect(res.status).toBe(200);
    return res.body.tasks;
  };

  it('gives each demo room our defaults: wipe-downs at opening and closing, scanner QA, a Saturday deep clean', async () => {
    expect((await tasks()).map((t) => [t.key, t.due])).toEqual([
      ['wipe-start', local('07:00')],
      ['scanner-qa', local('07:05')],
      ['wipe-end', local('19:00')],
    ]);
    expect((await tasks('2027-03-13')).map((t) => [t.key, t.due])).toContainEqual(['deep-clean', '2027-03-13T18:00:00-06:00']);
    expect((await tasks('2027-03-15'))[0]!.due).toBe('2027-03-15T07:00:00-05:00'); // after spring-forward
  });

  it('flags an undone task overdue once its slot has passed; ticking it logs a shift task entry', async () => {
    at(h, '07:12');
    expect((await tasks()).map((t) => [t.key, t.overdue])).toEqual([['wipe-start', true], ['scanner-qa', false], ['wipe-end', false]]);
    const [wipe] = await tasks();
    const res = await tech.post(`/api/shift-tasks/${wipe!.taskId}/done`, { due: wipe!.due });
    expect(res.status).toBe(201);
    expect(res.body.task).toMatchObject({ key: 'wipe-start', doneAt: local('07:12'), doneBy: 'Mika Lindahl', overdue: false });
    const board = (await tech.get(`/api/days/${DAY}/board`)).body;
    expect(board.rooms.find((r: { roomId: number }) => r.roomId === mr1).tasks[0]).toMatchObject({ key: 'wipe-start', doneAt: local('07:12') });
    const [entry] = (await tech.get(`/api/log?date=${DAY}`)).body.entries;
    expect(entry).toMatchObject({ kind: 'shift task', cleanType: 'shift task', stepKey: 'wipe-start', roomName: 'MR 1', username: 'tech' });
  });

  it('refuses an occurrence ticked twice (409) or a time that is not an occurrence (422)', async () => {
    const [wipe] = await tasks();
    const twice = await tech.post(`/api/shift-tasks/${wipe!.taskId}/done`, { due: wipe!.due });
    expect([twice.status, twice.body.error.code]).toEqual([409, 'already_done']);
    expect((await tech.post(`/api/shift-tasks/${wipe!.taskId}/done`, { due: local('07:01') })).status).toBe(422);
    expect((await tech.post('/api/shift-tasks/999999/done', { due: local('07:00') })).status).toBe(404);
  });

  it('gives a new room the defaults at its own opening and closing times', async () => {
    const admin = await signedIn(h.app, 'admin');
    const res = await admin.post('/api/rooms', { name: 'US 1', modality: 'US', airChangesPerHour: 6, staff: 1, opensAt: '06:30', closesAt: '18:00' });
    expect(res.status).toBe(201);
    const created = (await tech.get(`/api/rooms/${res.body.room.id}/tasks?date=2027-03-13`)).body.tasks as BoardShiftTask[];
    expect(created.map((t) => [t.key, DateTime.fromISO(t.due, { setZone: true }).toFormat('HH:mm')])).toEqual([
      ['wipe-start', '06:30'],
      ['scanner-qa', '06:35'],
      ['deep-clean', '17:00'],
      ['wipe-end', '18:00'],
    ]);
  });
});
