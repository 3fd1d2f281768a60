import type { DayPlanExam, DayPlanInput, DayPlanRoom } from '../../turnover/day-plan-input';
import { DEMO_SETUP } from '../../turnover/demo-protocols';
import { seededRandom } from '../../turnover/testing/seeded-random';
import type { FixedReason } from '../model';

/**
 * An invented small day that enumeration can search in full: two MR rooms open 07:00 to
 * 08:30–09:30, 1 to `mostPerRoom` exams each on a `grid`-minute grid, booked back to back with gaps of 0–30
 * minutes (so some are short or overlap), every precaution and mobility now and then, and
 * sometimes one exam fixed.
 *
 * @example
 * smallDay(3, 15).input.exams.length; // 2 to 6
 */
export function smallDay(seed: number, grid: number, mostPerRoom = 3): { input: DayPlanInput; fixed: Record<number, FixedReason> } {
  const next = seededRandom(seed);
  const int = (min: number, max: number) => min + Math.floor(next() * (max - min + 1));
  const pick = <T>(list: readonly T[]): T => list[Math.floor(next() * list.length)]!;
  const date = '2027-03-16';
  const rooms: DayPlanRoom[] = [1, 2].map((id) => ({
    id,
    name: `MR ${id}`,
    modality: 'MR',
    staff: pick([1, 1, 2]),
    airChangesPerHour: 12,
    opensAt: '07:00',
    closesAt: pick(['08:30', '09:00', '09:30']),
  }));
  const exams: DayPlanExam[] = [];
  const fixed: Record<number, FixedReason> = {};
  for (const room of rooms) {
    let minute = 7 * 60 + grid * int(0, 2);
    for (let k = int(1, mostPerRoom); k > 0; k--) {
      const id = exams.length + 1;
      const durationMinutes = pick([10, 15, 20, 30]);
      if (minute + durationMinutes > 9 * 60) break;
      exams.push({
        id,
        accession: `SM-${id}`,
        roomId: room.id,
        start: `${date}T${String(Math.floor(minute / 60)).padStart(2, '0')}:${String(minute % 60).padStart(2, '0')}:00-05:00`,
        durationMinutes,
        procedure: 'MR invented procedure',
        coil: pick(['head', 'knee']),
        precaution: next() < 0.25 ? pick(['contact', 'enteric', 'droplet', 'airborne'] as const) : 'none',
        mobility: pick(['ambulatory', 'ambulatory', 'wheelchair', 'stretcher'] as const),
        contrast: next() < 0.3,
        version: 1,
      });
      if (next() < 0.15) fixed[id] = pick(['arrived', 'started', 'pinned'] as const);
      minute += durationMinutes + grid * int(0, 2);
    }
  }
  return { input: { date, timezone: 'America/Chicago', ...DEMO_SETUP, snugMarginMinutes: 3, rooms, exams }, fixed };
}

/**
 * `smallDay` with an invented roster of 1–3 aides (by the seed) on 07:00–10:00: the first two
 * cover both rooms, the third MR 1 only; 3 minutes' walk between rooms (common practice, no
 * source). With `breaks`, the first aide takes 07:40–07:55 off (invented); with `firstRoomOnly`,
 * every aide covers MR 1 only and MR 2 keeps its own staff.
 *
 * @example
 * smallRosterDay(7, 30).input.roster!.people.length; // 2
 */
export function smallRosterDay(seed: number, grid: number, options: { mostPerRoom?: number; breaks?: boolean; firstRoomOnly?: boolean } = {}): { input: DayPlanInput; fixed: Record<number, FixedReason> } {
  const { input, fixed } = smallDay(seed, grid, options.mostPerRoom ?? 3);
  const people = Array.from({ length: 1 + (seed % 3) }, (_, k) => ({
    id: `p${k}`, name: null, label: `Aide ${k + 1}`, role: 'aide' as const, start: '07:00', end: '10:00',
    breaks: options.breaks && k === 0 ? [{ start: '07:40', end: '07:55' }] : [], roomIds: k === 2 || options.firstRoomOnly ? [1] : [1, 2],
  }));
  return { input: { ...input, roster: { source: 'day', walkingMinutes: 3, people } }, fixed };
}
