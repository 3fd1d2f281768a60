import { searchOptimalOrder } from './branch-and-bound';
import type { ScheduledStep, SolverStep, TurnoverSchedule } from './model';
import type { SearchResult } from './serial-schedule';
import { compileProblem, type SolverProblem } from './solver-problem';

export interface SolveTurnoverOptions {
  steps: readonly SolverStep[];
  /** People working the turnover, a whole number ≥ 1. */
  staff: number;
}

export interface TurnoverSolver {
  solve(options: SolveTurnoverOptions): TurnoverSchedule;
  /** Distinct gap signatures solved so far (for diagnostics). */
  readonly cacheSize: number;
}

export interface CreateTurnoverSolverOptions {
  /** Distinct gap signatures kept; the oldest is dropped beyond this. Default 5000. */
  maxCacheEntries?: number;
}

/**
 * A solver that remembers answers by gap signature (the steps' minutes and needs, and staff),
 * so a week of 10,000 exams solves each distinct kind of gap once. Pure: the cache only saves time.
 *
 * @example
 * const solver = createTurnoverSolver({ maxCacheEntries: 100 });
 * solver.solve({ steps, staff: 2 }).requiredMinutes;
 */
export function createTurnoverSolver(options: CreateTurnoverSolverOptions = {}): TurnoverSolver {
  const maxEntries = options.maxCacheEntries ?? 5000;
  const cache = new Map<string, SearchResult>();
  return {
    get cacheSize() {
      return cache.size;
    },
    solve({ steps, staff }) {
      const problem = compileProblem(steps, staff);
      const key = signature(problem);
      let result = cache.get(key);
      if (!result) {
        result = searchOptimalOrder(problem);
        if (cache.size >= maxEntries) cache.delete(cache.keys().next().value as string);
        cache.set(key, result);
      }
      return toSchedule(steps, problem, result);
    },
  };
}

const sharedSolver = createTurnoverSolver();

/**
 * The order and assignment of a turnover's steps that makes the room ready soonest.
 *
 * Each step occupies one person for its hands-on minutes, without interruption; it may start
 * once every step it needs is done (or done and dry, for a dry need). Time 0 is the leaving
 * exam's end. `requiredMinutes` is the latest hands-on end or dry-at time (the air hold is
 * added by the caller). Optimal (minimum makespan); ties keep the protocol's order. Results
 * are memoized in a bounded module-level cache keyed by the steps' numbers and staff.
 *
 * @throws RangeError when staff is not a whole number ≥ 1 or a time is negative;
 *   Error on a duplicate step, an unknown need, or needs that form a cycle
 * @example
 * solveTurnover({ staff: 1, steps: [
 *   { key: 'table', label: 'Table', handsOnMinutes: 2, waitMinutes: 4, needs: [] },
 *   { key: 'linen', label: 'Linen', handsOnMinutes: 1, waitMinutes: 0, needs: [{ key: 'table', dry: true }] },
 * ] }).requiredMinutes; // 7
 */
export function solveTurnover(options: SolveTurnoverOptions): TurnoverSchedule {
  return sharedSolver.solve(options);
}

function signature(pb: SolverProblem): string {
  const parts = [String(pb.staff)];
  for (let j = 0; j < pb.n; j++) {
    const needs = pb.preds[j].map((i, k) => (pb.predDry[j][k] ? `${i}d` : `${i}`)).join('.');
    parts.push(`${pb.handsOn[j]},${pb.wait[j]},${needs}`);
  }
  return parts.join(';');
}

/**
 * Decodes the order onto numbered persons exactly as the search did: the step goes to the person
 * who can start it earliest, and among those the one free latest (then the lowest number).
 */
function toSchedule(steps: readonly SolverStep[], pb: SolverProblem, result: SearchResult): TurnoverSchedule {
  const free = new Array<number>(pb.staff).fill(0);
  const placed: (ScheduledStep & { index: number })[] = [];
  const end: number[] = [];
  const dry: number[] = [];
  for (const j of result.order) {
    let ready = 0;
    pb.preds[j].forEach((i, k) => (ready = Math.max(ready, pb.predDry[j][k] ? dry[i] : end[i])));
    let person = 0;
    for (let q = 1; q < free.length; q++) {
      const better = free[person] <= ready ? free[q] <= ready && free[q] > free[person] : free[q] < free[person];
      if (better) person = q;
    }
    const start = Math.max(ready, free[person]);
    end[j] = start + pb.handsOn[j];
    dry[j] = end[j] + pb.wait[j];
    free[person] = end[j];
    placed.push({ index: j, key: steps[j].key, label: steps[j].label, start, end: end[j], dryAt: dry[j], person });
  }
  placed.sort((a, b) => a.start - b.start || a.index - b.index);
  return {
    requiredMinutes: result.makespan,
    steps: placed.map(({ index: _index, ...step }) => step),
  };
}
