import { proposeDayFit } from '../../shared/day-fit';
import { fitWorkDay } from '../../shared/day-fit/testing/fit-days';
import { highsSolver } from '../../server/services/day-fit/highs-solve';
import { createDayFitPool, DAY_FIT_SOLVE_MS } from '../../server/workers/day-fit-pool';

/**
 * "Make the day fit" on invented working days (shared/day-fit/testing/fit-days.ts): 4 rooms and
 * 80 exams (target < 1 s), 40 rooms and 1,200 exams (target < 10 s), each with the time limit the
 * server gives a proposal (what a charge technologist waits for), with the solver's status,
 * optimality gap, scope and what stays unsolved; then the small day once more through the
 * worker pool (HiGHS loading in a fresh thread included). Printed, never asserted.
 *
 * @example
 * for (const line of await benchDayFit()) console.log(line);
 */
export async function benchDayFit(): Promise<string[]> {
  const solve = await highsSolver();
  const lines: string[] = [];
  for (const [name, size, target, budget] of [
    ['4 rooms / 80 exams', { rooms: 4, examsPerRoom: 20 }, 1_000, DAY_FIT_SOLVE_MS],
    ['40 rooms / 1,200 exams', { rooms: 40, examsPerRoom: 30 }, 10_000, DAY_FIT_SOLVE_MS],
  ] as const) {
    const { input, fixed } = fitWorkDay(1, size);
    const t0 = performance.now();
    const p = proposeDayFit(input, solve, { fixed, timeLimitMs: budget });
    const ms = performance.now() - t0;
    lines.push(
      `day fit, ${name} (${input.exams.length} exams, ${p.before.short + p.before.overlap} problem gaps): ${ms.toFixed(0)} ms (target < ${target} ms) — ` +
        `${p.solver.status}, optimality gap ${p.solver.mipGap >= 1 ? 'unknown' : `${(p.solver.mipGap * 100).toFixed(1)} %`}, ${p.solver.scope}, ${p.solver.clusters} clusters, ${p.solver.solves} solves; ` +
        `${p.objective.examsMoved} moved, ${p.objective.minutesMoved} min, ${p.remaining.length} gaps left`,
    );
  }
  const pool = createDayFitPool();
  try {
    const { input, fixed } = fitWorkDay(1, { rooms: 4, examsPerRoom: 20 });
    const t0 = performance.now();
    await pool.propose('bench', { input, options: { fixed } });
    lines.push(`day fit through the worker, 4 rooms / 80 exams, first call (thread and HiGHS start included): ${(performance.now() - t0).toFixed(0)} ms`);
  } finally {
    await pool.close();
  }
  return lines;
}
