import { withChanges } from '../fixes/apply-changes';
import { computeDayPlan } from '../turnover/day-plan';
import type { DayPlanExam, DayPlanInput, DayPlanRoom } from '../turnover/day-plan-input';
import { DEMO_SETUP } from '../turnover/demo-protocols';
import { fitDay } from './instance';
import type { FixedReason } from './model';
import { pushAlongRooms } from './roster-push';
import { changesOf } from './roster-windows';

// Invented examples (no real department). In MR with one person a turnover between two plain
// exams needs 20 min (the demo protocol, checked below).
const DATE = '2027-05-04';
const room = (id: number): DayPlanRoom => ({ id, name: `MR ${id}`, modality: 'MR', staff: 1, airChangesPerHour: 6, opensAt: '07:00', closesAt: '19:00' });
const exam = (id: number, roomId: number, hhmm: string, durationMinutes = 30): DayPlanExam => ({
  id, accession: `PU-${id}`, roomId, start: `${DATE}T${hhmm}:00-05:00`, durationMinutes, procedure: 'MR knee without contrast',
  coil: 'knee', precaution: 'none', mobility: 'ambulatory', contrast: false, notes: null, version: 1,
});
const at = (hhmm: string) => `${DATE}T${hhmm}:00-05:00`;

/** MR 1: A 09:00, B 09:40 (short by 10), C 10:35 (5 min to spare after B), D 11:45 (plenty). */
const day: DayPlanInput = {
  date: DATE, timezone: 'America/Chicago', ...DEMO_SETUP, rooms: [room(1)],
  exams: [exam(1, 1, '09:00'), exam(2, 1, '09:40'), exam(3, 1, '10:35'), exam(4, 1, '11:45')],
};

function push(input: DayPlanInput, fixed: Record<number, FixedReason> = {}, notBefore?: number) {
  const fit = fitDay(input, { fixed, notBefore });
  const plan = computeDayPlan(input);
  const pushed = pushAlongRooms(fit, { places: new Map(), staffing: new Map() }, plan, {}, Infinity);
  const changes = changesOf(fit, pushed.arrangement);
  const after = computeDayPlan(withChanges(input, changes));
  const starts = Object.fromEntries(changes.flatMap((c) => (c.type === 'move' ? [[c.accession, c.to.start]] : [])));
  return { before: plan, after, starts, kept: pushed.kept };
}

describe('pushAlongRooms (invented examples)', () => {
  it('starts from a gap short by 10 min, then 5 min to spare, then 20', () => {
    const gaps = computeDayPlan(day).rooms[0]!.gaps;
    expect(gaps[1]).toMatchObject({ verdict: 'short', shortByMinutes: 10 });
    expect(gaps.slice(2).map((g) => g.availableMinutes - g.requiredMinutes)).toEqual([5, 20]);
  });

  it('pulls the exam before the gap 10 min earlier when it may move: one patient, 10 min', () => {
    const { after, starts, kept } = push(day);
    expect(starts).toEqual({ 'PU-1': at('08:50') });
    expect(after.summary.short + after.summary.overlap).toBe(0);
    expect(kept).toBe(1);
  });

  it('with the first exam arrived, pushes the next one and the one with only 5 min to spare 10 min later, not the last', () => {
    const { after, starts } = push(day, { 1: 'arrived' });
    expect(starts).toEqual({ 'PU-2': at('09:50'), 'PU-3': at('10:45') });
    expect(after.summary.short + after.summary.overlap).toBe(0);
  });

  it('made to fit at 08:55, pulls nobody to 08:50: pushes later instead', () => {
    const { starts } = push(day, {}, Date.parse(at('08:55')));
    expect(starts).toEqual({ 'PU-2': at('09:50'), 'PU-3': at('10:45') });
  });

  it('leaves the day as it is when neither way may move (and never makes it worse)', () => {
    const { before, after, starts, kept } = push(day, { 1: 'arrived', 3: 'pinned' });
    expect(starts).toEqual({});
    expect(kept).toBe(0);
    expect(after.summary).toEqual(before.summary);
  });

  it('pushes past a room’s closing never: the last exam may not end after 19:00', () => {
    const late: DayPlanInput = { ...day, exams: [exam(1, 1, '17:50'), exam(2, 1, '18:30')] };
    const { starts, after } = push(late, { 1: 'arrived' });
    expect(starts).toEqual({});
    expect(after.summary.short).toBe(1);
  });

  it('with a roster, waits for the aide busy in the other room: the exam after the gap goes later, not the one before', () => {
    // One aide for MR 1 and MR 2: MR 2's turnover holds the aide until 10:12, so MR 1's gap into
    // 10:29 is short by 6 (walking 3 min between rooms: common practice, no source).
    const input: DayPlanInput = {
      ...day, rooms: [room(1), room(2)],
      exams: [exam(11, 1, '09:00', 60), exam(12, 1, '10:29'), exam(13, 2, '09:00', 52), exam(14, 2, '10:20')],
      roster: { source: 'day', walkingMinutes: 3, people: [{ id: 'a1', name: null, label: 'Aide 1', role: 'aide', start: '07:00', end: '15:00', breaks: [], roomIds: [1, 2] }] },
    };
    const { before, after, starts } = push(input, { 13: 'arrived', 14: 'arrived' });
    expect(before.rooms[0]!.gaps[1]).toMatchObject({ verdict: 'short', shortByMinutes: 6 });
    expect(starts).toEqual({ 'PU-12': at('10:35') });
    expect(after.summary.short + after.summary.overlap).toBe(0);
  });
});
