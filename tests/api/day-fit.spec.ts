import { EXAM_LIST_HEADER, toCsv } from '../fixtures/exam-lists';
import { signedIn, startHarness, type Client, type Harness } from './harness';

const DAY = '2027-03-10'; // the demo seed's "today" for this clock (America/Chicago)

type Plan = { rooms: { id: number; modality: string; exams: { id: number; roomId: number; start: string; pinned?: boolean }[]; gaps: { toExamId: number; staff: number; verdict: string }[] }[] };
const places = (plan: Plan) => plan.rooms.flatMap((r) => r.exams.map((e) => [e.id, e.roomId, e.start]));
const staffing = (plan: Plan) => plan.rooms.flatMap((r) => r.gaps.map((g) => [g.toExamId, g.staff]));

describe('make the day fit (API, real database)', () => {
  let h: Harness;
  let charge: Client;
  let scheduler: Client;
  beforeAll(async () => {
    h = await startHarness({ seedDay: true, now: '2027-03-10T11:00:00Z' });
    charge = await signedIn(h.app, 'charge');
    scheduler = await signedIn(h.app, 'scheduler');
  }, 60_000);
  afterAll(() => h.close(), 30_000);

  it('proposes, applies as one history entry, and undo restores the day exactly', async () => {
    const before: Plan = (await charge.get(`/api/days/${DAY}/plan`)).body;
    // Pin one exam of a problem gap: it must stay where it is.
    const problem = before.rooms.flatMap((r) => r.gaps).find((g) => g.verdict === 'short' || g.verdict === 'overlap')!;
    expect(problem).toBeDefined();
    expect((await scheduler.put(`/api/exams/${problem.toExamId}/pin`, { pinned: true })).status).toBe(200);
    const pinnedPlan: Plan = (await charge.get(`/api/days/${DAY}/plan`)).body;
    expect(pinnedPlan.rooms.flatMap((r) => r.exams).find((e) => e.id === problem.toExamId)?.pinned).toBe(true);

    const res = await charge.post(`/api/days/${DAY}/fit`);
    expect(res.status).toBe(200);
    const proposal = res.body;
    expect(proposal.fixed).toEqual(expect.arrayContaining([{ examId: problem.toExamId, accession: expect.any(String), reason: 'pinned' }]));
    expect(proposal.moves.map((m: { examId: number }) => m.examId)).not.toContain(problem.toExamId);
    expect(proposal.changes.length).toBeGreaterThan(0);
    expect(proposal.calls.length).toBeLessThanOrEqual(proposal.moves.length);
    expect(['optimal', 'time-limit']).toContain(proposal.solver.status);
    expect(typeof proposal.dayVersion).toBe('number');

    const applied = await charge.post(`/api/days/${DAY}/fit/apply`, { dayVersion: proposal.dayVersion, changes: proposal.changes });
    expect(applied.status).toBe(200);
    const after: Plan = applied.body.plan;
    for (const move of proposal.moves) {
      const exam = after.rooms.flatMap((r) => r.exams).find((e) => e.id === move.examId)!;
      expect([exam.roomId, Date.parse(exam.start)]).toEqual([move.to.roomId, Date.parse(move.to.start)]);
    }
    const history = (await charge.get(`/api/days/${DAY}/history`)).body;
    expect(history.changes[0]).toMatchObject({ reason: 'day fit', changes: expect.any(Array) });
    expect(history.changes[0].changes).toHaveLength(proposal.changes.length);

    // The same proposal again: the day has moved on.
    const stale = await charge.post(`/api/days/${DAY}/fit/apply`, { dayVersion: proposal.dayVersion, changes: proposal.changes });
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe('fit_stale');

    const undo = await charge.post(`/api/days/${DAY}/undo`);
    expect(undo.status).toBe(200);
    expect(places(undo.body)).toEqual(places(pinnedPlan));
    expect(staffing(undo.body)).toEqual(staffing(pinnedPlan));
    expect(undo.body.summary).toEqual((pinnedPlan as unknown as { summary: unknown }).summary);
    await scheduler.put(`/api/exams/${problem.toExamId}/pin`, { pinned: false });
  }, 120_000);

  it('refuses a proposal that moves a pinned exam or crosses modalities, listing every problem', async () => {
    const plan: Plan = (await charge.get(`/api/days/${DAY}/plan`)).body;
    const mr = plan.rooms.find((r) => r.modality === 'MR' && r.exams.length > 1)!;
    const ct = plan.rooms.find((r) => r.modality === 'CT')!;
    const [a, b] = mr.exams;
    await scheduler.put(`/api/exams/${a!.id}/pin`, { pinned: true });
    const version = (await charge.post(`/api/days/${DAY}/fit`)).body.dayVersion;
    const res = await charge.post(`/api/days/${DAY}/fit/apply`, {
      dayVersion: version,
      changes: [
        { type: 'move', examId: a!.id, accession: 'x', from: { roomId: mr.id, start: a!.start }, to: { roomId: mr.id, start: a!.start } },
        { type: 'move', examId: b!.id, accession: 'y', from: { roomId: mr.id, start: b!.start }, to: { roomId: ct.id, start: b!.start } },
      ],
    });
    expect(res.status).toBe(422);
    expect(res.body.error.code).toBe('validation_failed');
    expect(res.body.error.details.problems.map((p: { field: string }) => p.field)).toEqual(['changes.0', 'changes.1.to.roomId']);
    await scheduler.put(`/api/exams/${a!.id}/pin`, { pinned: false });
  }, 120_000);

  it('adds an idle aide to a short gap between two pinned exams (invented example), and undo takes the helper off', async () => {
    const day = '2027-03-12';
    // MR 1 (one person): HX-2 starts 15 min after HX-1 ends; a plain turnover needs 20 min with one person, 14 with two.
    const row = (acc: string, start: string) => [acc, 'MR 1', start, '30', 'MR knee without contrast', 'knee', 'none', 'ambulatory', 'no', ''];
    const csv = toCsv([EXAM_LIST_HEADER, row('HX-1', '09:00'), row('HX-2', '09:45')]);
    expect((await charge.upload(`/api/days/${day}/exams/import`, csv, 'list.csv')).status).toBe(200);
    const plan: Plan = (await charge.get(`/api/days/${day}/plan`)).body;
    const exams = plan.rooms.flatMap((r) => r.exams);
    for (const exam of exams) expect((await scheduler.put(`/api/exams/${exam.id}/pin`, { pinned: true })).status).toBe(200);
    // Two aides for MR 1: one works its turnovers (its staff is one), the other is idle.
    const rows = [{ name: null, role: 'aide', count: 2, start: '08:00', end: '12:00', breaks: [], roomIds: [plan.rooms.find((r) => r.exams.length > 0)!.id] }];
    expect((await charge.put(`/api/days/${day}/roster`, { rows })).status).toBe(200);
    const before: Plan = (await charge.get(`/api/days/${day}/plan`)).body;

    const proposal = (await charge.post(`/api/days/${day}/fit`)).body;
    expect(proposal.moves).toEqual([]);
    expect(proposal.helpers).toEqual([expect.objectContaining({ accession: 'HX-2', staffFrom: 1, staffTo: 2 })]);
    expect(proposal.remaining).toEqual([]);
    // A day this small is solved with the roster's people in the model: the best possible.
    expect(proposal.solver).toMatchObject({ roster: 'exact', status: 'optimal' });
    const applied = await charge.post(`/api/days/${day}/fit/apply`, { dayVersion: proposal.dayVersion, changes: proposal.changes });
    expect(applied.status).toBe(200);
    expect((await charge.post(`/api/days/${day}/undo`)).status).toBe(200);
    const after: Plan = (await charge.get(`/api/days/${day}/plan`)).body;
    expect([places(after), staffing(after)]).toEqual([places(before), staffing(before)]);
  }, 120_000);

  it('made to fit during the day, moves nobody to a time gone by and keeps an exam already due (invented example)', async () => {
    const day = '2027-03-15';
    // MR 1 (one person): NX-2 starts 10 min after NX-1 ends; a plain turnover needs 20 min with one person.
    const row = (acc: string, start: string) => [acc, 'MR 1', start, '30', 'MR knee without contrast', 'knee', 'none', 'ambulatory', 'no', ''];
    expect((await charge.upload(`/api/days/${day}/exams/import`, toCsv([EXAM_LIST_HEADER, row('NX-1', '09:00'), row('NX-2', '09:40')]), 'list.csv')).status).toBe(200);
    try {
      h.clock.set('2027-03-15T14:35:00Z'); // 09:35 in Chicago: NX-1 is due, NX-2 not yet
      const proposal = (await charge.post(`/api/days/${day}/fit`)).body;
      expect(proposal.fixed).toEqual([expect.objectContaining({ accession: 'NX-1', reason: 'passed' })]);
      // NX-2 moves (to MR 2 at its time, or later in MR 1), never before 09:35.
      expect(proposal.moves.map((m: { accession: string }) => m.accession)).toEqual(['NX-2']);
      expect(Date.parse(proposal.moves[0].to.start)).toBeGreaterThanOrEqual(Date.parse('2027-03-15T09:35:00-05:00'));
      const plan: Plan = (await charge.get(`/api/days/${day}/plan`)).body;
      const [first, second] = plan.rooms.find((r) => r.exams.length > 0)!.exams;
      const move = (exam: typeof first, start: string) => ({ type: 'move', examId: exam!.id, accession: 'x', from: { roomId: exam!.roomId, start: exam!.start }, to: { roomId: exam!.roomId, start } });
      // Sent by hand: an exam already due moved, and a start gone by.
      const refused = await charge.post(`/api/days/${day}/fit/apply`, { dayVersion: proposal.dayVersion, changes: [move(first, '2027-03-15T08:50:00-05:00'), move(second, '2027-03-15T09:30:00-05:00')] });
      expect(refused.status).toBe(422);
      expect(refused.body.error.details.problems).toEqual([
        { field: 'changes.0', message: 'x may not move (passed)' },
        { field: 'changes.0.to.start', message: 'x would start at 08:50, which has passed' },
        { field: 'changes.1.to.start', message: 'x would start at 09:30, which has passed' },
      ]);
      // Ten minutes later NX-2 is due as well: the proposal made at 09:35 no longer applies.
      h.clock.set('2027-03-15T14:45:00Z');
      const late = await charge.post(`/api/days/${day}/fit/apply`, { dayVersion: proposal.dayVersion, changes: proposal.changes });
      expect(late.status).toBe(422);
      expect((await charge.get(`/api/days/${day}/plan`)).body.rooms.flatMap((r: Plan['rooms'][number]) => r.exams).map((e: { start: string }) => e.start)).toEqual([first!.start, second!.start]);
    } finally {
      h.clock.set('2027-03-10T11:00:00Z');
    }
  }, 120_000);

  it('refuses a bad body with 422 listing its problems, and an unknown exam with 404', async () => {
    const res = await charge.post(`/api/days/${DAY}/fit/apply`, { dayVersion: -1, changes: [] });
    expect(res.status).toBe(422);
    expect(res.body.error.details.problems.length).toBeGreaterThanOrEqual(2);
    const pin = await scheduler.put('/api/exams/999999/pin', { pinned: true });
    expect(pin.status).toBe(404);
  }, 60_000);
});
