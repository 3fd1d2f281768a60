import type { DayPlanExam, DayPlanInput, DayPlanRoom } from '../../turnover/day-plan-input';
import { DEMO_SETUP } from '../../turnover/demo-protocols';
import { seededRandom } from '../../turnover/testing/seeded-random';
import type { FixedReason } from '../model';

/**
 * An invented working day for "make the day fit" (no real rooms or exams): `rooms` rooms of MR
 * and CT (three MR to one CT), open 07:00–19:00 in America/Chicago, about `examsPerRoom` exams
 * each, booked one after another with turnovers mostly long enough and now and then too short
 * (a scheduler's day), MR rooms with two people, some isolation cases and coil changes; a few exams fixed.
 *
 * @example
 * const { input, fixed } = fitWorkDay(1, { rooms: 4, examsPerRoom: 20 }); // 80 exams
 */
export function fitWorkDay(seed: number, size: { rooms: number; examsPerRoom: number }): { input: DayPlanInput; fixed: Record<number, FixedReason> } {
  const next = seededRandom(seed);
  const int = (min: number, max: number) => min + Math.floor(next() * (max - min + 1));
  const pick = <T>(list: readonly T[]): T => list[Math.floor(next() * list.length)]!;
  const date = '2027-03-16';
  const rooms: DayPlanRoom[] = Array.from({ length: size.rooms }, (_, i) => ({
    id: 1 + i,
    name: `${i % 4 === 3 ? 'CT' : 'MR'} ${i + 1}`,
    modality: i % 4 === 3 ? 'CT' : 'MR',
    staff: i % 4 === 3 ? 1 : 2,
    airChangesPerHour: 12,
    opensAt: '07:00',
    closesAt: '19:00',
  }));
  const exams: DayPlanExam[] = [];
  const fixed: Record<number, FixedReason> = {};
  // 12 hours open, a room's exams and turnovers fill about 60–80 % of them on average.
  const slot = Math.floor((12 * 60) / size.examsPerRoom);
  for (const room of rooms) {
    let minute = 7 * 60 + 15;
    for (let k = 0; k < size.examsPerRoom; k++) {
      const id = exams.length + 1;
      const durationMinutes = Math.max(5, Math.min(slot - 20, pick([10, 15, 20, 30, 40])));
      const start = minute;
      if (start + durationMinutes > 19 * 60) break;
      const hh = String(Math.floor(start / 60)).padStart(2, '0');
      const mm = String(start % 60).padStart(2, '0');
      exams.push({
        id,
        accession: `FIT-${id}`,
        roomId: room.id,
        start: `${date}T${hh}:${mm}:00-05:00`,
        durationMinutes,
        procedure: `${room.modality} invented procedure`,
        coil: room.modality === 'MR' ? pick(['head', 'head', 'knee', 'spine']) : null,
        precaution: next() < 0.06 ? pick(['contact', 'droplet', 'enteric'] as const) : 'none',
        mobility: next() < 0.15 ? pick(['wheelchair', 'stretcher'] as const) : 'ambulatory',
        contrast: next() < 0.2,
        version: 1,
      });
      if (next() < 0.08) fixed[id] = pick(['arrived', 'pinned'] as const);
      // Mostly a fitting gap of 22–30 min; one in eight too tight.
      minute = start + durationMinutes + (next() < 0.125 ? int(5, 15) : int(22, Math.max(22, slot - durationMinutes)));
    }
  }
  return { input: { date, timezone: 'America/Chicago', ...DEMO_SETUP, snugMarginMinutes: 3, rooms, exams }, fixed };
}
