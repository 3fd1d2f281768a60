import type { PlannedDay } from '@shared/api/plan';
import type { Room } from '@shared/api/rooms';
import { computeDayPlan, type DayPlanInput } from '@shared/turnover';
import { DEMO_SETUP } from '@shared/turnover/demo-protocols';

// Invented day (no real rooms, exams or people): MR 1, CT 1, MR 2 in that order, America/Chicago.
export const ROOMS: Room[] = [
  { id: 1, name: 'MR 1', modality: 'MR', airChangesPerHour: 6, staff: 1, opensAt: '07:00', closesAt: '19:00' },
  { id: 3, name: 'CT 1', modality: 'CT', airChangesPerHour: 12, staff: 1, opensAt: '07:00', closesAt: '19:00' },
  { id: 2, name: 'MR 2', modality: 'MR', airChangesPerHour: 6, staff: 1, opensAt: '07:00', closesAt: '19:00' },
];

/** An invented 30-minute MR knee exam on 2027-03-15 (Chicago, CDT) with an `ACC-<id>` accession. */
export const exam = (id: number, roomId: number, start: string, extra: Partial<DayPlanInput['exams'][number]> = {}) => ({
  id,
  accession: `ACC-${id}`,
  roomId,
  start: `2027-03-15T${start}:00-05:00`,
  durationMinutes: 30,
  procedure: 'MR knee without contrast',
  coil: 'knee',
  precaution: 'none' as const,
  mobility: 'ambulatory' as const,
  contrast: false,
  version: 1,
  ...extra,
});

/**
 * MR 1: ACC-1 08:00, ACC-2 08:45 (15 min after ACC-1: short by 5, as one person needs 20 min —
 * the product brief's check value), ACC-3 09:45. CT 1: ACC-10. MR 2: ACC-20 airborne, ACC-21 11:00.
 */
export const DAY_INPUT: DayPlanInput = {
  date: '2027-03-15',
  timezone: 'America/Chicago',
  snugMarginMinutes: 3,
  ...DEMO_SETUP,
  rooms: ROOMS,
  exams: [
    exam(1, 1, '08:00'),
    exam(2, 1, '08:45', { precaution: 'contact', contrast: true, procedure: 'MR brain with contrast', coil: 'head' }),
    exam(3, 1, '09:45'),
    exam(10, 3, '08:00', { procedure: 'CT chest', coil: null }),
    exam(20, 2, '08:00', { precaution: 'airborne' }),
    exam(21, 2, '11:00'),
  ],
};

/** The plan as the server answers it: computed from `input`, which it carries. */
export function dayPlan(input: DayPlanInput = DAY_INPUT): PlannedDay {
  return { ...computeDayPlan(input), input };
}

