import { proposeDayFit, type MipSolve } from '../../../shared/day-fit';
import { withChanges } from '../../../shared/fixes/apply-changes';
import { computeDayPlan } from '../../../shared/turnover/day-plan';
import type { DayPlanExam, DayPlanInput, DayPlanPerson, DayPlanRoom } from '../../../shared/turnover/day-plan-input';
import { DEMO_SETUP } from '../../../shared/turnover/demo-protocols';
import { highsSolver } from './highs-solve';

let solve: MipSolve;
beforeAll(async () => {
  solve = await highsSolver();
}, 30_000);

// Invented rooms, people and exams (no real department). Walking 3 min between rooms: common practice, no source.
const DATE = '2027-05-03';
const MR1: DayPlanRoom = { id: 1, name: 'MR 1', modality: 'MR', staff: 1, airChangesPerHour: 6, opensAt: '07:00', closesAt: '19:00' };
const MR2: DayPlanRoom = { id: 2, name: 'MR 2', modality: 'MR', staff: 1, airChangesPerHour: 6, opensAt: '07:00', closesAt: '19:00' };
let nextId = 700;
function exam(roomId: number, hhmm: string, durationMinutes: number): DayPlanExam {
  const id = nextId++;
  return {
    id, accession: `RF-${id}`, roomId, start: `${DATE}T${hhmm}:00-05:00`, durationMinutes, procedure: 'MR knee without contrast',
    coil: 'knee', precaution: 'none', mobility: 'ambulatory', contrast: false, notes: null, version: 1,
  };
}
const aide = (id: string, label: string, roomIds: number[], extra: Partial<DayPlanPerson> = {}): DayPlanPerson => ({
  id, name: null, label, role: 'aide', start: '07:00', end: '15:00', breaks: [], roomIds, ...extra,
});
const problemsOf = (input: DayPlanInput) => {
  const { summary } = computeDayPlan(input);
  return summary.short + summary.overlap;
};

describe('make the day fit with a roster (invented examples)', () => {
  // One aide covers MR 1 and MR 2. MR 2's patient leaves at 09:52 and its turnover keeps the aide
  // until 10:12; MR 1's leaves at 10:00 and its next patient is booked at 10:29. With its own
  // staff MR 1's gap fits (29 min for 20); with the roster the aide starts at 10:15: short by 6.
  const mr1a = exam(1, '09:00', 60);
  const mr1b = exam(1, '10:29', 30);
  const mr2a = exam(2, '09:00', 52);
  const mr2b = exam(2, '10:20', 30);
  const input: DayPlanInput = {
    date: DATE, timezone: 'America/Chicago', ...DEMO_SETUP, rooms: [MR1, MR2], exams: [mr1a, mr1b, mr2a, mr2b],
    roster: { source: 'day', walkingMinutes: 3, people: [aide('r1-1', 'Aide 1', [1, 2])] },
  };

  it('clears the gap the aide makes late, judged with the roster before and after', () => {
    const { roster: _roster, ...ownStaff } = input;
    expect(problemsOf(ownStaff)).toBe(0); // the engine alone sees nothing wrong
    expect(problemsOf(input)).toBe(1);

    const proposal = proposeDayFit(input, solve, { walkingMinutes: 3, timeLimitMs: 20_000 });
    expect(proposal.before).toMatchObject({ short: 1, overlap: 0 });
    expect(proposal.after).toMatchObject({ short: 0, overlap: 0 });
    expect(proposal.remaining).toEqual([]);
    expect(problemsOf(withChanges(input, proposal.changes))).toBe(0);
    expect(proposal.objective.examsMoved).toBe(1); // one exam moved clears it
    expect(proposal.solver.rosterRounds).toBeGreaterThanOrEqual(1);
  }, 60_000);

  it('says a gap left for people in the gap panel’s words when the exams may not move', () => {
    const fixed = Object.fromEntries(input.exams.map((e) => [e.id, 'pinned' as const]));
    const proposal = proposeDayFit(input, solve, { fixed, walkingMinutes: 3, timeLimitMs: 20_000 });
    expect(proposal.changes).toEqual([]);
    expect(proposal.remaining).toEqual([
      expect.objectContaining({ toExamId: mr1b.id, roomId: 1, verdict: 'short', shortByMinutes: 6, reason: 'Short by 6 min: Aide 1 is in MR 2 until 10:12' }),
    ]);
  }, 60_000);

  it('plans a turnover with the one person the roster gives a two-person room', () => {
    // MR 3 wants two people; only one aide is on the roster. A plain turnover takes 14 min with
    // two and 20 with one (the demo protocol); the next patient is booked 16 min after.
    const MR3: DayPlanRoom = { ...MR1, id: 3, name: 'MR 3', staff: 2 };
    const a = exam(3, '09:00', 30);
    const b = exam(3, '09:46', 30);
    const day: DayPlanInput = {
      date: DATE, timezone: 'America/Chicago', ...DEMO_SETUP, rooms: [MR3], exams: [a, b],
      roster: { source: 'day', walkingMinutes: 3, people: [aide('r3-1', 'Aide 3', [3])] },
    };
    expect(problemsOf(day)).toBe(1);
    const proposal = proposeDayFit(day, solve, { walkingMinutes: 3, timeLimitMs: 20_000 });
    expect(proposal.after).toMatchObject({ short: 0, overlap: 0 });
    expect(problemsOf(withChanges(day, proposal.changes))).toBe(0);
  }, 60_000);
});
