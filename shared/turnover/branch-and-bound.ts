import { bestHeuristic, placeOnBestFit, type SearchResult } from './serial-schedule';
import type { SolverProblem } from './solver-problem';

/*
 * Why this finds the optimum: take any optimal schedule and list its steps by start time. Placing
 * them in that order, each at the earliest time a person is free and its needs are met (the
 * serial schedule-generation scheme), starts every step no later than the optimum did — persons
 * are interchangeable, so the free times stay dominated. So some precedence-feasible order,
 * decoded this way, is optimal; the search enumerates those orders, pruning a branch only when a
 * lower bound proves it cannot beat the best found, or when an earlier state with the same steps
 * done was at least as good in every respect (persons free no later, needs met no later).
 */

const MAX_STATES_PER_MASK = 48;

/**
 * Minimum-makespan order by branch and bound, seeded with the best of a few priority rules.
 *
 * @example
 * searchOptimalOrder(compileProblem(steps, 1)).makespan; // 20 for the default MR turnover
 */
export function searchOptimalOrder(pb: SolverProblem): SearchResult {
  const { n, staff: m, handsOn: p, wait: w, preds, predDry, predMask, topo, tail, twin } = pb;
  let best = bestHeuristic(pb);
  if (n === 0) return best;

  const end = new Array<number>(n).fill(0);
  const dry = new Array<number>(n).fill(0);
  const est = new Array<number>(n).fill(0);
  const order: number[] = [];
  const seen = new Map<number, number[][]>();
  const full = (1 << n) - 1;
  const roundUp = pb.integral ? ceilish : (x: number) => x;
  const isSink = pb.succs.map((s) => s.length === 0);
  const ancestors = ancestorMasks(pb);

  const readyTime = (j: number, mask: number): number => {
    let r = 0;
    const pj = preds[j];
    for (let k = 0; k < pj.length; k++) {
      const i = pj[k];
      if (mask & (1 << i)) r = Math.max(r, predDry[j][k] ? dry[i] : end[i]);
      else r = Math.max(r, est[i] + p[i] + (predDry[j][k] ? w[i] : 0));
    }
    return r;
  };

  const lowerBound = (mask: number, free: number[], curMax: number): number => {
    let lb = curMax;
    let work = 0;
    let minEst = Infinity;
    let minSinkWait = Infinity;
    for (const j of topo) {
      if (mask & (1 << j)) continue;
      const e = Math.max(free[0], readyTime(j, mask));
      est[j] = e;
      lb = Math.max(lb, e + tail[j]);
      work += p[j];
      if (e < minEst) minEst = e;
      if (isSink[j] && w[j] < minSinkWait) minSinkWait = w[j];
    }
    // Persons share the remaining hands-on work, each from when they are free (or the earliest
    // step can start): the last to end ends no sooner than the average over the k persons used,
    // for the best k; the step ending last is a sink, and then waits.
    let prefix = 0;
    let lastEnd = Infinity;
    let allFree = 0;
    for (let k = 0; k < m; k++) {
      const g = Math.max(free[k], minEst);
      prefix += g;
      allFree += g;
      lastEnd = Math.min(lastEnd, (work + prefix) / (k + 1));
    }
    lb = Math.max(lb, roundUp((work + allFree) / m), roundUp(lastEnd) + minSinkWait);
    // The same argument for each step's own ancestors: it starts after all of them are done.
    for (let j = 0; j < n; j++) {
      const before = ancestors[j] & ~mask;
      if (mask & (1 << j) || before === 0) continue;
      let load = 0;
      let from = Infinity;
      for (let i = 0; i < n; i++) {
        if (!(before & (1 << i))) continue;
        load += p[i];
        if (est[i] < from) from = est[i];
      }
      let done = Infinity;
      prefix = 0;
      for (let k = 0; k < m; k++) {
        prefix += Math.max(free[k], from);
        done = Math.min(done, (load + prefix) / (k + 1));
      }
      lb = Math.max(lb, roundUp(done) + tail[j]);
    }
    return lb;
  };

  const dominated = (mask: number, state: number[]): boolean => {
    const list = seen.get(mask);
    if (!list) {
      seen.set(mask, [state]);
      return false;
    }
    for (const other of list) {
      let le = true;
      for (let k = 0; k < state.length && le; k++) le = other[k] <= state[k];
      if (le) return true;
    }
    if (list.length >= MAX_STATES_PER_MASK) list.shift();
    list.push(state);
    return false;
  };

  const visit = (mask: number, free: number[], curMax: number): void => {
    if (mask === full) {
      if (curMax < best.makespan) best = { makespan: curMax, order: order.slice() };
      return;
    }
    if (lowerBound(mask, free, curMax) >= best.makespan) return;
    const state = [curMax, ...free];
    for (let j = 0; j < n; j++) {
      if (!(mask & (1 << j))) state.push(Math.max(free[0], readyTime(j, mask)));
    }
    if (dominated(mask, state)) return;

    for (let j = 0; j < n; j++) {
      const bit = 1 << j;
      if (mask & bit || (predMask[j] & mask) !== predMask[j]) continue;
      if (twin[j] >= 0 && !(mask & (1 << twin[j]))) continue;
      const ready = readyTime(j, mask);
      const start = Math.max(ready, free[0]);
      const e = start + p[j];
      const d = e + w[j];
      const childMax = Math.max(curMax, d);
      if (childMax >= best.makespan || start + tail[j] >= best.makespan) continue;
      end[j] = e;
      dry[j] = d;
      order.push(j);
      visit(mask | bit, placeOnBestFit(free, ready, e), childMax);
      order.pop();
    }
  };
  visit(0, new Array<number>(m).fill(0), 0);
  return best;
}

/** For each step, the bit mask of every step it needs directly or through others. */
function ancestorMasks(pb: SolverProblem): number[] {
  const masks = new Array<number>(pb.n).fill(0);
  for (const j of pb.topo) for (const i of pb.preds[j]) masks[j] |= masks[i] | (1 << i);
  return masks;
}

/** Rounds a bound up to whole minutes, valid when every time is whole; tolerates float noise. */
function ceilish(x: number): number {
  return Math.ceil(x - 1e-9);
}
