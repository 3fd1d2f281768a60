import type { PlannedDay } from '@shared/api/plan';
import type { DayPlanInput, DayPlanPerson } from '@shared/turnover';

import { DAY_INPUT, dayPlan, exam } from './example-day';

// Invented day with a roster (no real people, rooms or exams), on the example day's rooms.
// Aide 1 covers MR 1 and MR 2 with a break 11:40–12:10, walking 3 minutes between rooms (common
// practice, no source); nobody covers CT 1. MR 2's patient leaves at 09:52 and its turnover takes
// the aide 20 minutes; MR 1's next patient is booked at 10:29, so MR 1's turnover waits for the
// aide (in MR 2 until 10:12, then 3 minutes' walk) and is short by 6 min.

export const AIDE_1: DayPlanPerson = {
  id: 'r1-1', name: null, label: 'Aide 1', role: 'aide', start: '07:00', end: '15:00', breaks: [{ start: '11:40', end: '12:10' }], roomIds: [1, 2],
};

export const ROSTER_INPUT: DayPlanInput = {
  ...DAY_INPUT,
  exams: [
    exam(1, 1, '09:00', { durationMinutes: 60 }),
    exam(2, 1, '10:29'),
    exam(20, 2, '09:00', { durationMinutes: 52 }),
    exam(21, 2, '10:20'),
    exam(22, 2, '11:30'),
    exam(23, 2, '12:30'),
    exam(30, 3, '09:00', { durationMinutes: 15, procedure: 'CT chest', coil: null }),
  ],
  roster: { source: 'day', walkingMinutes: 3, people: [AIDE_1] },
};

/** The roster day as the server answers it (computed by the engine). */
export function rosterPlan(input: DayPlanInput = ROSTER_INPUT): PlannedDay {
  return dayPlan(input);
}

/**
 * The roster day with Aide 1's work edited by hand so two pieces clash: MR 2's turnover before
 * ACC-22 drawn at 10:25–10:45, over MR 1's 10:15–10:35. The engine never plans this.
 */
export function clashingPlan(): PlannedDay {
  const plan = rosterPlan();
  const people = plan.people!;
  const work = people.people[0]!.work.map((piece) =>
    piece.toExamId === 22 ? { ...piece, start: '2027-03-15T10:25:00-05:00', end: '2027-03-15T10:45:00-05:00' } : piece,
  );
  return { ...plan, people: { ...people, people: [{ ...people.people[0]!, work }] } };
}
