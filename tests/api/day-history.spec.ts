import { EXAM_LIST_HEADER, toCsv } from '../fixtures/exam-lists';
import { signedIn, startHarness, type Client, type Harness } from './harness';

const DAY = '2027-03-10'; // America/Chicago, -06:00 (the demo site's zone)
const t = (hhmm: string) => `${DAY}T${hhmm}:00-06:00`;
const row = (acc: string, room: string, start: string, dur: number) => [acc, room, start, String(dur), 'MR exam', 'knee', 'none', 'ambulatory', 'no', ''];

describe('GET /api/days/:date/history', () => {
  let h: Harness;
  let charge: Client;
  let scheduler: Client;

  beforeEach(async () => {
    h = await startHarness(); // clock at 2027-03-10T14:00:00Z = 08:00 in Chicago
    charge = await signedIn(h.app, 'charge');
    scheduler = await signedIn(h.app, 'scheduler');
    const table = [EXAM_LIST_HEADER, row('A-1', 'MR 1', '08:00', 30), row('A-2', 'MR 1', '10:05', 30), row('B-1', 'MR 2', '08:00', 30)];
    expect((await scheduler.upload(`/api/days/${DAY}/exams/import`, toCsv(table), 'day.csv')).status).toBe(200);
  });
  afterEach(() => h.close());

  const examId = async (acc: string) => {
    const plan = (await charge.get(`/api/days/${DAY}/plan`)).body;
    for (const r of plan.rooms) for (const e of r.exams) if (e.accession === acc) return { id: e.id as number, version: e.version as number, roomId: r.id as number };
    throw new Error(acc);
  };
  const history = async (client: Client) => (await client.get(`/api/days/${DAY}/history`)).body;

  it('answers every time with the site\'s offset (README: times are ISO 8601 with offset), never UTC', async () => {
    const a2 = await examId('A-2');
    await scheduler.patch(`/api/exams/${a2.id}`, { start: t('10:20'), version: a2.version, reason: 'drag' });
    const [change] = (await history(charge)).changes;
    expect(change.at).toBe(`${DAY}T08:00:00-06:00`);
    expect(change.changes[0]).toMatchObject({ from: { start: t('10:05') }, to: { start: t('10:20') } });
  });

  it('words a move "from <room> <time> to <time>", naming both rooms when the room changes', async () => {
    const a2 = await examId('A-2');
    const mr2 = await examId('B-1');
    await scheduler.patch(`/api/exams/${a2.id}`, { start: t('10:20'), version: a2.version, reason: 'drag' });
    await scheduler.patch(`/api/exams/${a2.id}`, { start: t('11:00'), roomId: mr2.roomId, version: a2.version + 1, reason: 'drag' });
    await scheduler.post(`/api/days/${DAY}/undo`);
    const summaries = (await history(charge)).changes.map((c: { summary: string }) => c.summary);
    expect(summaries).toEqual([
      'Undid: Moved A-2 from MR 1 10:20 to MR 2 11:00',
      'Moved A-2 from MR 1 10:20 to MR 2 11:00',
      'Moved A-2 from MR 1 10:05 to 10:20',
    ]);
  });

  it('says whether the signed-in user has something to undo or redo (their own actions only)', async () => {
    expect(await history(scheduler)).toMatchObject({ canUndo: false, canRedo: false });
    const a2 = await examId('A-2');
    await scheduler.patch(`/api/exams/${a2.id}`, { start: t('10:20'), version: a2.version, reason: 'drag' });
    expect(await history(scheduler)).toMatchObject({ canUndo: true, canRedo: false });
    expect(await history(charge)).toMatchObject({ canUndo: false, canRedo: false }); // not charge's move
    expect((await scheduler.post(`/api/days/${DAY}/undo`)).status).toBe(200);
    expect(await history(scheduler)).toMatchObject({ canUndo: false, canRedo: true });
    expect((await scheduler.post(`/api/days/${DAY}/redo`)).status).toBe(200);
    expect(await history(scheduler)).toMatchObject({ canUndo: true, canRedo: false });
    // A new action after an undo ends the redo, as POST /redo does.
    await scheduler.post(`/api/days/${DAY}/undo`);
    const a1 = await examId('A-1');
    await scheduler.patch(`/api/exams/${a1.id}`, { start: t('08:10'), version: a1.version, reason: 'drag' });
    expect(await history(scheduler)).toMatchObject({ canUndo: true, canRedo: false });
    expect((await scheduler.post(`/api/days/${DAY}/redo`)).status).toBe(409);
  });

  it('tells the front desk it has nothing to undo (it may not move slots)', async () => {
    const desk = await signedIn(h.app, 'frontdesk');
    expect(await history(desk)).toMatchObject({ canUndo: false, canRedo: false });
  });
});
