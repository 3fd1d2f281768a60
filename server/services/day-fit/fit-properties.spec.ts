import { proposeDayFit, type DayFitProposal, type FitHelper, type MipSolve } from '../../../shared/day-fit';
import { fitDay } from '../../../shared/day-fit/instance';
import { fitWorkDay } from '../../../shared/day-fit/testing/fit-days';
import { smallDay } from '../../../shared/day-fit/testing/small-days';
import { computeDayPlan } from '../../../shared/turnover/day-plan';
import { DEMO_SETUP } from '../../../shared/turnover/demo-protocols';
import type { DayPlanInput } from '../../../shared/turnover/day-plan-input';
import { highsSolver } from './highs-solve';

let solve: MipSolve;
beforeAll(async () => {
  solve = await highsSolver();
}, 30_000);

/** Invented spare people: an aide free all morning for any room, a technologist free 08:00–09:00 in MR 1 only. */
const HELPERS: FitHelper[] = [
  { id: 'r1', label: 'Aide 1', free: [{ start: '07:00', end: '12:00' }], roomIds: null },
  { id: 'r2', label: 'Technologist 1', free: [{ start: '08:00', end: '09:00' }], roomIds: [1] },
];

function checkProperties(input: DayPlanInput, fixed: Record<number, string>, proposal: DayFitProposal, helpers: readonly FitHelper[] = [], notBefore?: number) {
  const day = fitDay(input, {});
  const roomOf = new Map(input.rooms.map((r) => [r.id, r]));
  const hours = new Map(day.groups.flatMap((g) => g.rooms.map((r) => [r.room.id, r] as const)));
  const examOf = new Map(input.exams.map((e) => [e.id, e]));
  for (const move of proposal.moves) {
    expect(fixed[move.examId]).toBeUndefined(); // never moves a fixed exam
    const exam = examOf.get(move.examId)!;
    expect(roomOf.get(move.to.roomId)!.modality).toBe(roomOf.get(exam.roomId)!.modality); // never mixes modalities
    const room = hours.get(move.to.roomId)!;
    const start = day.minuteOf(move.to.start);
    expect(start).toBeGreaterThanOrEqual(room.open); // never leaves the room's hours
    expect(start + exam.durationMinutes).toBeLessThanOrEqual(room.close);
    if (notBefore !== undefined) {
      expect(Date.parse(exam.start)).toBeGreaterThanOrEqual(notBefore); // an exam already due stays
      expect(Date.parse(move.to.start)).toBeGreaterThanOrEqual(notBefore); // nobody is called to a time gone by
    }
  }
  // No person double-booked, each within their free time and rooms.
  for (const use of proposal.helpers) {
    const person = helpers.find((h) => h.id === use.helperId)!;
    expect(person.roomIds === null || person.roomIds.includes(use.roomId)).toBe(true);
    const [from, to] = [day.minuteOf(use.busyFrom), day.minuteOf(use.busyTo)];
    expect(person.free.some((f) => day.minuteOf(`${input.date}T${f.start}:00-05:00`) <= from && to <= day.minuteOf(`${input.date}T${f.end}:00-05:00`))).toBe(true);
    for (const other of proposal.helpers) {
      if (other === use || other.helperId !== use.helperId) continue;
      expect(day.minuteOf(other.busyTo) <= from || to <= day.minuteOf(other.busyFrom)).toBe(true);
    }
  }
  // What it says is left is what the engine finds after it.
  expect(proposal.after.short + proposal.after.overlap).toBe(proposal.remaining.length);
}

describe('proposeDayFit properties (seeded invented days)', () => {
  for (let seed = 101; seed <= 124; seed++) {
    it(`keeps fixed exams, hours, modalities and helpers right (small day ${seed})`, () => {
      const { input, fixed } = smallDay(seed, 5);
      const helpers = seed % 2 === 0 ? HELPERS : [];
      const proposal = proposeDayFit(input, solve, { fixed, helpers, timeLimitMs: 30_000 });
      checkProperties(input, fixed, proposal, helpers);
    }, 60_000);
  }
  for (const seed of [1, 2, 3]) {
    it(`keeps them on a working day of 4 rooms and 24 exams, by neighbourhoods (day ${seed})`, () => {
      const { input, fixed } = fitWorkDay(seed, { rooms: 4, examsPerRoom: 6 });
      const proposal = proposeDayFit(input, solve, { fixed, helpers: HELPERS, timeLimitMs: 30_000, wholeGroupLimit: 4 });
      expect(proposal.solver.scope === 'neighbourhood' || proposal.solver.status === 'nothing-to-do').toBe(true);
      checkProperties(input, fixed, proposal, HELPERS);
    }, 90_000);
  }
  // Day 25 is one where, without the rule, the best arrangement calls a patient to a time gone by.
  for (const seed of [4, 25]) {
    it(`keeps them, and moves nothing before now, on a working day of 4 rooms and 24 exams, 3 min before its first problem gap (day ${seed})`, () => {
      const { input, fixed } = fitWorkDay(seed, { rooms: 4, examsPerRoom: 6 });
      const plan = computeDayPlan(input);
      const startOf = new Map(input.exams.map((e) => [e.id, Date.parse(e.start)]));
      const problems = plan.rooms.flatMap((r) => r.gaps).filter((g) => g.verdict === 'short' || g.verdict === 'overlap');
      const now = Math.min(...problems.map((g) => startOf.get(g.toExamId)!)) - 3 * 60_000;
      const proposal = proposeDayFit(input, solve, { fixed, timeLimitMs: 30_000, notBefore: now });
      expect(proposal.moves.length).toBeGreaterThan(0);
      checkProperties(input, fixed, proposal, [], now);
    }, 90_000);
  }
});

describe('proposeDayFit worked examples (invented examples)', () => {
  // Invented example: MR 1 has A 08:00–08:30 (arrived) and B at 08:40; the turnover between two
  // plain exams with one person needs 20 min, so the gap is short by 10.
  const exam = (id: number, start: string) => ({
    id, accession: `EX-${id}`, roomId: 1, start: `2027-03-16T${start}:00-05:00`, durationMinutes: 30,
    procedure: 'MR invented procedure', coil: 'head', precaution: 'none' as const, mobility: 'ambulatory' as const, contrast: false, version: 1,
  });
  const room = (id: number) => ({ id, name: `MR ${id}`, modality: 'MR', staff: 1, airChangesPerHour: 12, opensAt: '07:00', closesAt: '19:00' });
  const base = { date: '2027-03-16', timezone: 'America/Chicago', ...DEMO_SETUP, snugMarginMinutes: 3, exams: [exam(1, '08:00'), exam(2, '08:40')] };

  it('with one room, pushes B 10 minutes later and lists the patient to call', () => {
    const proposal = proposeDayFit({ ...base, rooms: [room(1)] }, solve, { fixed: { 1: 'arrived' } });
    expect(proposal.before.short).toBe(1);
    expect(proposal.calls).toEqual([{ examId: 2, accession: 'EX-2', fromStart: '2027-03-16T08:40:00-05:00', toStart: '2027-03-16T08:50:00-05:00', fromRoomId: 1, toRoomId: 1 }]);
    expect(proposal.objective).toMatchObject({ gapsLeft: 0, examsMoved: 1, minutesMoved: 10 });
  });

  it('with an empty MR 2 open, moves B there at the same time: one exam moved either way, but no minutes', () => {
    const proposal = proposeDayFit({ ...base, rooms: [room(1), room(2)] }, solve, { fixed: { 1: 'arrived' } });
    expect(proposal.moves).toEqual([expect.objectContaining({ examId: 2, kind: 'other-room', to: { roomId: 2, start: '2027-03-16T08:40:00-05:00' }, minutesMoved: 0 })]);
    expect(proposal.calls).toEqual([]);
  });

  it('with neither fixed, moves A 10 min earlier (the day ends no later that way)', () => {
    const proposal = proposeDayFit({ ...base, rooms: [room(1)] }, solve, {});
    expect(proposal.calls).toEqual([expect.objectContaining({ examId: 1, toStart: '2027-03-16T07:50:00-05:00' })]);
  });

  it('at 07:55 on the day, calls nobody to a time gone by: A may start no earlier, so B goes 10 min later', () => {
    const proposal = proposeDayFit({ ...base, rooms: [room(1)] }, solve, { notBefore: Date.parse('2027-03-16T07:55:00-05:00') });
    expect(proposal.calls).toEqual([expect.objectContaining({ examId: 2, toStart: '2027-03-16T08:50:00-05:00' })]);
  });

  it('at 08:05, A is past its start time and stays; with B pinned, the gap is left and says why', () => {
    const proposal = proposeDayFit({ ...base, rooms: [room(1)] }, solve, { fixed: { 2: 'pinned' }, notBefore: Date.parse('2027-03-16T08:05:00-05:00') });
    expect(proposal.changes).toEqual([]);
    expect(proposal.remaining).toEqual([expect.objectContaining({ toExamId: 2, reason: 'neither exam may move: EX-1 is past its start time, EX-2 is pinned' })]);
  });

  it('with both exams pinned and one room, leaves the gap and says why', () => {
    const proposal = proposeDayFit({ ...base, rooms: [room(1)] }, solve, { fixed: { 1: 'arrived', 2: 'pinned' } });
    expect(proposal.changes).toEqual([]);
    expect(proposal.remaining).toEqual([expect.objectContaining({ toExamId: 2, verdict: 'short', shortByMinutes: 10, reason: 'neither exam may move: EX-1 has arrived, EX-2 is pinned' })]);
  });

  it('with a spare aide, adds a helper instead of moving anyone when two people need only 14 min', () => {
    const proposal = proposeDayFit({ ...base, rooms: [room(1)], exams: [exam(1, '08:00'), exam(2, '08:45')] }, solve, {
      fixed: { 1: 'arrived', 2: 'pinned' },
      helpers: [HELPERS[0]!],
    });
    expect(proposal.moves).toEqual([]);
    expect(proposal.helpers).toEqual([expect.objectContaining({ toExamId: 2, helperId: 'r1', staffFrom: 1, staffTo: 2 })]);
    expect(proposal.remaining).toEqual([]);
  });
});
