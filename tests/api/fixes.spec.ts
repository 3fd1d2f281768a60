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
