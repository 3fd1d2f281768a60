import type { SolverStep } from '../model';

/**
 * Test oracle, deliberately independent of the solver's method: a yes/no search for a schedule
 * that is done (every end and dry-at) by `deadline`. It tries every precedence-feasible order
 * AND every person for each step (not only the earliest-free one, as the solver does), each step
 * starting as early as that person and its needs allow.
 *
 * Why that is exhaustive: list any feasible schedule's steps by start time and replay them on
 * the same persons here; by induction each step starts no later than it did there, so if any
 * schedule meets the deadline, some branch does. Branches are cut only when a step, or a pending
 * step's release, plus the least time still needed after it (its chain of hands-on and waits)
 * passes the deadline, or when the hands-on minutes left exceed the persons' time left before
it — each a proof that no completion can make it. Persons with equal free times
 * are interchangeable, so only one of them is tried, and failed states (steps done, sorted free
 * times, each pending step's release) are remembered: everything after depends only on them.
 *
 * @example
 * feasibleWithin(steps, 1, 19); // false: the default MR turnover needs 20 minutes alone
 */
export function feasibleWithin(steps: readonly SolverStep[], staff: number, deadline: number): boolean {
  const n = steps.length;
  const index = new Map(steps.map((s, i) => [s.key, i]));
  const needs = steps.map((s) => s.needs.map((need) => ({ i: index.get(need.key)!, dry: need.dry })));
  const tail = chainAfterStart(steps, needs);
  const end = new Array<number>(n).fill(0);
  const dry = new Array<number>(n).fill(0);
  const failed = new Set<string>();

  const released = (j: number, done: number): number =>
    needs[j].reduce((t, need) => (done & (1 << need.i) ? Math.max(t, need.dry ? dry[need.i] : end[need.i]) : t), 0);

  const search = (done: number, free: number[]): boolean => {
    if (done === (1 << n) - 1) return true;
    const releases: number[] = [];
    let work = 0;
    for (let j = 0; j < n; j++) {
      if (done & (1 << j)) continue;
      const r = released(j, done);
      if (r + tail[j] > deadline) return false;
      releases.push(r);
      work += steps[j].handsOnMinutes;
    }
    if (work > free.reduce((room, f) => room + Math.max(0, deadline - f), 0)) return false;
    const key = `${done}|${[...free].sort((a, b) => a - b).join(',')}|${releases.join(',')}`;
    if (failed.has(key)) return false;
    for (let j = 0; j < n; j++) {
      if (done & (1 << j) || !needs[j].every((need) => done & (1 << need.i))) continue;
      const ready = released(j, done);
      for (let q = 0; q < staff; q++) {
        if (free.indexOf(free[q]) < q) continue;
        const start = Math.max(ready, free[q]);
        if (start + tail[j] > deadline) continue;
        end[j] = start + steps[j].handsOnMinutes;
        dry[j] = end[j] + steps[j].waitMinutes;
        const after = free.slice();
        after[q] = end[j];
        if (search(done | (1 << j), after)) return true;
      }
    }
    failed.add(key);
    return false;
  };
  return search(0, new Array<number>(staff).fill(0));
}

/**
 * The least whole-minute deadline {@link feasibleWithin} can meet (data in whole minutes).
 *
 * @example
 * exhaustiveMakespan(steps, 2); // 14 for the default MR turnover with two people
 */
export function exhaustiveMakespan(steps: readonly SolverStep[], staff: number): number {
  let deadline = 0;
  while (!feasibleWithin(steps, staff, deadline)) deadline++;
  return deadline;
}

/** For each step, the least time from its start until it and everything needing it is done and dry. */
function chainAfterStart(steps: readonly SolverStep[], needs: { i: number; dry: boolean }[][]): number[] {
  const memo = new Map<number, number>();
  const of = (i: number): number => {
    const known = memo.get(i);
    if (known !== undefined) return known;
    let after = steps[i].waitMinutes;
    needs.forEach((list, j) => {
      for (const need of list) if (need.i === i) after = Math.max(after, (need.dry ? steps[i].waitMinutes : 0) + of(j));
    });
    memo.set(i, steps[i].handsOnMinutes + after);
    return steps[i].handsOnMinutes + after;
  };
  return steps.map((_, i) => of(i));
}
