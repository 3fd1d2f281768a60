import type { Checklist, LogEntry } from '../../shared/api/board';
import type { PlannedDay } from '../../shared/api/plan';
import type { Report } from '../../shared/api/reports';
import { toCsv } from '../../shared/csv/csv';
import { EXAM_LIST_HEADER, toCsv as examCsv } from '../fixtures/exam-lists';
import { signedIn, startHarness, type Client, type Harness } from './harness';
import { row, tickAll } from './turnover-day';

/*
 * A fixed, invented week (Mon 1 – Sun 7 March 2027, America/Chicago, all -06:00: DST starts on
 * the 14th) recorded through the real API, and the report's numbers worked out by hand below.
 *
 * Mon 1   MR 1: A-1 08:00, A-2 09:30, A-3 11:00 (30 min each, no precaution)
 *         MR 2: B-1 08:00 airborne, B-2 10:30 (30 min each)
 *         turnovers: MR 1 after A-1, exam finished 08:30, complete 09:20 (50 min);
 *                    MR 2 after B-1, finished 08:30, closed early at 09:00 (30 min) with the
 *                    reason "Stat patient from ED", inside its air hold.
 *         shift task (MR 1, daily 07:30, 15 min) ticked off at 07:40: on time.
 * Tue 2   MR 1: C-1 08:00, C-2 08:35 (5 min after C-1: short), C-3 08:50 (inside C-2: overlap),
 *         then C-2 dragged to 10:00 and C-3 moved by keyboard to 12:00 (both gaps then fit).
 *         shift task ticked off at 08:10, after its slot (07:30 + 15 = 07:45): late.
 * Wed 3 – Sun 7: no list; the shift task never ticked off.
 * The report is read on Wed 10 March, so every slot of the week is over.
 */
const MON = '2027-03-01';
const TUE = '2027-03-02';
const at = (h: Harness, day: string, hhmm: string) => h.clock.set(`${day}T${hhmm}:00-06:00`);

describe('reports', () => {
  let h: Harness;
  let charge: Client;
  let tech: Client;
  let scheduler: Client;
  let mr1: number;
  let mr2: number;
  /** The plan's required minutes for the gaps the week's turnovers and problems sit in. */
  const required = { afterA1: 0, afterB1: 0, c1ToC2: 0, c2ToC3: 0 };
  let monLog: LogEntry[] = [];

  const examId = async (day: string, accession: string) => (await h.db('exams').where({ day, accession }).first('id', 'version')) as { id: number; version: number };
  const importDay = async (day: string, rows: string[][]) => {
    const res = await scheduler.upload(`/api/days/${day}/exams/import`, examCsv([EXAM_LIST_HEADER, ...rows]), 'day.csv');
    if (res.status !== 200) throw new Error(`import ${day}: ${res.status} ${JSON.stringify(res.body)}`);
  };
  const plan = async (day: string): Promise<PlannedDay> => (await charge.get(`/api/days/${day}/plan`)).body;
  const gapAfter = (p: PlannedDay, accession: string) => {
    for (const room of p.rooms) {
      const exam = room.exams.find((e) => e.accession === accession);
      if (exam) return room.gaps.find((g) => g.fromExamId === exam.id)!;
    }
    throw new Error(`no exam ${accession}`);
  };
  const turnover = async (day: string, accession: string, finish: string, complete: string, overrideReason?: string) => {
    at(h, day, finish);
    const opened = await tech.post(`/api/exams/${(await examId(day, accession)).id}/finished`, {});
    if (opened.status >= 300) throw new Error(`finish ${accession}: ${opened.status} ${JSON.stringify(opened.body).slice(0, 300)}`);
    await tickAll(h, tech, opened.body as Checklist);
    // the completion time below is the one counted; ticking must not have run past it
    if (h.clock.now().getTime() > Date.parse(`${day}T${complete}:00-06:00`)) throw new Error(`ticking ${accession} ran past ${complete}`);
    at(h, day, complete);
    const done = await tech.post(`/api/turnovers/${(opened.body as Checklist).turnoverId}/complete`, overrideReason ? { overrideReason } : {});
    if (done.status >= 300) throw new Error(`complete ${accession}: ${done.status} ${JSON.stringify(done.body).slice(0, 300)}`);
  };
  const report = async (query: string, as: Client = charge) => {
    const res = await as.get(`/api/reports?${query}`);
    expect(res.status).toBe(200);
    return res.body as Report;
  };

  beforeAll(async () => {
    h = await startHarness();
    [charge, tech, scheduler] = await Promise.all([signedIn(h.app, 'charge'), signedIn(h.app, 'tech'), signedIn(h.app, 'scheduler')]);
    mr1 = (await h.db('rooms').where({ name: 'MR 1' }).first('id')).id;
    mr2 = (await h.db('rooms').where({ name: 'MR 2' }).first('id')).id;
    // Only this test's shift task counts: the demo's defaults are switched off.
    await h.db('shift_tasks').update({ active: false });
    const [{ id: taskId }] = await h.db('shift_tasks').insert({
      room_id: mr1,
      key: 'report-wipe',
      label: 'Console wipe-down',
      rrule: 'DTSTART:20270101T073000\nRRULE:FREQ=DAILY',
      duration_minutes: 15,
      created_at: '2027-01-01T00:00:00Z',
    }).returning('id');

    await importDay(MON, [
      row('A-1', 'MR 1', '08:00', 30),
      row('A-2', 'MR 1', '09:30', 30),
      row('A-3', 'MR 1', '11:00', 30),
      row('B-1', 'MR 2', '08:00', 30, 'airborne'),
      row('B-2', 'MR 2', '10:30', 30),
    ]);
    await importDay(TUE, [row('C-1', 'MR 1', '08:00', 30), row('C-2', 'MR 1', '08:35', 30), row('C-3', 'MR 1', '08:50', 30)]);
    const mon = await plan(MON);
    const tue = await plan(TUE);
    required.afterA1 = gapAfter(mon, 'A-1').requiredMinutes;
    required.afterB1 = gapAfter(mon, 'B-1').requiredMinutes;
    required.c1ToC2 = gapAfter(tue, 'C-1').requiredMinutes;
    required.c2ToC3 = gapAfter(tue, 'C-2').requiredMinutes;

    for (const [id, day, hhmm] of [[taskId, MON, '07:40'], [taskId, TUE, '08:10']] as const) {
      at(h, day, hhmm);
      const res = await tech.post(`/api/shift-tasks/${id}/done`, { due: `${day}T07:30:00-06:00` });
      if (res.status !== 201) throw new Error(`shift task: ${JSON.stringify(res.body)}`);
    }
    await turnover(MON, 'A-1', '08:30', '09:20');
    await turnover(MON, 'B-1', '08:30', '09:00', 'Stat patient from ED');

    at(h, TUE, '07:00');
    for (const [accession, start, reason] of [['C-2', '10:00', 'drag'], ['C-3', '12:00', 'keyboard']] as const) {
      const exam = await examId(TUE, accession);
      const res = await scheduler.patch(`/api/exams/${exam.id}`, { start: `${TUE}T${start}:00-06:00`, version: exam.version, reason });
      if (res.status !== 200) throw new Error(`move ${accession}: ${JSON.stringify(res.body)}`);
    }
    monLog = (await charge.get(`/api/log?date=${MON}`)).body.entries;
    h.clock.set('2027-03-10T12:00:00-06:00');
  }, 60_000); // two imports, two whole turnovers and two moves through the API
  afterAll(() => h.close(), 30_000);

  it('the week is as planned: the problems sit where the test put them', async () => {
    // Guards for the hand arithmetic below: every other gap has at least 60 minutes (opening
    // 07:00 → 08:00, 30-min exams 90 minutes apart), more than any MR turnover needs here.
    for (const p of [await plan(MON), await plan(TUE)]) {
      for (const room of p.rooms) for (const gap of room.gaps) expect(gap.verdict).toBe('fits');
    }
    // C-1 ends 08:30, C-2 starts 08:35: 5 minutes available; C-2 ends 09:05, C-3 started 08:50: −15.
    expect(required.c1ToC2).toBeGreaterThan(5);
    expect(required.afterB1).toBeGreaterThanOrEqual(35); // the air hold is part of the gap's turnover
  });

  it('sets planned beside actual turnover minutes, per room and per precaution', async () => {
    const r = await report(`from=2027-03-01&to=2027-03-07`);
    expect(r.days).toBe(7);
    expect(r.listDays).toBe(2); // Mon and Tue
    // MR 1 after A-1: 08:30 → 09:20 = 50 min; MR 2 after B-1: 08:30 → 09:00 = 30 min.
    expect(r.turnoverMinutes.byRoom).toEqual([
      { label: 'MR 1', roomId: mr1, turnovers: 1, plannedMinutes: required.afterA1, actualMinutes: 50 },
      { label: 'MR 2', roomId: mr2, turnovers: 1, plannedMinutes: required.afterB1, actualMinutes: 30 },
    ]);
    expect(r.turnoverMinutes.byPrecaution).toEqual([
      { label: 'airborne', roomId: null, turnovers: 1, plannedMinutes: required.afterB1, actualMinutes: 30 },
      { label: 'none', roomId: null, turnovers: 1, plannedMinutes: required.afterA1, actualMinutes: 50 },
    ]);
  });

  it('counts gap verdicts as imported and now, after the moves', async () => {
    const r = await report(`from=2027-03-01&to=2027-03-07`);
    // Mon: MR 1 opening + 2 between = 3, MR 2 opening + 1 = 2; Tue: MR 1 opening + 2 = 3. Now all fit: 8.
    const allFit = { fits: 8, snug: 0, short: 0, overlap: 0, minutesShort: 0 };
    expect(r.gaps.now).toEqual(allFit);
    expect(r.gaps.nowOnImportedDays).toEqual(allFit);
    expect(r.gaps.importedDays).toBe(2);
    // As imported: Tue's C-1 → C-2 short by (required − 5), C-2 → C-3 an overlap short by (required + 15).
    expect(r.gaps.asImported).toEqual({
      fits: 6,
      snug: 0,
      short: 1,
      overlap: 1,
      minutesShort: required.c1ToC2 - 5 + (required.c2ToC3 + 15),
    });
  });

  it('counts moves by reason, early closes with their reasons and air holds', async () => {
    const r = await report(`from=2027-03-01&to=2027-03-07`);
    expect(r.moves).toEqual([
      { reason: 'drag', changes: 1, exams: 1 },
      { reason: 'keyboard', changes: 1, exams: 1 },
    ]);
    // two completions, one with a reason
    expect(r.earlyCloses).toEqual({ closed: 2, early: 1, reasons: [{ reason: 'Stat patient from ED', count: 1 }] });
    // MR 2 has 12 air changes an hour: 60 × ln(1000) / 12 = 34.5 → 35 min for 99.9 % removal
    // (CDC 2003 Guidelines for Environmental Infection Control, Appendix B, Table B.1: 12 ACH → 35 min).
    // Closed 30 min after the exam ended: inside the hold.
    expect(r.airHolds).toEqual({ count: 1, minutes: 35, endedEarly: 1 });
  });

  it('sets contact time achieved beside required, from the cleaning log', async () => {
    const r = await report(`from=2027-03-01&to=2027-03-07`);
    // The disinfection steps are the protocol's; their minutes are whatever the log says. Tally them here.
    const steps = monLog.filter((e) => e.kind === 'step' && e.contactRequiredMinutes !== null);
    expect(steps.length).toBeGreaterThan(0);
    const met = steps.filter((e) => e.contactAchievedMinutes! >= e.contactRequiredMinutes!).length;
    expect(r.contact.total).toEqual({
      label: 'All products',
      steps: steps.length,
      met,
      below: steps.length - met,
      requiredMinutes: steps.reduce((s, e) => s + e.contactRequiredMinutes!, 0),
      achievedMinutes: steps.reduce((s, e) => s + e.contactAchievedMinutes!, 0),
    });
    expect(r.contact.byProduct.reduce((s, p) => s + p.steps, 0)).toBe(steps.length);
  });

  it('counts shift tasks on time, late and missed', async () => {
    const r = await report(`from=2027-03-01&to=2027-03-07`);
    // 7 daily occurrences; Mon ticked 07:40 ≤ 07:45 (on time), Tue 08:10 > 07:45 (late), Wed–Sun never.
    expect(r.shiftTasks).toEqual({ due: 7, onTime: 1, late: 1, missed: 5, open: 0 });
  });

  it('measures room use as exam minutes over open minutes on the days with a list', async () => {
    const r = await report(`from=2027-03-01&to=2027-03-07`);
    // 2 list days × 07:00–19:00 (720 min) = 1,440 open minutes a room.
    // MR 1: Mon 3 × 30 + Tue 3 × 30 = 180 → 0.125; MR 2: Mon 2 × 30 = 60 → 0.0417 → 0.042.
    expect(r.roomUse).toEqual([
      { roomId: mr1, label: 'MR 1', days: 2, examMinutes: 180, openMinutes: 1440, use: 0.125 },
      { roomId: mr2, label: 'MR 2', days: 2, examMinutes: 60, openMinutes: 1440, use: 0.042 },
      expect.objectContaining({ label: 'MR 3', examMinutes: 0, openMinutes: 1440, use: 0 }),
      expect.objectContaining({ label: 'CT 1', examMinutes: 0, openMinutes: 1440, use: 0 }),
    ]);
  });

  it('filters by room', async () => {
    const r = await report(`from=2027-03-01&to=2027-03-07&room=${mr2}`);
    expect(r.roomId).toBe(mr2);
    expect(r.turnoverMinutes.byRoom.map((x) => x.label)).toEqual(['MR 2']);
    expect(r.gaps.now).toEqual({ fits: 2, snug: 0, short: 0, overlap: 0, minutesShort: 0 });
    expect(r.gaps.asImported).toEqual({ fits: 2, snug: 0, short: 0, overlap: 0, minutesShort: 0 });
    expect(r.moves).toEqual([]); // both moves stayed in MR 1
    expect(r.earlyCloses.closed).toBe(1);
    expect(r.shiftTasks.due).toBe(0);
    expect(r.roomUse.map((x) => x.label)).toEqual(['MR 2']);
  });

  it('covers only the range asked for', async () => {
    const r = await report(`from=2027-03-02&to=2027-03-02`);
    expect(r.turnoverMinutes.byRoom).toEqual([]);
    expect(r.shiftTasks).toEqual({ due: 1, onTime: 0, late: 1, missed: 0, open: 0 });
    expect(r.gaps.asImported).toEqual(expect.objectContaining({ fits: 1, short: 1, overlap: 1 }));
  });

  it('refuses a range over 92 days, a reversed range and bad days, listing every problem', async () => {
    const long = await charge.get('/api/reports?from=2027-01-01&to=2027-04-03'); // 31 + 28 + 31 + 3 = 93 days
    expect(long.status).toBe(422);
    expect(long.body.error.code).toBe('validation_failed');
    expect(long.body.error.details.problems).toEqual([{ field: 'to', message: 'at most 92 days in one report (this range has 93)' }]);
    expect((await charge.get('/api/reports?from=2027-01-01&to=2027-04-02')).status).toBe(200); // 92 days

    const reversed = await charge.get('/api/reports?from=2027-03-07&to=2027-03-01');
    expect(reversed.status).toBe(422);
    expect(reversed.body.error.details.problems).toEqual([{ field: 'to', message: 'the range ends before it starts' }]);

    const bad = await charge.get('/api/reports?from=2027-02-30&to=soon&room=x');
    expect(bad.status).toBe(422);
    expect(bad.body.error.details.problems.map((p: { field: string }) => p.field).sort()).toEqual(['from', 'room', 'to']);
    expect(JSON.stringify(bad.body)).not.toMatch(/at .*\.ts/); // no stack trace

    expect((await charge.get('/api/reports?from=2027-03-01&to=2027-03-07&room=9999')).status).toBe(404);
  });

  it('lets charge technologists and admins read it, nobody else', async () => {
    expect((await signedIn(h.app, 'admin').then((c) => c.get('/api/reports?from=2027-03-01&to=2027-03-01'))).status).toBe(200);
    for (const role of ['tech', 'scheduler', 'frontdesk'] as const) {
      expect((await signedIn(h.app, role).then((c) => c.get('/api/reports?from=2027-03-01&to=2027-03-01'))).status).toBe(403);
    }
  });

  it('exports cells a spreadsheet would run as formulas as text (OWASP CSV injection)', () => {
    expect(toCsv([['reason', 'count'], ['=HYPERLINK("x")', 1], ['+1', '-2'], ['@me', '\tTab'], ['plain, with comma', null]])).toBe(
      'reason,count\r\n"\'=HYPERLINK(""x"")",1\r\n\'+1,\'-2\r\n\'@me,\'\tTab\r\n"plain, with comma",\r\n',
    );
  });
});
