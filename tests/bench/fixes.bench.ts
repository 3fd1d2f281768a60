import { monitorEventLoopDelay } from 'node:perf_hooks';
import { suggestFixes, suggestGapFixes } from '../../shared/fixes';
import { computeDayPlan, type DayPlanInput } from '../../shared/turnover';
import { createFixesPool } from '../../server/workers/fixes-pool';
import { busyDay, crowdedRoomDay } from '../api/fixes-days';

const WARM_RUNS = 7;
const TARGET_MS = 50;

const median = (values: number[]) => [...values].sort((a, b) => a - b)[Math.floor(values.length / 2)]!;
function time<T>(run: () => T): { ms: number; result: T } {
  const t0 = performance.now();
  const result = run();
  return { ms: performance.now() - t0, result };
}

/**
 * Times one `GET /api/days/:date/fixes` call's work (a page of at most 20 problem gaps — the
 * first, and one late in the list — and one gap on demand) on invented busy days of 800, 1,600 and 2,000 exams and on the worst case: 2,000
 * exams in one room, every gap overlapping. Then the same page through the fixes worker pool,
 * with the longest the event loop was held up meanwhile (what every other user would feel).
 * Before suggestions were paged, one call on 800 / 1,600 / 2,000 busy exams took 3.2 / 23 / 37 s.
 *
 * @example
 * for (const line of await benchFixes()) console.log(line);
 */
export async function benchFixes(): Promise<string[]> {
  const days: [string, DayPlanInput][] = [
    ['800 exams / 8 rooms', busyDay(800)],
    ['1,600 exams / 16 rooms', busyDay(1600)],
    ['2,000 exams / 20 rooms', busyDay(2000)],
    ['2,000 exams / 1 room, every gap a problem', crowdedRoomDay(2000)],
  ];
  const lines: string[] = [];
  for (const [name, input] of days) {
    // the engine's memoised turnovers, warm as on a server; a late page too (short cascades: full pages)
    const order = computeDayPlan(input).rooms.flatMap((r) => r.gaps.map((g) => g.toExamId));
    const late = order[Math.floor(order.length * 0.97)];
    const first = time(() => suggestFixes(input)!);
    const page = median(Array.from({ length: WARM_RUNS }, () => Math.max(time(() => suggestFixes(input)).ms, time(() => suggestFixes(input, { after: late })).ms)));
    const gaps = first.result.gaps;
    const gap = Math.max(...gaps.slice(0, 5).map((id) => median(Array.from({ length: 3 }, () => time(() => suggestGapFixes(input, id)).ms))));
    lines.push(
      `fixes: ${name} — first page ${gaps.length} of ${first.result.problemGaps} problem gaps: cold ${first.ms.toFixed(1)} ms; ` +
        `warm, the slower of the first and a late page: median ${page.toFixed(1)} ms (target < ${TARGET_MS} ms on the event loop, else a worker)${page < TARGET_MS ? '' : ' — in the worker'}; ` +
        `one gap ≤ ${gap.toFixed(1)} ms; ${(JSON.stringify(first.result).length / 1024).toFixed(0)} KB`,
    );
  }
  lines.push(await benchThroughPool(days.at(-1)![1]));
  return lines;
}

/** A page of the worst day through the worker pool: round trip, and the event loop's longest stall meanwhile. */
async function benchThroughPool(input: DayPlanInput): Promise<string> {
  const pool = createFixesPool();
  try {
    await pool.page({ input, bounds: {} }); // start the thread and warm its caches
    const delay = monitorEventLoopDelay({ resolution: 5 });
    const trips: number[] = [];
    delay.enable();
    for (let k = 0; k < WARM_RUNS; k++) {
      const t0 = performance.now();
      await pool.page({ input, bounds: {} });
      trips.push(performance.now() - t0);
    }
    delay.disable();
    // the same time with nothing to do: how much of the stall is the machine's own load
    const idle = monitorEventLoopDelay({ resolution: 5 });
    idle.enable();
    await new Promise((resolve) => setTimeout(resolve, trips.reduce((a, b) => a + b, 0)));
    idle.disable();
    const ms = (ns: number) => (ns / 1e6).toFixed(1);
    return (
      `fixes: worst day through the worker pool — round trip median ${median(trips).toFixed(1)} ms; event loop delay meanwhile ` +
      `p99 ${ms(delay.percentile(99))} ms, max ${ms(delay.max)} ms (idle for as long: p99 ${ms(idle.percentile(99))} ms, max ${ms(idle.max)} ms)`
    );
  } finally {
    await pool.close();
  }
}
