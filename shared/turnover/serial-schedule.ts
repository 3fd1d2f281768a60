import type { SolverProblem } from './solver-problem';

/** An order of step indices and the makespan the serial scheme gives it. */
export interface SearchResult {
  makespan: number;
  order: number[];
}

/**
 * New sorted free times after a step ending at `end` is given to the person free latest while
 * still not delaying it (or the first free, when all are later than `ready`): every choice starts
 * the step at the same time, and this one leaves the others free earliest.
 *
 * @example
 * placeOnBestFit([0, 3, 9], 5, 8); // [0, 8, 9]: the person free at 3 takes it, 0 stays free
 */
export function placeOnBestFit(free: number[], ready: number, end: number): number[] {
  let k = 0;
  while (k + 1 < free.length && free[k + 1] <= ready) k++;
  const next = free.slice();
  next.splice(k, 1);
  let at = 0;
  while (at < next.length && next[at] <= end) at++;
  next.splice(at, 0, end);
  return next;
}

/**
 * Makespan of an order decoded by the serial scheme (each step as early as a person and its needs allow).
 *
 * @example
 * decodeMakespan(compileProblem(steps, 1), [0, 1, 2]); // e.g. 20
 */
export function decodeMakespan(pb: SolverProblem, order: number[]): number {
  let free = new Array<number>(pb.staff).fill(0);
  const end = new Array<number>(pb.n).fill(0);
  const dry = new Array<number>(pb.n).fill(0);
  let makespan = 0;
  for (const j of order) {
    let ready = 0;
    pb.preds[j].forEach((i, k) => (ready = Math.max(ready, pb.predDry[j][k] ? dry[i] : end[i])));
    const start = Math.max(ready, free[0]);
    end[j] = start + pb.handsOn[j];
    dry[j] = end[j] + pb.wait[j];
    makespan = Math.max(makespan, dry[j]);
    free = placeOnBestFit(free, ready, end[j]);
  }
  return makespan;
}

/**
 * Best of a few priority rules (protocol order, longest chain after, longest wait), decoded by
 * the serial scheme: the search's first incumbent. Protocol order first, so ties keep it.
 *
 * @example
 * bestHeuristic(compileProblem(steps, 2)).makespan; // an upper bound on the optimum
 */
export function bestHeuristic(pb: SolverProblem): SearchResult {
  const rules: ((a: number, b: number) => number)[] = [
    (a, b) => a - b,
    (a, b) => pb.tail[b] - pb.tail[a] || a - b,
    (a, b) => pb.wait[b] - pb.wait[a] || a - b,
  ];
  let best: SearchResult = { makespan: Infinity, order: [] };
  for (const rule of rules) {
    const order = listOrder(pb, rule);
    const makespan = decodeMakespan(pb, order);
    if (makespan < best.makespan) best = { makespan, order };
  }
  return best;
}

function listOrder(pb: SolverProblem, priority: (a: number, b: number) => number): number[] {
  const order: number[] = [];
  let mask = 0;
  while (order.length < pb.n) {
    let pick = -1;
    for (let j = 0; j < pb.n; j++) {
      if (mask & (1 << j) || (pb.predMask[j] & mask) !== pb.predMask[j]) continue;
      if (pick < 0 || priority(j, pick) < 0) pick = j;
    }
    order.push(pick);
    mask |= 1 << pick;
  }
  return order;
}
