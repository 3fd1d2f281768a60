import { MINUTE, type CrewJob } from './crew-problem';

/**
 * The order by which one assignment of crews beats another, lexicographic:
 * 1. fewest turnovers nobody on the roster can do (`unstaffed`);
 * 2. fewest problem gaps (`short` or `overlap`: required > available);
 * 3. least total short-by minutes;
 * 4. least total required minutes (the same as the earliest ready-at times in sum);
 * 5. earliest ready-at gap by gap, in the day's order (`required`, compared in turn).
 * The last makes the optimum's ready-at times, and so its verdicts, unique.
 */
export interface DayKey {
  unstaffed: number;
  problems: number;
  shortBy: number;
  requiredSum: number;
  /** Each job's required minutes, in job order (waiting included). */
  required: number[];
}

/** One job's part of the key. */
export interface JobOutcome {
  unstaffed: 0 | 1;
  problem: 0 | 1;
  shortBy: number;
  required: number;
}

/**
 * A staffed job's outcome: required = minutes waited (rounded up) + the crew size's required minutes.
 *
 * @example
 * jobOutcome(job, job.fromMs + 6 * 60_000, 1); // { unstaffed: 0, problem: 1, shortBy: 6, required: 26 } for a 20-minute gap of 20 required
 */
export function jobOutcome(job: CrewJob, startMs: number, k: number): JobOutcome {
  const required = Math.ceil((startMs - job.fromMs) / MINUTE - 1e-9) + job.requiredMinutes[k]!;
  const shortBy = Math.max(0, required - job.availableMinutes);
  return { unstaffed: 0, problem: required > job.availableMinutes ? 1 : 0, shortBy, required };
}

/**
 * A job nobody can do: a problem whose whole turnover is missing — required = the available
 * time (none if it overlaps) + the full crew's required minutes, so short by that much.
 *
 * @example
 * unstaffedOutcome(job).unstaffed; // 1
 */
export function unstaffedOutcome(job: CrewJob): JobOutcome {
  const required = Math.max(job.availableMinutes, 0) + job.requiredMinutes[job.wanted]!;
  return { unstaffed: 1, problem: 1, shortBy: Math.max(0, required - job.availableMinutes), required };
}

/**
 * Compares two keys by the stated order; negative when `a` is better.
 *
 * @example
 * compareKeys(a, b) < 0; // a is the better day
 */
export function compareKeys(a: DayKey, b: DayKey): number {
  return (
    a.unstaffed - b.unstaffed ||
    a.problems - b.problems ||
    a.shortBy - b.shortBy ||
    a.requiredSum - b.requiredSum ||
    compareVectors(a.required, b.required)
  );
}

function compareVectors(a: readonly number[], b: readonly number[]): number {
  const n = Math.min(a.length, b.length);
  for (let i = 0; i < n; i++) if (a[i] !== b[i]) return a[i]! - b[i]!;
  return a.length - b.length;
}

/**
 * The key of a list of outcomes (in job order).
 *
 * @example
 * keyOf([jobOutcome(job, job.fromMs, 1)]).problems; // 0 when the gap fits
 */
export function keyOf(outcomes: readonly JobOutcome[]): DayKey {
  const key: DayKey = { unstaffed: 0, problems: 0, shortBy: 0, requiredSum: 0, required: [] };
  for (const o of outcomes) {
    key.unstaffed += o.unstaffed;
    key.problems += o.problem;
    key.shortBy += o.shortBy;
    key.requiredSum += o.required;
    key.required.push(o.required);
  }
  return key;
}
