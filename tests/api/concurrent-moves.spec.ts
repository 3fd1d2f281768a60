import { EXAM_LIST_HEADER, toCsv } from '../fixtures/exam-lists';
import { signedIn, startHarness, type Client, type Harness } from './harness';

const DAY = '2027-03-10'; // America/Chicago, -06:00
const t = (hhmm: string) => `${DAY}T${hhmm}:00-06:00`;
const row = (acc: string, start: string) => [acc, 'MR 1', start, '30', 'MR exam', 'knee', 'none', 'ambulatory', 'no', ''];

describe('concurrent moves of one slot', () => {
  let h: Harness;
  let charge: Client;
  let scheduler: Client;
  beforeAll(async () => {
    h = await startHarness();
    charge = await signedIn(h.app, 'charge');
    scheduler = await signedIn(h.app, 'scheduler');
    const csv = toCsv([EXAM_LIST_HEADER, row('M-1', '08:00'), row('M-2', '09:00')]);
    expect((await scheduler.upload(`/api/days/${DAY}/exams/import`, csv, 'day.csv')).status).toBe(200);
  }, 30_000);
  afterAll(() => h.close(), 30_000);

  it('exactly one of many moves made from the same version wins; the rest get 409 and change nothing', async () => {
    const exam = (await h.db('exams').where({ day: DAY, accession: 'M-2' }).first()) as { id: number; version: number };
    const starts = Array.from({ length: 24 }, (_, i) => t(`10:${String(i * 2).padStart(2, '0')}`));
    const answers = await Promise.all(
      starts.map((start, i) => (i % 2 ? charge : scheduler).patch(`/api/exams/${exam.id}`, { start, version: exam.version, reason: 'drag' })),
    );
    const won = answers.filter((a) => a.status === 200);
    expect(won).toHaveLength(1);
    expect(answers.filter((a) => a.status === 409)).toHaveLength(starts.length - 1);
    const stored = (await h.db('exams').where({ id: exam.id }).first()) as { start_at: string; version: number };
    expect(stored.version).toBe(exam.version + 1);
    const winner = starts[answers.indexOf(won[0]!)]!;
    expect(Date.parse(stored.start_at)).toBe(Date.parse(winner));
    expect(await h.db('plan_changes').where({ day: DAY }).count({ n: '*' })).toEqual([{ n: 1 }]);
  });
});
