import { signedIn, startHarness, type Client, type Harness } from './harness';

const DAY = '2027-03-10'; // the demo seed's "today" for this clock (America/Chicago)

/**
 * Every fix the server suggests for the demo day, applied for real: the day that results is the
 * day the fix previewed (same summary, the target gap no longer short unless declared partial),
 * no other gap turns short or overlapping unless the fix said so, and undo brings the day back.
 */
describe('suggested fixes on the demo day', () => {
  let h: Harness;
  let charge: Client;
  beforeAll(async () => {
    h = await startHarness({ seedDay: true, now: '2027-03-10T14:00:00Z' });
    charge = await signedIn(h.app, 'charge');
  });
  afterAll(() => h.close());

  const problemGaps = (plan: { rooms: { gaps: { toExamId: number; verdict: string }[] }[] }) =>
    new Set(plan.rooms.flatMap((r) => r.gaps).filter((g) => g.verdict === 'short' || g.verdict === 'overlap').map((g) => g.toExamId));

  it('does what each fix previewed, and undo restores the day', async () => {
    const before = (await charge.get(`/api/days/${DAY}/plan`)).body;
    const { fixes } = (await charge.get(`/api/days/${DAY}/fixes`)).body;
    expect(fixes.length).toBeGreaterThanOrEqual(4);
    // the demo's MR rooms are full at the problem times, so no other-room fix qualifies here (moves.spec.ts has one)
    expect([...new Set(fixes.map((f: { kind: string }) => f.kind))]).toEqual(expect.arrayContaining(['push-later', 'add-helper', 'isolation-last']));
    for (const fix of fixes) {
      const res = await charge.post(`/api/days/${DAY}/fixes/apply`, { fixId: fix.id, acceptNewProblems: true });
      expect([fix.id, res.status]).toEqual([fix.id, 200]);
      const after = res.body.plan;
      expect([fix.id, after.summary]).toEqual([fix.id, fix.effect.summaryAfter]);
      const newProblems = [...problemGaps(after)].filter((id) => id !== fix.toExamId && !problemGaps(before).has(id));
      expect([fix.id, newProblems.length]).toEqual([fix.id, fix.effect.newProblems]);
      const undo = await charge.post(`/api/days/${DAY}/undo`);
      expect([fix.id, undo.status]).toEqual([fix.id, 200]);
      expect(undo.body.summary).toEqual(before.summary);
      expect(undo.body.rooms.map((r: { exams: { start: string; roomId: number }[] }) => r.exams.map((e) => [e.roomId, e.start]))).toEqual(
        before.rooms.map((r: { exams: { start: string; roomId: number }[] }) => r.exams.map((e) => [e.roomId, e.start])),
      );
    }
  });

  it('a full fix (not marked partial) leaves its gap neither short nor overlapping', async () => {
    const { fixes } = (await charge.get(`/api/days/${DAY}/fixes`)).body;
    for (const fix of fixes.filter((f: { kind: string }) => f.kind !== 'add-helper')) {
      expect([fix.id, fix.effect.verdictAfter]).toEqual([fix.id, expect.stringMatching(/^(fits|snug)$/)]);
    }
  });
});

/**
 * Suggested fixes know what may no longer move: a patient who has arrived is not pushed, and a
 * gap whose patient is already due has no fix (its turnover is over). A fix that was offered
 * before the patient arrived is refused when applied after (409), and nothing changes.
 */
describe('suggested fixes and the exams that stay', () => {
  let h: Harness;
  let charge: Client;
  let frontdesk: Client;
  beforeAll(async () => {
    h = await startHarness({ seedDay: true, now: '2027-03-10T14:00:00Z' });
    charge = await signedIn(h.app, 'charge');
    frontdesk = await signedIn(h.app, 'frontdesk');
  }, 60_000);
  afterAll(() => h.close());

  type Move = { type: string; examId: number; from: { start: string } };
  const fixesOf = async (toExamId: number) => (await charge.get(`/api/days/${DAY}/fixes?gap=${toExamId}`)).body.fixes as { id: string; kind: string; changes: Move[] }[];

  it('drops a push once its patient has arrived, and refuses it if applied after', async () => {
    const { fixes } = (await charge.get(`/api/days/${DAY}/fixes`)).body as { fixes: { id: string; kind: string; toExamId: number; changes: Move[] }[] };
    const push = fixes.find((f) => f.kind === 'push-later')!;
    expect(push).toBeDefined();
    expect((await fixesOf(push.toExamId)).map((f) => f.id)).toContain(push.id);

    expect((await frontdesk.post(`/api/exams/${push.changes[0]!.examId}/arrived`)).status).toBe(200);
    const plan = (await charge.get(`/api/days/${DAY}/plan`)).body;
    expect((await fixesOf(push.toExamId)).map((f) => f.kind)).not.toContain('push-later');

    const res = await charge.post(`/api/days/${DAY}/fixes/apply`, { fixId: push.id, acceptNewProblems: true });
    expect([res.status, res.body.error.code]).toEqual([409, 'fix_stale']);
    expect((await charge.get(`/api/days/${DAY}/plan`)).body.rooms).toEqual(plan.rooms);
  });

  it('gives a gap no fix once the start of its patient has passed', async () => {
    const { fixes } = (await charge.get(`/api/days/${DAY}/fixes`)).body as { fixes: { toExamId: number; changes: Move[] }[] };
    const fix = fixes.find((f) => f.changes.length > 0)!;
    const exam = (await h.db('exams').where({ id: fix.toExamId }).first()) as { start_at: string };
    expect((await fixesOf(fix.toExamId)).length).toBeGreaterThan(0);
    h.clock.set(new Date(Date.parse(exam.start_at) + 60_000));
    expect(await fixesOf(fix.toExamId)).toEqual([]);
    // and no fix of any other gap moves an exam already due
    const page = (await charge.get(`/api/days/${DAY}/fixes`)).body as { fixes: { changes: Move[] }[] };
    for (const other of page.fixes) {
      for (const change of other.changes.filter((c) => c.type === 'move')) expect(Date.parse(change.from.start)).toBeGreaterThanOrEqual(h.clock.now().getTime());
    }
  });
});
