import type { ExamMove } from '../../shared/api/changes';
import type { PlannedDay } from '../../shared/api/plan';
import { withChanges } from '../../shared/fixes/apply-changes';
import { computeDayPlan } from '../../shared/turnover';
import { EXAM_LIST_HEADER, toCsv } from '../fixtures/exam-lists';
import { signedIn, startHarness, type Client, type Harness } from './harness';

const DAY = '2027-03-10'; // America/Chicago, -06:00
const t = (hhmm: string) => `${DAY}T${hhmm}:00-06:00`;
const row = (acc: string, room: string, start: string, dur: number, precaution = 'none') =>
  [acc, room, start, String(dur), 'MR exam', 'knee', precaution, 'ambulatory', 'no', ''];

/** The plan without its input and without exam versions (a move bumps the moved exam's). */
function shape(plan: PlannedDay | ReturnType<typeof computeDayPlan>) {
  return {
    summary: plan.summary,
    rooms: plan.rooms.map((room) => ({ ...room, exams: room.exams.map(({ version: _version, ...exam }) => exam) })),
  };
}

describe('the plan carries its own input', () => {
  let h: Harness;
  let charge: Client;

  beforeAll(async () => {
    h = await startHarness();
    charge = await signedIn(h.app, 'charge');
    const scheduler = await signedIn(h.app, 'scheduler');
    const table = [
      EXAM_LIST_HEADER,
      row('M-1', 'MR 1', '08:00', 30, 'airborne'),
      row('M-2', 'MR 1', '08:40', 30),
      row('M-3', 'MR 1', '10:00', 30),
      row('N-1', 'MR 2', '08:00', 30),
    ];
    expect((await scheduler.upload(`/api/days/${DAY}/exams/import`, toCsv(table), 'day.csv')).status).toBe(200);
  }, 30_000);
  afterAll(() => h.close());

  const plan = async (): Promise<PlannedDay> => (await charge.get(`/api/days/${DAY}/plan`)).body;

  it('answers the input the plan was computed from, which computes the very same plan', async () => {
    const served = await plan();
    const { input, ...rest } = served;
    expect(input.rooms.find((room) => room.name === 'MR 1')).toMatchObject({ airChangesPerHour: expect.any(Number), opensAt: expect.stringMatching(/^\d\d:\d\d$/) });
    expect(computeDayPlan(input)).toEqual(rest);
  });

  it('keeps a helper added to one gap as a staff override, not a guess from the gap', async () => {
    const m3 = (await plan()).rooms.flatMap((room) => room.exams).find((exam) => exam.accession === 'M-3')!;
    const res = await charge.put(`/api/exams/${m3.id}/staffing`, { staff: 2 });
    expect(res.status).toBe(200);
    expect((res.body as PlannedDay).input.staffOverrides).toEqual({ [m3.id]: 2 });
    expect((await plan()).input.staffOverrides).toEqual({ [m3.id]: 2 });
  });

  it("previews a move from the served input exactly as the server answers it after the move", async () => {
    const before = await plan();
    const m2 = before.rooms.flatMap((room) => room.exams).find((exam) => exam.accession === 'M-2')!;
    const mr2 = before.rooms.find((room) => room.name === 'MR 2')!;
    const move: ExamMove = { type: 'move', examId: m2.id, accession: 'M-2', from: { roomId: m2.roomId, start: m2.start }, to: { roomId: mr2.id, start: t('09:00') } };
    const preview = computeDayPlan(withChanges(before.input, [move]));
    const res = await charge.patch(`/api/exams/${m2.id}`, { start: t('09:00'), roomId: mr2.id, version: m2.version, reason: 'drag' });
    expect(res.status).toBe(200);
    expect(shape(res.body)).toEqual(shape(preview));
  });

  it('keeps the ETag: an unchanged day revalidates to 304 and a change gives a new tag', async () => {
    const first = await charge.get(`/api/days/${DAY}/plan`);
    const again = await charge.get(`/api/days/${DAY}/plan`).set('If-None-Match', first.headers['etag']);
    expect(again.status).toBe(304);
  });
});
