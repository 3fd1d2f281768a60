import type { BoardShiftTask } from '../../shared/api/board';
import { buildRule } from '../../shared/shift-tasks/rule-builder';
import { signedIn, startHarness, type Client, type Harness } from './harness';

// 2027-03-10 (Wednesday) 14:00Z is 08:00 at the demo site (America/Chicago, CST until 14 March 2027).
describe('Setup: shift tasks (RFC 5545 rules per room)', () => {
  let h: Harness;
  let admin: Client;
  beforeAll(async () => {
    h = await startHarness({ now: '2027-03-10T14:00:00Z' });
    admin = await signedIn(h.app, 'admin');
  }, 30_000);
  afterAll(() => h.close(), 30_000);

  const tasksOn = async (day: string, roomId: number): Promise<BoardShiftTask[]> =>
    (await admin.get(`/api/days/${day}/board`)).body.rooms.find((r: { roomId: number }) => r.roomId === roomId).tasks;
  const fields = (res: { body: { error: { details: { problems: { field: string; message: string }[] } } } }) => res.body.error.details.problems;
  const roomId = async (name: string) => (await h.db('rooms').where({ name }).first('id')).id as number;

  it('lists every room’s recurring tasks with their rules', async () => {
    const res = await admin.get('/api/shift-tasks');
    expect(res.status).toBe(200);
    const mr1 = res.body.tasks.filter((t: { roomName: string }) => t.roomName === 'MR 1');
    expect(mr1.map((t: { key: string }) => t.key)).toEqual(['wipe-start', 'scanner-qa', 'wipe-end', 'deep-clean']);
    expect(mr1[0]).toMatchObject({ rrule: expect.stringMatching(/^DTSTART:\d{8}T\d{6}\nRRULE:FREQ=DAILY$/), retired: false });
  });

  it('adds "every other week on Monday and Friday" and it falls on exactly those days', async () => {
    // A rule of the shape of RFC 5545 §3.8.5.3's "every other week on …" examples; dates derived by
    // hand from a calendar: Monday 1 March 2027, then every second week's Monday and Friday.
    const rrule = buildRule({ freq: 'WEEKLY', interval: 2, byDay: ['MO', 'FR'], time: '07:30', starts: '2027-03-01', count: null, until: null });
    expect(rrule).toBe('DTSTART:20270301T073000\nRRULE:FREQ=WEEKLY;INTERVAL=2;BYDAY=MO,FR');
    const ct = await roomId('CT 1');
    const res = await admin.post('/api/shift-tasks', { roomId: ct, label: 'Injector head wipe-down', rrule, durationMinutes: 10 });
    expect(res.status).toBe(201);
    expect(res.body.task).toMatchObject({ roomId: ct, roomName: 'CT 1', label: 'Injector head wipe-down', durationMinutes: 10, retired: false });
    const days = ['2027-03-01', '2027-03-05', '2027-03-08', '2027-03-12', '2027-03-15', '2027-03-19', '2027-03-22', '2027-03-29', '2027-04-02'];
    const falls: string[] = [];
    for (const day of days) {
      const mine = (await tasksOn(day, ct)).filter((t) => t.taskId === res.body.task.id);
      if (mine.length > 0) falls.push(mine[0]!.due);
    }
    // 07:30 local; Chicago moves to CDT (UTC−5) on 14 March 2027
    expect(falls).toEqual(['2027-03-01T07:30:00-06:00', '2027-03-05T07:30:00-06:00', '2027-03-15T07:30:00-05:00', '2027-03-19T07:30:00-05:00', '2027-03-29T07:30:00-05:00', '2027-04-02T07:30:00-05:00']);
  });

  it('refuses a bad rule with 422 naming every problem (RFC 5545 §3.3.10)', async () => {
    const ct = await roomId('CT 1');
    const res = await admin.post('/api/shift-tasks', {
      roomId: ct,
      label: '',
      rrule: 'DTSTART:20270301T073000\nRRULE:FREQ=WEEKLY;INTERVAL=0;BYDAY=MO,XX;COUNT=4;UNTIL=20270401T235959',
      durationMinutes: 0,
    });
    expect(res.status).toBe(422);
    const problems = fields(res);
    expect(problems.map((p) => p.field).sort()).toEqual(['durationMinutes', 'label', 'rrule', 'rrule', 'rrule']);
    const rule = problems.filter((p) => p.field === 'rrule').map((p) => p.message);
    expect(rule).toEqual([
      'INTERVAL=0: a whole number from 1 to 99',
      'BYDAY=MO,XX: weekdays as MO, TU, WE, TH, FR, SA, SU',
      // RFC 5545 §3.3.10: UNTIL and COUNT MUST NOT occur in the same recur
      'COUNT and UNTIL may not both be given (RFC 5545 §3.3.10): end after a number of times or on a date',
    ]);
    const hourly = await admin.post('/api/shift-tasks', { roomId: ct, label: 'x', rrule: 'RRULE:FREQ=HOURLY', durationMinutes: 5 });
    expect(fields(hourly).map((p) => p.message)).toEqual([
      'give one DTSTART line: the first occurrence, e.g. DTSTART:20270104T070000',
      'FREQ=HOURLY: a shift task repeats DAILY, WEEKLY, MONTHLY or YEARLY',
    ]);
    expect((await admin.post('/api/shift-tasks', { roomId: 9999, label: 'x', rrule: 'DTSTART:20270301T073000\nRRULE:FREQ=DAILY', durationMinutes: 5 })).status).toBe(404);
  });

  it('edits and retires a task, one audit row each; a retired task leaves the board', async () => {
    const ct = await roomId('CT 1');
    const task = (await admin.get('/api/shift-tasks')).body.tasks.find((t: { label: string }) => t.label === 'Injector head wipe-down');
    const rrule = 'DTSTART:20270301T080000\nRRULE:FREQ=DAILY';
    const res = await admin.put(`/api/shift-tasks/${task.id}`, { label: 'Injector head wipe-down', rrule, durationMinutes: 15 });
    expect(res.body.task).toMatchObject({ rrule, durationMinutes: 15 });
    expect((await tasksOn('2027-03-11', ct)).find((t) => t.taskId === task.id)).toMatchObject({ due: '2027-03-11T08:00:00-06:00', durationMinutes: 15 });
    const retired = await admin.post(`/api/shift-tasks/${task.id}/retire`, {});
    expect(retired.body.task.retired).toBe(true);
    expect((await tasksOn('2027-03-11', ct)).find((t) => t.taskId === task.id)).toBeUndefined();
    const audit = (await admin.get('/api/audit?limit=10')).body.entries.filter((e: { area: string }) => e.area === 'shift task');
    expect(audit.map((e: { action: string }) => e.action)).toEqual(['retired', 'changed', 'created']);
    expect(audit[1]).toMatchObject({ subject: 'CT 1: Injector head wipe-down', before: { durationMinutes: 10 }, after: { rrule, durationMinutes: 15 } });
  });

  it('gives a room set up now no overdue tasks from before it existed', async () => {
    const made = await admin.post('/api/rooms', { name: 'US 3', modality: 'US', airChangesPerHour: 6, opensAt: '07:00', closesAt: '19:00' });
    const today = await tasksOn('2027-03-10', made.body.room.id);
    // set up at 08:00: the 07:00 wipe-down and 07:05 QA of today were never due; the evening's are
    expect(today.map((t) => [t.key, t.due, t.overdue])).toEqual([['wipe-end', '2027-03-10T19:00:00-06:00', false]]);
    const tomorrow = await tasksOn('2027-03-11', made.body.room.id);
    expect(tomorrow.map((t) => t.key)).toEqual(['wipe-start', 'scanner-qa', 'wipe-end']);
  });

  it('lets only an admin set up shift tasks', async () => {
    const charge = await signedIn(h.app, 'charge');
    expect((await charge.get('/api/shift-tasks')).status).toBe(403);
    expect((await charge.post('/api/shift-tasks', {})).status).toBe(403);
  });
});
