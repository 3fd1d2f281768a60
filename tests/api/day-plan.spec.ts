import { toCsv, EXAM_LIST_HEADER } from '../fixtures/exam-lists';
import { signedIn, startHarness, type Client, type Harness } from './harness';

/**
 * The plan contract end to end: file → import → stored list → engine → GET plan. The expected
 * minutes are the brief's worked values for the default MR protocol (demo defaults) and the
 * CDC air-clearance formula (Guidelines for Environmental Infection Control in Health-Care
 * Facilities, 2003, Appendix B, Table B.1: 99.9 % at 6 ACH = 69 min; we round up to 70).
 */
const DAY = '2027-03-10'; // America/Chicago, CST (-06:00), no clock change that day

function row(acc: string, room: string, start: string, dur: number, extra: Partial<Record<'coil' | 'precaution' | 'mobility' | 'contrast', string>> = {}) {
  return [acc, room, start, String(dur), 'MR exam', extra.coil ?? 'knee', extra.precaution ?? 'none', extra.mobility ?? 'ambulatory', extra.contrast ?? 'no', ''];
}

describe('GET /api/days/:date/plan', () => {
  let h: Harness;
  let charge: Client;
  beforeAll(async () => {
    h = await startHarness();
    charge = await signedIn(h.app, 'charge');
    // MR 1: 6 ACH, 1 person; MR 3: 2 people (demo rooms)
    const table = [
      EXAM_LIST_HEADER,
      row('P-1', 'MR 1', '07:10', 30), // opening gap: 10 min available
      row('P-2', 'MR 1', '08:00', 30), // 20 available, plain → needs 20: fits? snug (margin 3)
      row('P-3', 'MR 1', '08:52', 30, { coil: 'head' }), // coil change → 22 needed, 22 available
      row('P-4', 'MR 1', '09:40', 30, { precaution: 'enteric' }),
      row('P-5', 'MR 1', '10:30', 30, { precaution: 'airborne' }), // 24 needed after enteric, 20 available → short by 4
      row('P-6', 'MR 1', '12:00', 30), // airborne in 6 ACH → 70 needed, 60 available → short by 10
      row('P-7', 'MR 1', '12:20', 30), // overlap: starts before P-6 ends
      row('Q-1', 'MR 3', '08:00', 30),
      row('Q-2', 'MR 3', '08:44', 30), // 2 people, plain → 14 needed, 14 available → snug
    ];
    const res = await charge.upload(`/api/days/${DAY}/exams/import`, toCsv(table), 'worked-values.csv');
    expect(res.status).toBe(200);
  });
  afterAll(() => h.close());

  const gapTo = async (accession: string) => {
    const plan = (await charge.get(`/api/days/${DAY}/plan`)).body;
    for (const room of plan.rooms) {
      const exam = room.exams.find((e: { accession: string }) => e.accession === accession);
      if (exam) return { plan, room, gap: room.gaps.find((g: { toExamId: number }) => g.toExamId === exam.id) };
    }
    throw new Error(`no exam ${accession}`);
  };

  it('answers the contract shape with site-offset ISO times', async () => {
    const { plan, room } = await gapTo('P-2');
    expect(plan).toMatchObject({ date: DAY, timezone: 'America/Chicago' });
    expect(plan.rooms.map((r: { name: string }) => r.name)).toEqual(['MR 1', 'MR 2', 'MR 3', 'CT 1']);
    expect(room.exams[1]).toMatchObject({ accession: 'P-2', start: '2027-03-10T08:00:00-06:00', end: '2027-03-10T08:30:00-06:00', version: 1 });
    expect(Object.keys(plan.summary).sort()).toEqual(['fits', 'minutesShort', 'overlap', 'short', 'snug']);
  });

  it('plain MR turnover, one person: 20 min (brief worked value)', async () => {
    const { gap } = await gapTo('P-2');
    expect(gap).toMatchObject({ requiredMinutes: 20, availableMinutes: 20, verdict: 'snug', shortByMinutes: 0 });
    expect(gap.readyAt).toBe('2027-03-10T08:00:00-06:00');
    expect(gap.steps[0].key).toBe('clear');
    expect(gap.steps.at(-1).key).toBe('hygiene');
  });

  it('coil change: 22 min', async () => {
    expect((await gapTo('P-3')).gap).toMatchObject({ requiredMinutes: 22, availableMinutes: 22 });
  });

  it('after an enteric case: 24 min (not the greedy 25), short by 4 with 20 available', async () => {
    expect((await gapTo('P-5')).gap).toMatchObject({ requiredMinutes: 24, availableMinutes: 20, verdict: 'short', shortByMinutes: 4 });
  });

  it('after an airborne case in a 6-ACH room: 70 min air hold, short by 10', async () => {
    expect((await gapTo('P-6')).gap).toMatchObject({ requiredMinutes: 70, airHoldMinutes: 70, verdict: 'short', shortByMinutes: 10 });
  });

  it('flags an overlap', async () => {
    expect((await gapTo('P-7')).gap).toMatchObject({ verdict: 'overlap', availableMinutes: -10 });
  });

  it('two people, plain: 14 min', async () => {
    expect((await gapTo('Q-2')).gap).toMatchObject({ requiredMinutes: 14, staff: 2 });
  });

  it('measures the first gap from the room opening with the opening steps', async () => {
    const { gap } = await gapTo('P-1');
    expect(gap.fromExamId).toBeNull();
    expect(gap.availableMinutes).toBe(10);
    expect(gap.requiredMinutes).toBeGreaterThan(0);
  });

  it('counts the verdicts in the summary', async () => {
    const { plan } = await gapTo('P-1');
    const gaps = plan.rooms.flatMap((r: { gaps: { verdict: string }[] }) => r.gaps);
    for (const v of ['fits', 'snug', 'short', 'overlap']) expect(plan.summary[v]).toBe(gaps.filter((g: { verdict: string }) => g.verdict === v).length);
  });

  it('answers an empty plan for a day with no list, and 422 for a bad date', async () => {
    const empty = await charge.get('/api/days/2027-03-11/plan');
    expect(empty.status).toBe(200);
    expect(empty.body.rooms.every((r: { exams: unknown[] }) => r.exams.length === 0)).toBe(true);
    expect((await charge.get('/api/days/2027-13-01/plan')).status).toBe(422);
  });
});
