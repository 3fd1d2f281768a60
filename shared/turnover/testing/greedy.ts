import type { SolverStep } from '../model';

/**
 * The naive rule a person might follow — "start the step with the longest wait first" (ties in
 * protocol order), each step as early as possible. Kept only to show the solver beats it.
 *
 * @example
 * longestWaitFirstMakespan(entericSteps, 1); // 25, where the solver finds 24
 */
export function longestWaitFirstMakespan(steps: readonly SolverStep[], staff: number): number {
  const end = new Map<string, number>();
  const dry = new Map<string, number>();
  const free = new Array<number>(staff).fill(0);
  let makespan = 0;
  while (end.size < steps.length) {
    const eligible = steps.filter((s) => !end.has(s.key) && s.needs.every((n) => end.has(n.key)));
    const next = eligible.reduce((a, b) => (b.waitMinutes > a.waitMinutes ? b : a));
    const ready = Math.max(0, ...next.needs.map((n) => (n.dry ? dry.get(n.key)! : end.get(n.key)!)));
    const person = free.indexOf(Math.min(...free));
    const start = Math.max(ready, free[person]);
    end.set(next.key, start + next.handsOnMinutes);
    dry.set(next.key, start + next.handsOnMinutes + next.waitMinutes);
    free[person] = start + next.handsOnMinutes;
    makespan = Math.max(makespan, dry.get(next.key)!);
  }
  return makespan;
}
