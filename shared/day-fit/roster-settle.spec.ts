import { withChanges } from '../fixes/apply-changes';
import { computeDayPlan } from '../turnover/day-plan';
import type { DayPlanExam, DayPlanInput, DayPlanRoom } from '../turnover/day-plan-input';
import type { PlanSummary } from '../turnover/day-plan-types';
import { DEMO_SETUP } from '../turnover/demo-protocols';
import { seededRandom } from '../turnover/testing/seeded-random';
import { fitDay } from './instance';
import type { FixedReason } from './model';
import { pushAlongRooms } from './roster-push';
import { settleBack } from './roster-settle';
import { changesOf, type RosterArrangement } from './roster-windows';
import { fitWorkDay } from './testing/fit-days';

// Invented examples (no real department), the day of roster-push.spec.ts: in MR with one person a
// turnover between two plain exams needs 20 min (the demo protocol, checked there and below).
const DATE = '2027-05-04';
const room = (id: number): DayPlanRoom => ({ id, name: `MR ${id}`, modality: 'MR', staff: 1, airChangesPerHour: 6, opensAt: '07:00', closesAt: '19:00' });
const exam = (id: number, roomId: number, hhmm: string, durationMinutes = 30): DayPlanExam => ({
  id, accession: `SB-${id}`, roomId, start: `${DATE}T${hhmm}:00-05:00`, durationMinutes, procedure: 'MR knee without contrast',
  coil: 'knee', precaution: 'none', mobility: 'ambulatory', contrast: false, notes: null, version: 1,
});
const at = (hhmm: string) => `${DATE}T${hhmm}:00-05:00`;
const minute = (hhmm: string) => Number(hhmm.slice(0, 2)) * 60 + Number(hhmm.slice(3));

/** MR 1: A 09:00, B 09:40 (short by 10), C 10:35, D 11:45. */
const day: DayPlanInput = {
  date: DATE, timezone: 'America/Chicago', ...DEMO_SETUP, rooms: [room(1)],
  exams: [exam(1, 1, '09:00'), exam(2, 1, '09:40'), exam(3, 1, '10:35'), exam(4, 1, '11:45')],
};

/** Settles an arrangement of `moves` (exam id → HH:MM in its own room) with no deadline. */
function settle(input: DayPlanInput, moves: Record<number, string>, options: { fixed?: Record<number, FixedReason>; notBefore?: number } = {}) {
  const fit = fitDay(input, options);
  const places = new Map(Object.entries(moves).map(([id, hhmm]) => [Number(id), { roomId: input.exams.find((e) => e.id === Number(id))!.roomId, start: minute(hhmm) }]));
  const start = { places, staffing: new Map() };
  const before = computeDayPlan(withChanges(input, changesOf(fit, start)));
  const settled = settleBack(fit, start, before, {}, Infinity);
  const changes = changesOf(fit, settled.arrangement);
  const starts = Object.fromEntries(changes.flatMap((c) => (c.type === 'move' ? [[c.accession, c.to.start]] : [])));
  return { before, after: settled.plan, starts, returned: settled.returned };
}

const problems = (s: PlanSummary) => s.short + s.overlap;

describe('settleBack (invented examples)', () => {
  it('starts from a gap into B short by 10 min with one person (20 min needed after 30 min of A)', () => {
    expect(computeDayPlan(day).rooms[0]!.gaps[1]).toMatchObject({ verdict: 'short', shortByMinutes: 10, requiredMinutes: 20 });
  });

  it('puts back an exam moved for nothing and keeps the move that clears the gap', () => {
    const { before, after, starts, returned } = settle(day, { 1: '08:50', 4: '12:15' });
    expect(problems(before.summary)).toBe(0);
    expect(starts).toEqual({ 'SB-1': at('08:50') });
    expect(returned).toBe(1);
    expect(problems(after.summary)).toBe(0);
  });

  it('takes a move too large half-way back when all the way would leave the gap short again (not proven the best: 08:50 would do)', () => {
    const { after, starts, returned } = settle(day, { 1: '08:30' });
    // 08:30 → all the way to 09:00 leaves B short by 10; half-way, 08:45, fits; then half of the
    // 15 min left, 08:53, would leave B short by 3 again.
    expect(starts).toEqual({ 'SB-1': at('08:45') });
    expect(returned).toBe(1);
    expect(problems(after.summary)).toBe(0);
  });

  it('keeps a move that makes a gap less short though it does not clear it: B at 09:45 is short by 5, at 09:35 by 15', () => {
    const tight: DayPlanInput = { ...day, exams: [exam(1, 1, '09:00'), exam(2, 1, '09:35')] };
    const { before, starts, returned } = settle(tight, { 2: '09:45' }, { fixed: { 1: 'arrived' } });
    expect(before.rooms[0]!.gaps[1]).toMatchObject({ verdict: 'short', shortByMinutes: 5 });
    expect(starts).toEqual({ 'SB-2': at('09:45') });
    expect(returned).toBe(0);
  });

  // One aide for MR 1 and MR 2 (walking 3 min between rooms: common practice, no source): MR 2's
  // turnover holds the aide until 10:12, so MR 1's gap into SB-12 at 10:29 is short by 6.
  const oneAide: DayPlanInput = {
    ...day, rooms: [room(1), room(2)],
    exams: [exam(11, 1, '09:00', 60), exam(12, 1, '10:29'), exam(13, 2, '09:00', 52), exam(14, 2, '10:20')],
    roster: { source: 'day', walkingMinutes: 3, people: [{ id: 'a1', name: null, label: 'Aide 1', role: 'aide', start: '07:00', end: '15:00', breaks: [], roomIds: [1, 2] }] },
  };

  it('keeps a move that leaves the aide’s gap less short: SB-12 at 10:32 is short by 3, back at 10:29 by 6 (one gap short either way)', () => {
    const { before, starts, returned } = settle(oneAide, { 12: '10:32' }, { fixed: { 13: 'arrived', 14: 'arrived' } });
    expect(before.rooms[0]!.gaps[1]).toMatchObject({ verdict: 'short', shortByMinutes: 3 });
    expect(starts).toEqual({ 'SB-12': at('10:32') });
    expect(returned).toBe(0);
  });

  it('judges with the roster’s crews: the aide busy in MR 2 until 10:12 keeps SB-12 at 10:35 though MR 1 alone would fit at 10:29', () => {
    const input = oneAide;
    const { roster: _roster, ...ownStaff } = input;
    expect(problems(computeDayPlan(ownStaff).summary)).toBe(0);
    const { starts, returned, after } = settle(input, { 12: '10:35' }, { fixed: { 13: 'arrived', 14: 'arrived' } });
    expect(starts).toEqual({ 'SB-12': at('10:35') });
    expect(returned).toBe(0);
    expect(problems(after.summary)).toBe(0);
  });
});

describe('settleBack on invented roster days (property)', () => {
  /**
   * A working day of 2 MR rooms, 3 aides for both, and an arrangement of needed moves (the pushes
   * that clear what the roster finds short) and needless ones (other free exams moved up to 40 min
   * either way).
   */
  function scrambled(seed: number) {
    const { input: plain, fixed } = fitWorkDay(seed, { rooms: 2, examsPerRoom: 8 });
    const input: DayPlanInput = {
      ...plain,
      roster: {
        source: 'day', walkingMinutes: 3,
        people: [0, 1, 2].map((k) => ({ id: `a${k}`, name: null, label: `Aide ${k + 1}`, role: 'aide' as const, start: '07:00', end: '19:00', breaks: k === 0 ? [{ start: '12:00', end: '12:30' }] : [], roomIds: plain.rooms.map((r) => r.id) })),
      },
    };
    const fit = fitDay(input, { fixed });
    const pushed = pushAlongRooms(fit, { places: new Map(), staffing: new Map() }, computeDayPlan(input), {}, Infinity);
    const needed = new Set(pushed.arrangement.places.keys());
    const next = seededRandom(seed * 7919);
    const places: RosterArrangement['places'] = new Map(pushed.arrangement.places);
    for (const fe of fit.groups.flatMap((g) => g.exams)) {
      if (fe.stays !== null || needed.has(fe.exam.id) || next() < 0.5) continue;
      const room = fit.groups.flatMap((g) => g.rooms).find((r) => r.room.id === fe.roomId)!;
      const to = fe.start + Math.round((next() * 2 - 1) * 40);
      if (to !== fe.start && to >= room.open && to + fe.duration <= room.close) places.set(fe.exam.id, { roomId: fe.roomId, start: to });
    }
    return { input, fit, start: { places, staffing: pushed.arrangement.staffing }, needed: needed.size };
  }

  it('is never worse (problem gaps, minutes short, exams and minutes moved) and only brings exams toward their booked start', () => {
    let returnedOnAll = 0;
    let neededOnAll = 0;
    for (let seed = 1; seed <= 6; seed++) {
      const { input, fit, start, needed } = scrambled(seed);
      neededOnAll += needed;
      const before = computeDayPlan(withChanges(input, changesOf(fit, start)));
      const settled = settleBack(fit, start, before, {}, Infinity);
      returnedOnAll += settled.returned;
      const after = computeDayPlan(withChanges(input, changesOf(fit, settled.arrangement)));
      expect(settled.plan.summary).toEqual(after.summary);
      expect(problems(after.summary)).toBeLessThanOrEqual(problems(before.summary));
      expect(after.summary.minutesShort).toBeLessThanOrEqual(before.summary.minutesShort);
      const exams = new Map(fit.groups.flatMap((g) => g.exams).map((fe) => [fe.exam.id, fe]));
      for (const [id, place] of settled.arrangement.places) {
        const fe = exams.get(id)!;
        const was = start.places.get(id)!;
        expect(fe.stays).toBeNull();
        expect(place.roomId).toBe(was.roomId);
        // Between where the arrangement had it and its booked start (one of them included).
        expect(Math.min(was.start, fe.start) <= place.start && place.start <= Math.max(was.start, fe.start)).toBe(true);
      }
      expect(settled.arrangement.places.size + settled.returned).toBeGreaterThanOrEqual(start.places.size);
    }
    // Both kinds are there: moves that clear gaps, and random ones, mostly needless, that come back.
    expect(neededOnAll).toBeGreaterThan(0);
    expect(returnedOnAll).toBeGreaterThan(6);
  });
});
