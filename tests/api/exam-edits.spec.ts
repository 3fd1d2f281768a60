import { EXAM_LIST_HEADER, toCsv } from '../fixtures/exam-lists';
import { DayEvents } from '../../server/services/day-events';
import { signedIn, startHarness, type Client, type Harness } from './harness';

const DAY = '2027-03-10'; // America/Chicago, -06:00
const t = (hhmm: string) => `${DAY}T${hhmm}:00-06:00`;
const row = (acc: string, room: string, start: string, dur: number) => [acc, room, start, String(dur), 'MR exam', 'knee', 'none', 'ambulatory', 'no', ''];

interface PlanExam {
  id: number;
  accession: string;
  roomId: number;
  start: string;
  durationMinutes: number;
  procedure: string;
  contrast: boolean;
  version: number;
}
interface Plan {
  rooms: { id: number; name: string; exams: PlanExam[] }[];
}

describe('adding, editing and cancelling one exam by hand', () => {
  let h: Harness;
  let scheduler: Client;
  let charge: Client;
  let events: DayEvents;

  beforeEach(async () => {
    events = new DayEvents();
    h = await startHarness({ events });
    scheduler = await signedIn(h.app, 'scheduler');
    charge = await signedIn(h.app, 'charge');
    const table = [EXAM_LIST_HEADER, row('M-1', 'MR 1', '08:00', 30), row('M-2', 'MR 1', '09:00', 30), row('C-1', 'CT 1', '08:00', 15)];
    expect((await scheduler.upload(`/api/days/${DAY}/exams/import`, toCsv(table), 'day.csv')).status).toBe(200);
  });
  afterEach(() => h.close());

  const plan = async (): Promise<Plan> => (await charge.get(`/api/days/${DAY}/plan`)).body;
  const exams = (p: Plan) => p.rooms.flatMap((r) => r.exams.map((e) => ({ ...e, roomName: r.name })));
  const find = (p: Plan, acc: string) => exams(p).find((e) => e.accession === acc);
  const history = async () => (await charge.get(`/api/days/${DAY}/history`)).body.changes;
  const form = { accession: 'NEW-1', room: 'mr 1', start: '10:00', duration_min: 45, procedure: 'MR brain with contrast', coil: 'head', contrast: true };

  it('adds an exam: 201 with the day plan holding it, one history entry and one live event', async () => {
    const published: string[] = [];
    events.subscribe(DAY, (e) => published.push(`${e.kind}:${e.reason}`));
    const res = await scheduler.post(`/api/days/${DAY}/exams`, form);
    expect(res.status).toBe(201);
    const added = find(res.body, 'NEW-1');
    expect(added).toMatchObject({ roomName: 'MR 1', start: t('10:00'), durationMinutes: 45, procedure: 'MR brain with contrast', contrast: true, version: 1 });
    expect(find(await plan(), 'NEW-1')).toMatchObject({ id: added!.id });
    const changes = await history();
    expect(changes).toHaveLength(1);
    expect(changes[0]).toMatchObject({ reason: 'exam added', summary: 'Added NEW-1: MR 1 10:00, 45 min', changes: [{ type: 'exam', examId: added!.id, from: null, to: { accession: 'NEW-1', start: t('10:00') } }] });
    expect(published).toEqual(['plan:exam added']);
  });

  it('edits an exam at its version: fields change, the version rises, undo restores it', async () => {
    const m2 = find(await plan(), 'M-2')!;
    const res = await scheduler.put(`/api/exams/${m2.id}`, { ...form, accession: 'M-2', room: 'MR 1', start: '09:15', duration_min: 20, version: m2.version });
    expect(res.status).toBe(200);
    expect(find(res.body, 'M-2')).toMatchObject({ id: m2.id, start: t('09:15'), durationMinutes: 20, procedure: 'MR brain with contrast', version: m2.version + 1 });
    expect((await history())[0]).toMatchObject({ reason: 'exam edited', summary: 'Edited M-2: MR 1 09:15, 20 min' });

    const undo = await scheduler.post(`/api/days/${DAY}/undo`);
    expect(undo.status).toBe(200);
    expect(find(await plan(), 'M-2')).toMatchObject({ id: m2.id, start: t('09:00'), durationMinutes: 30, procedure: 'MR exam' });
  });

  it('cancels an exam at its version; undo puts it back under its old id, redo cancels it again', async () => {
    const m2 = find(await plan(), 'M-2')!;
    const res = await scheduler.delete(`/api/exams/${m2.id}?version=${m2.version}`);
    expect(res.status).toBe(200);
    expect(find(res.body, 'M-2')).toBeUndefined();
    expect((await history())[0]).toMatchObject({ reason: 'exam cancelled', summary: 'Cancelled M-2: MR 1 09:00', changes: [{ type: 'exam', from: { accession: 'M-2' }, to: null }] });

    expect((await scheduler.post(`/api/days/${DAY}/undo`)).status).toBe(200);
    expect(find(await plan(), 'M-2')).toMatchObject({ id: m2.id, start: t('09:00') });
    expect((await scheduler.post(`/api/days/${DAY}/redo`)).status).toBe(200);
    expect(find(await plan(), 'M-2')).toBeUndefined();
  });

  it('refuses an edit or a cancel at a stale version with 409 stale_version naming who changed it', async () => {
    const m2 = find(await plan(), 'M-2')!;
    expect((await scheduler.patch(`/api/exams/${m2.id}`, { start: t('09:10'), version: m2.version })).status).toBe(200);
    const edit = await charge.put(`/api/exams/${m2.id}`, { ...form, accession: 'M-2', version: m2.version });
    expect(edit.status).toBe(409);
    expect(edit.body.error).toMatchObject({ code: 'stale_version', details: { currentVersion: m2.version + 1, changedBy: { username: 'scheduler' } } });
    const cancel = await charge.delete(`/api/exams/${m2.id}?version=${m2.version}`);
    expect(cancel.status).toBe(409);
    expect(cancel.body.error.code).toBe('stale_version');
    expect(find(await plan(), 'M-2')).toMatchObject({ start: t('09:10'), procedure: 'MR exam' });
  });

  it('refuses to edit, cancel or move an exam whose end is recorded (409 exam_finished), keeping it and its turnover', async () => {
    const tech = await signedIn(h.app, 'tech');
    const m1 = find(await plan(), 'M-1')!;
    const finished = await tech.post(`/api/exams/${m1.id}/finished`, { earlyReason: 'Scan stopped early at the patient\'s request' });
    expect(finished.status).toBe(201);
    const cancel = await scheduler.delete(`/api/exams/${m1.id}?version=${m1.version}`);
    expect(cancel.status).toBe(409);
    expect(cancel.body.error).toMatchObject({ code: 'exam_finished', details: { endedAt: expect.any(String) } });
    const edit = await scheduler.put(`/api/exams/${m1.id}`, { ...form, accession: 'M-1', version: m1.version });
    expect(edit.status).toBe(409);
    expect(edit.body.error.code).toBe('exam_finished');
    // Nor moved: the plan would put it where the cleaning log says it was not.
    const move = await scheduler.patch(`/api/exams/${m1.id}`, { start: t('08:20'), version: m1.version });
    expect(move.status).toBe(409);
    expect(move.body.error).toMatchObject({ code: 'exam_finished', details: { endedAt: expect.any(String) } });
    expect(move.body.error.message).toContain('cannot be moved');
    expect(find(await plan(), 'M-1')).toMatchObject({ id: m1.id, start: t('08:00'), procedure: 'MR exam' });
    expect(await h.db('turnovers').where({ from_exam_id: m1.id }).count({ n: '*' }).first()).toEqual({ n: 1 });
  });

  it('refuses an accession the day already has, naming it, on add and on edit', async () => {
    const add = await scheduler.post(`/api/days/${DAY}/exams`, { ...form, accession: 'M-1' });
    expect(add.status).toBe(422);
    expect(add.body.error).toMatchObject({ code: 'validation_failed', details: { problems: [{ field: 'accession' }] } });
    expect(add.body.error.message).toContain('"M-1"');
    const m2 = find(await plan(), 'M-2')!;
    const edit = await scheduler.put(`/api/exams/${m2.id}`, { ...form, accession: 'M-1', version: m2.version });
    expect(edit.status).toBe(422);
    expect(edit.body.error.details.problems[0].message).toContain('"M-1"');
    expect(exams(await plan()).map((e) => e.accession).sort()).toEqual(['C-1', 'M-1', 'M-2']);
  });

  it('refuses a bad cell with the message the import gives for the same cell', async () => {
    const file = await scheduler.upload(`/api/days/${DAY}/exams/import?dryRun=true`, toCsv([EXAM_LIST_HEADER, ['X-1', 'MR 1', '25:00', '4', 'MR knee', '', 'none', 'ambulatory', 'maybe', '']]), 'bad.csv');
    expect(file.status).toBe(422);
    const fromFile = (file.body.errors as { column: string; message: string }[]).map((e) => ({ field: e.column, message: e.message }));
    expect(fromFile.map((p) => p.field)).toEqual(['start', 'duration_min', 'contrast']);

    const res = await scheduler.post(`/api/days/${DAY}/exams`, { accession: 'X-1', room: 'MR 1', start: '25:00', duration_min: 4, procedure: 'MR knee', contrast: 'maybe' });
    expect(res.status).toBe(422);
    expect(res.body.error.details.problems).toEqual(fromFile);
    expect(find(await plan(), 'X-1')).toBeUndefined();
  });

  it('forbids the front desk and technologists (403)', async () => {
    const m1 = find(await plan(), 'M-1')!;
    for (const role of ['frontdesk', 'tech'] as const) {
      const c = await signedIn(h.app, role);
      expect((await c.post(`/api/days/${DAY}/exams`, form)).status).toBe(403);
      expect((await c.put(`/api/exams/${m1.id}`, { ...form, accession: 'M-1', version: m1.version })).status).toBe(403);
      expect((await c.delete(`/api/exams/${m1.id}?version=${m1.version}`)).status).toBe(403);
    }
    expect(await history()).toEqual([]);
  });

  it('gives the plan a new ETag after each add, edit and cancel', async () => {
    const etag = async () => (await charge.get(`/api/days/${DAY}/plan`)).headers['etag'] as string;
    const seen = [await etag()];
    const added = find((await scheduler.post(`/api/days/${DAY}/exams`, form)).body, 'NEW-1')!;
    seen.push(await etag());
    await scheduler.put(`/api/exams/${added.id}`, { ...form, duration_min: 30, version: added.version });
    seen.push(await etag());
    await scheduler.delete(`/api/exams/${added.id}?version=${added.version + 1}`);
    seen.push(await etag());
    expect(new Set(seen).size).toBe(4);
    const revalidated = await charge.get(`/api/days/${DAY}/plan`).set('If-None-Match', seen[0]!);
    expect(revalidated.status).toBe(200);
  });
});
