import type { Room } from '@shared/api/rooms';
import { computeDayPlan, type DayPlanInput } from '@shared/turnover';

import { previewMove } from './plan-preview';
import { exam } from './testing/example-day';
import { DEMO_SETUP } from '@shared/turnover/demo-protocols';

// Invented day: two MR rooms; in MR 1, ACC-2 starts 15 min after ACC-1 ends.
const rooms: Room[] = [
  { id: 1, name: 'MR 1', modality: 'MR', airChangesPerHour: 6, staff: 1, opensAt: '07:00', closesAt: '19:00' },
  { id: 2, name: 'MR 2', modality: 'MR', airChangesPerHour: 12, staff: 2, opensAt: '07:00', closesAt: '19:00' },
];
/** What the server sends as `PlannedDay.input`. */
const input: DayPlanInput = {
  date: '2027-03-15',
  timezone: 'America/Chicago',
  ...DEMO_SETUP,
  snugMarginMinutes: 3,
  rooms,
  exams: [exam(1, 1, '08:00'), exam(2, 1, '08:45'), exam(3, 2, '08:00', { precaution: 'airborne' }), exam(4, 2, '10:00')],
  staffOverrides: { 4: 3 },
};
const serverPlan = computeDayPlan(input);

describe('previewMove', () => {
  it('returns the would-be verdict of a gap after a slot moves along its lane', () => {
    // One person, nothing special: 20 min (product brief check value), so 15 min is short by 5…
    expect(serverPlan.rooms[0].gaps[1]).toMatchObject({ verdict: 'short', shortByMinutes: 5 });
    // …and 25 min is more than 20 + the 3-min snug margin.
    const after = previewMove(input, { examId: 2, roomId: 1, start: '2027-03-15T08:55:00-05:00' })!;
    expect(after.get(1)!.gaps[1]).toMatchObject({ verdict: 'fits', availableMinutes: 25, requiredMinutes: 20 });
  });

  it('recomputes both rooms when a slot moves to another lane, and only those', () => {
    const after = previewMove(input, { examId: 2, roomId: 2, start: '2027-03-15T11:00:00-05:00' })!;
    expect([...after.keys()].sort()).toEqual([1, 2]);
    expect(after.get(1)!.exams.map((e) => e.id)).toEqual([1]);
    expect(after.get(2)!.exams.map((e) => e.id)).toEqual([3, 4, 2]);
  });

  it("keeps a helper the server was told about: the override comes with the input, never guessed from the gaps", () => {
    const after = previewMove(input, { examId: 2, roomId: 2, start: '2027-03-15T11:00:00-05:00' })!;
    expect(after.get(2)!.gaps.find((gap) => gap.toExamId === 4)!.staff).toBe(3);
  });

  it('with a roster, counts the people busy in rooms the move does not touch, as the server does', () => {
    // Invented: one aide covers MR 1 and MR 3 (3 minutes' walk); MR 3's patient leaves at 08:20, so
    // the aide turns MR 3 over until 08:40 and reaches MR 1 at 08:43: ready 09:03.
    const mr3: Room = { id: 3, name: 'MR 3', modality: 'MR', airChangesPerHour: 8, staff: 1, opensAt: '07:00', closesAt: '19:00' };
    const rostered: DayPlanInput = {
      ...input,
      rooms: [...rooms, mr3],
      exams: [...input.exams, exam(5, 3, '07:50'), exam(6, 3, '09:30')],
      roster: { source: 'day', walkingMinutes: 3, people: [{ id: 'r1-1', name: null, label: 'Aide 1', role: 'aide', start: '07:00', end: '15:00', breaks: [], roomIds: [1, 3] }] },
    };
    const after = previewMove(rostered, { examId: 2, roomId: 1, start: '2027-03-15T09:00:00-05:00' })!;
    expect([...after.keys()]).toEqual([1]);
    expect(after.get(1)!.gaps[1]).toMatchObject({ verdict: 'short', shortByMinutes: 3, crew: ['r1-1'], people: { kind: 'busy', roomId: 3 } });
    const moved = { ...rostered, exams: rostered.exams.map((e) => (e.id === 2 ? { ...e, start: '2027-03-15T09:00:00-05:00' } : e)) };
    expect(after.get(1)).toEqual(computeDayPlan(moved).rooms[0]);
  });

  it('returns null for an exam that is not on the day', () => {
    expect(previewMove(input, { examId: 99, roomId: 1, start: '2027-03-15T08:55:00-05:00' })).toBeNull();
  });
});
