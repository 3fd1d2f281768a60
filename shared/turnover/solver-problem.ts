import type { SolverStep } from './model';

/** A turnover compiled to index arrays for the search; steps keep their input (protocol) order. */
export interface SolverProblem {
  n: number;
  staff: number;
  handsOn: number[];
  wait: number[];
  /** For each step, the steps it needs and whether each must also be dry. */
  preds: number[][];
  predDry: boolean[][];
  predMask: number[];
  succs: number[][];
  /** A topological order (ties by input order). */
  topo: number[];
  /** Least time from a step's start to the end of everything that depends on it. */
  tail: number[];
  /** Index of an earlier, interchangeable step, or -1. */
  twin: number[];
  /** Every time is a whole number of minutes, so bounds may round up. */
  integral: boolean;
}

/** More steps than this would not fit the search's bit masks (and no turnover has this many). */
export const MAX_STEPS = 30;

/**
 * Checks a solver input and compiles it.
 *
 * @throws RangeError when staff is not a whole number ≥ 1, a time is negative or not a number,
 *   or there are more than {@link MAX_STEPS} steps; Error on a duplicate key, an unknown need,
 *   or needs that form a cycle
 * @example
 * compileProblem([{ key: 'a', label: 'A', handsOnMinutes: 1, waitMinutes: 0, needs: [] }], 1).n; // 1
 */
export function compileProblem(steps: readonly SolverStep[], staff: number): SolverProblem {
  if (!Number.isInteger(staff) || staff < 1) throw new RangeError(`staff must be a whole number ≥ 1, got ${staff}`);
  const n = steps.length;
  if (n > MAX_STEPS) throw new RangeError(`at most ${MAX_STEPS} steps, got ${n}`);
  const index = new Map<string, number>();
  steps.forEach((s, i) => {
    if (index.has(s.key)) throw new Error(`step "${s.key}" appears twice`);
    index.set(s.key, i);
    for (const [name, v] of [['handsOnMinutes', s.handsOnMinutes], ['waitMinutes', s.waitMinutes]] as const) {
      if (!Number.isFinite(v) || v < 0) throw new RangeError(`step "${s.key}": ${name} must be a number ≥ 0, got ${v}`);
    }
  });
  const preds: number[][] = [];
  const predDry: boolean[][] = [];
  const predMask: number[] = [];
  const succs: number[][] = steps.map(() => []);
  steps.forEach((s, j) => {
    const byPred = new Map<number, boolean>();
    for (const need of s.needs) {
      const i = index.get(need.key);
      if (i === undefined) throw new Error(`step "${s.key}" needs unknown step "${need.key}"`);
      byPred.set(i, (byPred.get(i) ?? false) || need.dry);
    }
    preds.push([...byPred.keys()]);
    predDry.push([...byPred.values()]);
    predMask.push([...byPred.keys()].reduce((m, i) => m | (1 << i), 0));
    for (const i of byPred.keys()) succs[i].push(j);
  });
  const topo = topologicalOrder(steps, preds, succs);
  const handsOn = steps.map((s) => s.handsOnMinutes);
  const wait = steps.map((s) => s.waitMinutes);
  const tail = new Array<number>(n).fill(0);
  for (let t = n - 1; t >= 0; t--) {
    const i = topo[t];
    let after = wait[i];
    for (const j of succs[i]) {
      const lag = predDry[j][preds[j].indexOf(i)] ? wait[i] : 0;
      after = Math.max(after, lag + tail[j]);
    }
    tail[i] = handsOn[i] + after;
  }
  const problem: SolverProblem = {
    n,
    // More people than steps cannot help; capping lets equal gaps share a cached answer.
    staff: Math.min(staff, Math.max(1, n)),
    handsOn,
    wait,
    preds,
    predDry,
    predMask,
    succs,
    topo,
    tail,
    twin: [],
    integral: [...handsOn, ...wait].every(Number.isInteger),
  };
  problem.twin = findTwins(problem);
  return problem;
}

function topologicalOrder(steps: readonly SolverStep[], preds: number[][], succs: number[][]): number[] {
  const missing = preds.map((p) => p.length);
  const order: number[] = [];
  const done = new Array<boolean>(steps.length).fill(false);
  // Repeatedly take the first ready step in input order: O(n²), n ≤ 30.
  for (let round = 0; round < steps.length; round++) {
    const next = missing.findIndex((m, i) => m === 0 && !done[i]);
    if (next < 0) throw new Error(`steps have cyclic needs: ${describeCycle(steps, preds, done)}`);
    done[next] = true;
    order.push(next);
    for (const j of succs[next]) missing[j]--;
  }
  return order;
}

function describeCycle(steps: readonly SolverStep[], preds: number[][], done: boolean[]): string {
  // Walk needs backwards from any blocked step until a step repeats.
  let at = done.findIndex((d) => !d);
  const seen: number[] = [];
  while (!seen.includes(at)) {
    seen.push(at);
    at = preds[at].find((i) => !done[i]) ?? at;
  }
  const cycle = seen.slice(seen.indexOf(at)).reverse();
  return [...cycle, cycle[0]].map((i) => steps[i].key).join(' → ');
}

/** Steps with equal times, equal needs and equal dependants: any order between them is the same. */
function findTwins(pb: SolverProblem): number[] {
  const signature = (i: number): string => {
    const needs = pb.preds[i].map((p, k) => `${p}${pb.predDry[i][k] ? 'd' : ''}`).sort().join(',');
    const dependants = pb.succs[i]
      .map((j) => `${j}${pb.predDry[j][pb.preds[j].indexOf(i)] ? 'd' : ''}`)
      .sort()
      .join(',');
    return `${pb.handsOn[i]}/${pb.wait[i]}/${needs}/${dependants}`;
  };
  const first = new Map<string, number>();
  return pb.handsOn.map((_, i) => {
    const sig = signature(i);
    const earlier = first.get(sig);
    first.set(sig, i);
    return earlier ?? -1;
  });
}
