import type { DayPlanExam, DayPlanRoom } from '../../shared/turnover';
import { DEMO_SETUP } from '../../shared/turnover/demo-protocols';
import { computeDayPlan, MOBILITIES, PRECAUTIONS } from '../../shared/turnover';
import { seededRandom } from '../../shared/turnover/testing/seeded-random';

const ROOMS = 100;
const EXAMS = 10_000;
const WARM_UP_RUNS = 2;
const WARM_RUNS = 15;
const TARGET_MS = 50;

const random = seededRandom;

/** An invented stress day: 100 rooms (MR, CT, US), 100 short exams each with random gaps (0–25 min). */
export function syntheticDay(): { rooms: DayPlanRoom[]; exams: DayPlanExam[] } {
  const next = random(20270315);
  const pick = <T>(list: readonly T[], weights?: number[]): T => {
    if (!weights) return list[Math.floor(next() * list.length)];
    let r = next() * weights.reduce((a, b) => a + b, 0);
    for (let i = 0; i < list.length; i++) if ((r -= weights[i]) < 0) return list[i];
    return list[list.length - 1];
  };
  const rooms: DayPlanRoom[] = Array.from({ length: ROOMS }, (_, i) => ({
    id: i + 1,
    name: `Room ${i + 1}`,
    modality: pick(['MR', 'CT', 'US'], [5, 3, 2]),
    staff: pick([1, 2, 3], [6, 3, 1]),
    airChangesPerHour: pick([6, 12, 15]),
    opensAt: '00:00',
    closesAt: '23:59',
  }));
  const exams: DayPlanExam[] = [];
  for (const room of rooms) {
    let minute = 0;
    for (let k = 0; k < EXAMS / ROOMS; k++) {
      const durationMinutes = pick([5, 8, 10, 12]);
      minute += Math.floor(next() * 26);
      const start = new Date(Date.UTC(2027, 2, 15, 5, 0) + minute * 60_000).toISOString().replace('.000Z', 'Z');
      exams.push({
        id: exams.length + 1,
        accession: `BENCH${exams.length + 1}`,
        roomId: room.id,
        start,
        durationMinutes,
        procedure: `${room.modality} invented procedure`,
        coil: pick(['head', 'spine', 'knee', null]),
        precaution: pick(PRECAUTIONS, [80, 8, 4, 4, 4]),
        mobility: pick(MOBILITIES, [80, 12, 8]),
        contrast: next() < 0.3,
        notes: null,
        version: 1,
      });
      minute += durationMinutes;
    }
  }
  return { rooms, exams };
}

/**
 * Times computeDayPlan on a synthetic 10,000-exam / 100-room day: once cold (every kind of gap
 * solved for the first time in this process), then warm (after two untimed warm-up runs).
 *
 * @example
 * for (const line of await benchEngine()) console.log(line);
 */
export async function benchEngine(): Promise<string[]> {
  const { rooms, exams } = syntheticDay();
  const input = { date: '2027-03-15', timezone: 'America/Chicago', ...DEMO_SETUP, rooms, exams };
  const time = (): { ms: number; plan: ReturnType<typeof computeDayPlan> } => {
    const t0 = performance.now();
    const plan = computeDayPlan(input);
    return { ms: performance.now() - t0, plan };
  };
  const cold = time();
  // A server plans the same kinds of gaps all day: "warm" is after caches and the JIT have settled.
  for (let k = 0; k < WARM_UP_RUNS; k++) time();
  const warm = Array.from({ length: WARM_RUNS }, () => time().ms).sort((a, b) => a - b);
  const median = warm[Math.floor(warm.length / 2)];
  const { summary } = cold.plan;
  return [
    `engine: ${exams.length} exams / ${rooms.length} rooms — cold ${cold.ms.toFixed(1)} ms, ` +
      `warm median ${median.toFixed(1)} ms, best ${warm[0].toFixed(1)} ms (target < ${TARGET_MS} ms)${median < TARGET_MS ? '' : ' — OVER TARGET'}`,
    `engine: gaps fits ${summary.fits}, snug ${summary.snug}, short ${summary.short}, overlap ${summary.overlap}, ` +
      `${summary.minutesShort} minutes short`,
  ];
}
