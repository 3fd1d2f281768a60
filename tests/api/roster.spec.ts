import { DayEvents } from '../../server/services/day-events';
import type { DayEvent } from '../../shared/api/changes';
import { signedIn, startHarness, type Client, type Harness } from './harness';

/*
 * The shift roster over HTTP on a real database: a day's roster (charge technologist), the weekly
 * default (admin, Setup), the walking time (site settings), and the plan computed with them.
 * Shifts and people are invented.
 */
const DAY = '2027-03-16'; // a Tuesday (ISO weekday 2)
const NEXT_TUESDAY = '2027-03-23';

describe('roster API', () => {
  let h: Harness;
  const events = new DayEvents();
  const heard: DayEvent[] = [];
  let admin: Client;
  let charge: Client;
  let scheduler: Client;
  let rooms: Record<string, number>;
  const aides = (roomIds: number[], extra: object = {}) => ({ name: null, role: 'aide', count: 1, start: '07:00', end: '15:00', breaks: [], roomIds, ...extra });

  beforeAll(async () => {
    h = await startHarness({ events });
    events.subscribe(DAY, (e) => heard.push(e));
    [admin, charge, scheduler] = await Promise.all([signedIn(h.app, 'admin'), signedIn(h.app, 'charge'), signedIn(h.app, 'scheduler')]);
    rooms = Object.fromEntries((await admin.get('/api/rooms')).body.rooms.map((r: { id: number; name: string }) => [r.name, r.id]));
    // Invented example: MR 2's patient leaves at 09:52, MR 1's at 10:00; MR 1's next is booked at 10:29.
    for (const [accession, room, start, duration_min] of [
      ['R-1', 'MR 1', '09:00', 60],
      ['R-2', 'MR 1', '10:29', 30],
      ['R-3', 'MR 2', '09:00', 52],
      ['R-4', 'MR 2', '10:20', 30],
    ] as const) {
      const res = await scheduler.post(`/api/days/${DAY}/exams`, { accession, room, start, duration_min, procedure: 'MR knee without contrast', coil: 'knee' });
      expect(res.status).toBe(201);
    }
  }, 30_000);
  afterAll(() => h.close(), 30_000);

  const gapBefore = async (accession: string) => {
    const plan = (await scheduler.get(`/api/days/${DAY}/plan`)).body;
    const exam = plan.rooms.flatMap((r: { exams: { id: number; accession: string }[] }) => r.exams).find((e: { accession: string }) => e.accession === accession);
    return { plan, gap: plan.rooms.flatMap((r: { gaps: { toExamId: number }[] }) => r.gaps).find((g: { toExamId: number }) => g.toExamId === exam.id) };
  };

  it('answers no roster for a day without one, and the plan as before rosters', async () => {
    const res = await scheduler.get(`/api/days/${DAY}/roster`);
    expect(res.status).toBe(200);
    expect(res.body.roster).toEqual({ date: DAY, source: 'none', rows: [], people: [], walkingMinutes: 3 });
    const { plan, gap } = await gapBefore('R-2');
    expect(plan.people).toBeUndefined();
    expect(plan.input.roster).toBeUndefined();
    expect(gap).toMatchObject({ verdict: 'fits' });
    expect(gap.crew).toBeUndefined();
  });

  it("saves the charge technologist's roster: a new plan (ETag), the gap short for want of the aide, a history entry and a live event", async () => {
    const before = await scheduler.get(`/api/days/${DAY}/plan`);
    heard.length = 0;
    const res = await charge.put(`/api/days/${DAY}/roster`, { rows: [aides([rooms['MR 1']!, rooms['MR 2']!])] });
    expect(res.status).toBe(200);
    expect(res.body.roster).toMatchObject({ source: 'day', people: [{ id: 'r1-1', label: 'Aide 1', name: null, role: 'aide' }] });

    const after = await scheduler.get(`/api/days/${DAY}/plan`);
    expect(after.headers['etag']).not.toBe(before.headers['etag']);
    const { plan, gap } = await gapBefore('R-2');
    // The aide turns MR 2 over 09:52–10:12, walks 3 minutes, starts MR 1 at 10:15: ready 10:35 for 10:29.
    expect(gap).toMatchObject({
      verdict: 'short', shortByMinutes: 6, crew: ['r1-1'],
      people: { kind: 'busy', personId: 'r1-1', roomId: rooms['MR 2'], until: '2027-03-16T10:12:00-05:00', waitedMinutes: 15 },
    });
    expect(plan.people).toMatchObject({ source: 'day', walkingMinutes: 3, provenOptimal: true, uncoveredRoomIds: [rooms['MR 3'], rooms['CT 1']] });
    expect(plan.people.people[0].work).toHaveLength(4);

    const history = (await scheduler.get(`/api/days/${DAY}/history`)).body.changes;
    expect(history[0]).toMatchObject({ reason: 'roster', summary: 'Roster saved: 1 person on shift' });
    expect(heard.map((e) => [e.kind, e.reason])).toEqual([['plan', 'roster']]);
  });

  it('undoes a roster change like a move, and redoes it', async () => {
    const undo = await charge.post(`/api/days/${DAY}/undo`);
    expect(undo.status).toBe(200);
    expect((await charge.get(`/api/days/${DAY}/roster`)).body.roster.source).toBe('none');
    const redo = await charge.post(`/api/days/${DAY}/redo`);
    expect(redo.status).toBe(200);
    expect((await charge.get(`/api/days/${DAY}/roster`)).body.roster.rows).toEqual([aides([rooms['MR 1']!, rooms['MR 2']!])]);
  });

  it('refuses a scheduler and a technologist (403), who may read it', async () => {
    const tech = await signedIn(h.app, 'tech');
    expect((await scheduler.put(`/api/days/${DAY}/roster`, { rows: [] })).status).toBe(403);
    expect((await tech.put(`/api/days/${DAY}/roster`, { rows: [] })).status).toBe(403);
    expect((await tech.get(`/api/days/${DAY}/roster`)).status).toBe(200);
  });

  it('refuses a roster with 422 listing every problem, and changes nothing', async () => {
    const version = (await scheduler.get(`/api/days/${DAY}/plan`)).headers['etag'];
    const mr1 = rooms['MR 1']!;
    const res = await charge.put(`/api/days/${DAY}/roster`, {
      rows: [
        { name: 'Ari Sol', role: 'technologist', count: 1, start: '15:00', end: '07:00', breaks: [], roomIds: [mr1] },
        aides([mr1], { breaks: [{ start: '06:00', end: '06:30' }] }),
        aides([mr1], { breaks: [{ start: '10:00', end: '10:30' }, { start: '10:15', end: '10:45' }] }),
        aides([mr1, 9999]),
        { name: 'ari sol', role: 'technologist', count: 1, start: '07:00', end: '15:00', breaks: [], roomIds: [mr1] },
      ],
    });
    expect(res.status).toBe(422);
    expect(res.body.error.code).toBe('validation_failed');
    expect(res.body.error.details.problems).toEqual([
      { field: 'rows.0.end', message: 'the shift must end after it starts' },
      { field: 'rows.1.breaks.0.start', message: 'the break is outside the shift (07:00–15:00)' },
      { field: 'rows.2.breaks.1.start', message: 'the break overlaps another break' },
      { field: 'rows.4.name', message: '"ari sol" is already on the roster (row 1)' },
      { field: 'rows.3.roomIds', message: 'no room 9999 is set up' },
    ]);
    expect((await scheduler.get(`/api/days/${DAY}/plan`)).headers['etag']).toBe(version);
  });

  it.each([
    [{ rows: [{ name: null, role: 'porter', start: '07:00', end: '15:00', roomIds: [1] }] }, 'rows.0.role'],
    [{ rows: [{ name: null, role: 'aide', start: '7am', end: '15:00', roomIds: [1] }] }, 'rows.0.start'],
    [{ rows: [{ name: null, role: 'aide', start: '07:00', end: '15:00', roomIds: [] }] }, 'rows.0.roomIds'],
    [{ rows: [{ name: 'Bo', role: 'aide', count: 2, start: '07:00', end: '15:00', roomIds: [1] }] }, 'rows.0.count'],
    [{ rows: 'everyone' }, 'rows'],
    [{}, 'rows'],
  ])('refuses %j with 422 naming %s', async (body, field) => {
    const res = await charge.put(`/api/days/${DAY}/roster`, body);
    expect(res.status).toBe(422);
    expect(res.body.error.details.problems.map((p: { field: string }) => p.field)).toContain(field);
  });

  it('refuses a room that is retired, and keeps planning a saved roster whose room was retired since', async () => {
    const room = (await admin.post('/api/rooms', { name: 'MR 9', modality: 'MR', airChangesPerHour: 10, staff: 1 })).body.room;
    const mr1 = rooms['MR 1']!;
    expect((await charge.put(`/api/days/${DAY}/roster`, { rows: [aides([mr1, rooms['MR 2']!, room.id])] })).status).toBe(200);
    expect((await admin.post(`/api/rooms/${room.id}/retire`)).status).toBe(200);
    expect((await admin.put(`/api/rooms/${mr1}`, { name: 'MR One', modality: 'MR', airChangesPerHour: 6, staff: 1 })).status).toBe(200);
    const { plan, gap } = await gapBefore('R-2');
    expect(plan.people.people[0].roomIds).toContain(room.id);
    expect(gap).toMatchObject({ verdict: 'short', crew: ['r1-1'] });
    const again = await charge.put(`/api/days/${DAY}/roster`, { rows: [aides([mr1, room.id])] });
    expect(again.status).toBe(422);
    expect(again.body.error.details.problems).toEqual([{ field: 'rows.0.roomIds', message: 'MR 9 is retired' }]);
    await admin.put(`/api/rooms/${mr1}`, { name: 'MR 1', modality: 'MR', airChangesPerHour: 6, staff: 1 });
  });

  it('returns the day to the weekly default (DELETE), which an admin sets per weekday with an audit row', async () => {
    const weekly = await admin.put('/api/roster/weekly/2', { rows: [aides([rooms['MR 1']!], { count: 2 }), { name: 'Ari Sol', role: 'technologist', count: 1, start: '08:00', end: '16:30', breaks: [{ start: '12:00', end: '12:30' }], roomIds: [rooms['MR 2']!] }] });
    expect(weekly.status).toBe(200);
    expect(weekly.body.weekly.weekdays[1].rows).toHaveLength(2);
    expect((await charge.put('/api/roster/weekly/2', { rows: [] })).status).toBe(403);
    const audit = (await admin.get('/api/audit?limit=1')).body.entries[0];
    expect(audit).toMatchObject({ area: 'roster', action: 'changed', subject: 'Tuesday roster' });

    const cleared = await charge.delete(`/api/days/${DAY}/roster`);
    expect(cleared.status).toBe(200);
    expect(cleared.body.roster.source).toBe('weekly');
    expect(cleared.body.roster.people.map((p: { label: string }) => p.label)).toEqual(['Aide 1', 'Aide 2', 'Ari Sol']);
    const other = (await scheduler.get(`/api/days/${NEXT_TUESDAY}/roster`)).body.roster;
    expect(other.source).toBe('weekly');
    const { plan } = await gapBefore('R-2');
    expect(plan.people.source).toBe('weekly');
    expect((await scheduler.get(`/api/days/${DAY}/history`)).body.changes[0]).toMatchObject({ reason: 'roster', summary: "Roster back to the weekday's default" });
  });

  it('changes every plan without a roster of its own when the weekly default changes (setup version)', async () => {
    const before = (await scheduler.get(`/api/days/${DAY}/plan`)).headers['etag'];
    expect((await admin.put('/api/roster/weekly/2', { rows: [aides([rooms['MR 1']!, rooms['MR 2']!])] })).status).toBe(200);
    const after = await scheduler.get(`/api/days/${DAY}/plan`);
    expect(after.headers['etag']).not.toBe(before);
    expect(after.body.people.people).toHaveLength(1);
  });

  it('refuses a weekday that is not 1–7', async () => {
    const res = await admin.put('/api/roster/weekly/8', { rows: [] });
    expect(res.status).toBe(422);
    expect(res.body.error.details.problems[0].field).toBe('weekday');
  });

  it('plans with the site walking time set in settings (admin), 0–30 minutes', async () => {
    const site = (await admin.get('/api/settings')).body.settings;
    expect(site.walkingMinutes).toBe(3);
    const bad = await admin.put('/api/settings', { timezone: site.timezone, snugMarginMinutes: 3, walkingMinutes: 31 });
    expect(bad.status).toBe(422);
    expect(bad.body.error.details.problems.map((p: { field: string }) => p.field)).toEqual(['walkingMinutes']);
    expect((await admin.put('/api/settings', { timezone: site.timezone, snugMarginMinutes: 3, walkingMinutes: 0 })).status).toBe(200);
    const { gap } = await gapBefore('R-2');
    // No walk: MR 1 starts 10:12, ready 10:32 for 10:29.
    expect(gap).toMatchObject({ verdict: 'short', shortByMinutes: 3 });
    expect((await scheduler.get(`/api/days/${DAY}/roster`)).body.roster.walkingMinutes).toBe(0);
    await admin.put('/api/settings', { timezone: site.timezone, snugMarginMinutes: 3, walkingMinutes: 3 });
  });

  describe('roster file', () => {
    const csv = (lines: string[]) => lines.join('\r\n') + '\r\n';

    it('previews a good file (dryRun) without saving, then imports it as the day\'s roster', async () => {
      const file = csv(['name,role,count,start,end,breaks,rooms', 'Sam Example,technologist,,07:00,15:30,11:00-11:30,MR 1', ',aide,2,07:00,15:00,,MR 1 + MR 2']);
      const before = (await charge.get(`/api/days/${DAY}/roster`)).body.roster;
      const preview = await charge.upload(`/api/days/${DAY}/roster/import?dryRun=true`, file, 'roster.csv');
      expect(preview.status).toBe(200);
      expect(preview.body).toMatchObject({ dryRun: true, roster: null });
      expect(preview.body.rows).toHaveLength(2);
      expect((await charge.get(`/api/days/${DAY}/roster`)).body.roster).toEqual(before);

      const done = await charge.upload(`/api/days/${DAY}/roster/import`, file, 'roster.csv');
      expect(done.status).toBe(200);
      expect(done.body.roster).toMatchObject({ source: 'day' });
      expect(done.body.roster.people.map((p: { label: string }) => p.label)).toEqual(['Sam Example', 'Aide 1', 'Aide 2']);
    });

    it('refuses a file with bad rows whole, every problem by row and column (422)', async () => {
      const before = (await charge.get(`/api/days/${DAY}/roster`)).body.roster;
      const res = await charge.upload(`/api/days/${DAY}/roster/import`, csv(['role,start,end,rooms', 'porter,07:00,15:00,MR 1', 'aide,15:00,07:00,MR 7']), 'roster.csv');
      expect(res.status).toBe(422);
      expect(res.body.errors).toEqual([
        { row: 2, column: 'role', message: 'a role is technologist or aide' },
        { row: 3, column: 'rooms', message: 'no room "MR 7" is set up (or it is retired)' },
        { row: 3, column: 'end', message: 'the shift must end after it starts' },
      ]);
      expect(res.body.errorCount).toBe(3);
      expect((await charge.get(`/api/days/${DAY}/roster`)).body.roster).toEqual(before);
    });

    it('refuses a header-only file, a binary one and one over the size limit with a clear error', async () => {
      const empty = await charge.upload(`/api/days/${DAY}/roster/import`, 'role,start,end,rooms\n', 'roster.csv');
      expect(empty.status).toBe(422);
      expect(empty.body.error.message).toBe('The file has a header row but no people.');
      expect((await charge.upload(`/api/days/${DAY}/roster/import`, Buffer.from([0, 1, 2, 3, 0, 0]), 'roster.csv')).status).toBe(415);
      const big = await charge.upload(`/api/days/${DAY}/roster/import`, 'x'.repeat(300 * 1024), 'roster.csv');
      expect(big.status).toBe(413);
      expect(big.body.error.code).toBe('file_limit_exceeded');
    });
  });
});
