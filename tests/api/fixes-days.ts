import type { DayPlanExam, DayPlanInput, DayPlanRoom } from '../../shared/turnover';
import { MOBILITIES, PRECAUTIONS } from '../../shared/turnover';
import { DEMO_SETUP } from '../../shared/turnover/demo-protocols';
import { seededRandom } from '../../shared/turnover/testing/seeded-random';

const DATE = '2027-03-15';
const ZONE = 'America/Chicago';

const random = seededRandom;

/** `minute` minutes after 06:00 UTC on `date` (01:00 in Chicago in summer time), ISO with `Z`. */
const at = (date: string, minute: number) => new Date(Date.parse(`${date}T06:00:00Z`) + minute * 60_000).toISOString().replace('.000Z', 'Z');

/**
 * An invented busy day of `count` exams, 100 a room (MR, CT, US rooms), with random gaps of
 * 0–25 min so most turnovers are short: the shape of day a fixes call struggled with.
 *
 * @example
 * busyDay(800).exams.length; // 800
 */
export function busyDay(count: number, date = DATE): DayPlanInput {
  const next = random(20270315 + count);
  const pick = <T>(list: readonly T[], weights: number[]): T => {
    let r = next() * weights.reduce((a, b) => a + b, 0);
    for (let i = 0; i < list.length; i++) if ((r -= weights[i]!) < 0) return list[i]!;
    return list[list.length - 1]!;
  };
  const rooms: DayPlanRoom[] = Array.from({ length: Math.max(1, Math.ceil(count / 100)) }, (_, i) => ({
    id: i + 1,
    name: `Room ${i + 1}`,
    modality: pick(['MR', 'CT', 'US'], [5, 3, 2]),
    staff: 1,
    airChangesPerHour: 12,
    opensAt: '00:00',
    closesAt: '23:59',
  }));
  const exams: DayPlanExam[] = [];
  for (const room of rooms) {
    let minute = 0;
    for (let k = 0; k < 100 && exams.length < count; k++) {
      const durationMinutes = pick([5, 8, 10, 12], [1, 1, 1, 1]);
      minute += Math.floor(next() * 26);
      exams.push({
        id: exams.length + 1,
        accession: `BUSY${exams.length + 1}`,
        roomId: room.id,
        start: at(date, minute),
        durationMinutes,
        procedure: `${room.modality} invented procedure`,
        coil: pick(['head', 'spine', 'knee', null], [1, 1, 1, 1]),
        precaution: pick(PRECAUTIONS, [80, 8, 4, 4, 4]),
        mobility: pick(MOBILITIES, [80, 12, 8]),
        contrast: next() < 0.3,
        notes: null,
        version: 1,
      });
      minute += durationMinutes;
    }
  }
  return { date, timezone: ZONE, ...DEMO_SETUP, rooms, exams };
}

/**
 * The worst case for suggestions: `count` exams in one MR room, every gap a problem (each exam
 * starts before the one before it ends), every leaving exam an isolation case, so every kind
 * of fix is tried for every gap and each push cascades through the rest of the day.
 *
 * @example
 * crowdedRoomDay(2000).rooms.length; // 1
 */
export function crowdedRoomDay(count: number, date = DATE): DayPlanInput {
  const rooms: DayPlanRoom[] = [{ id: 1, name: 'MR 1', modality: 'MR', staff: 1, airChangesPerHour: 12, opensAt: '00:00', closesAt: '23:59' }];
  const exams: DayPlanExam[] = Array.from({ length: count }, (_, i) => ({
    id: i + 1,
    accession: `CROWD${i + 1}`,
    roomId: 1,
    start: at(date, Math.floor((i * 17 * 60) / count)),
    durationMinutes: 5,
    procedure: 'MR invented procedure',
    coil: i % 2 ? 'head' : 'spine',
    precaution: i % 3 ? 'contact' : 'enteric',
    mobility: 'ambulatory',
    contrast: i % 2 === 0,
    notes: null,
    version: 1,
  }));
  return { date, timezone: ZONE, ...DEMO_SETUP, rooms, exams };
}
