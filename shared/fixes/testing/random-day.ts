import type { DayPlanExam, DayPlanInput, DayPlanRoom } from '../../turnover/day-plan-input';
import { DEMO_SETUP } from '../../turnover/demo-protocols';
import { MOBILITIES, PRECAUTIONS } from '../../turnover/model';
import { seededRandom } from '../../turnover/testing/seeded-random';

const random = seededRandom;

/**
 * An invented, crowded small day for property checks (no real rooms or exams): 3–5 rooms of
 * two or three modalities with their own opening times, staff and air changes; 4–12 exams a
 * room with gaps of −10 to 40 min (so every verdict occurs), some helpers already added, every
 * precaution and mobility, now and then a zero-length exam. On `date` in America/Chicago
 * (2027-03-14 is the spring-forward day).
 *
 * @example
 * randomDay(7).exams.length; // between 12 and 60
 */
export function randomDay(seed: number, date = '2027-03-15'): DayPlanInput {
  const next = random(seed);
  const int = (min: number, max: number) => min + Math.floor(next() * (max - min + 1));
  const pick = <T>(list: readonly T[]): T => list[Math.floor(next() * list.length)]!;
  const rooms: DayPlanRoom[] = Array.from({ length: int(3, 5) }, (_, i) => ({
    id: 10 + i,
    name: `Room ${i + 1}`,
    modality: pick(['MR', 'MR', 'CT']),
    staff: pick([1, 1, 2, 3]),
    airChangesPerHour: pick([6, 12]),
    opensAt: pick(['00:30', '01:00', '07:00']),
    closesAt: '23:00',
  }));
  const exams: DayPlanExam[] = [];
  const staffOverrides: Record<number, number> = {};
  for (const room of rooms) {
    let minute = int(0, 60);
    for (let k = int(4, 12); k > 0; k--) {
      const id = 100 + exams.length;
      const durationMinutes = next() < 0.05 ? 0 : pick([10, 20, 30, 45]);
      const [y, m, d] = date.split('-').map(Number) as [number, number, number];
      exams.push({
        id,
        accession: `RND-${id}`,
        roomId: room.id,
        // from 06:00 UTC: around 01:00 in Chicago, before and after a spring-forward at 02:00
        start: new Date(Date.UTC(y, m - 1, d, 6, minute)).toISOString().replace('.000Z', 'Z'),
        durationMinutes,
        procedure: `${room.modality} invented procedure`,
        coil: pick(['head', 'knee', 'Knee', null]),
        precaution: pick(PRECAUTIONS),
        mobility: pick(MOBILITIES),
        contrast: next() < 0.3,
        version: 1,
      });
      if (next() < 0.1) staffOverrides[id] = pick([1, 2, 3]);
      minute += durationMinutes + int(-10, 40);
    }
  }
  return { date, timezone: 'America/Chicago', ...DEMO_SETUP, snugMarginMinutes: pick([0, 3]), rooms, exams, staffOverrides };
}
