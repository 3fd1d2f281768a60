/**
 * Every schedule of a small crew problem, by plain enumeration, written apart from the engine
 * (no shared code but the types): each job in order, every crew of 1 … wanted people who cover
 * the room and can start it, the start found by stepping minute by minute. Used to prove the
 * engine's optimum on small instances; exponential, so only for those.
 */
import type { CrewJob, CrewProblem } from '../crew-problem';

const MIN = 60_000;

export interface BruteSchedule {
  /** Per job: crew and start (NaN when nobody could do it). */
  crews: { crew: number[]; startMs: number }[];
  /** Per job: required minutes (waiting included; the unstaffed rule for nobody). */
  required: number[];
  /** [unstaffed, problems, shortBy, requiredSum, ...required]. */
  key: number[];
}

interface Where {
  free: number;
  room: number | null;
}

/** Whole minutes: the instances the tests build are on whole minutes, so stepping by one is exact. */
function startOf(problem: CrewProblem, job: CrewJob, crew: readonly number[], where: readonly Where[]): number {
  const busy = job.busyMinutes[crew.length]! * MIN;
  let t = job.fromMs;
  for (const p of crew) {
    const w = where[p]!;
    if (w.room !== null) t = Math.max(t, w.free + (w.room === job.roomId ? 0 : problem.walkMs));
  }
  const lastEnd = Math.max(...crew.map((p) => problem.people[p]!.endMs));
  for (; t + busy <= lastEnd; t += MIN) {
    const ok = crew.every((p) => {
      const person = problem.people[p]!;
      if (t < person.startMs || t + busy > person.endMs) return false;
      return person.breaks.every((b) => t + busy <= b.startMs || t >= b.endMs);
    });
    if (ok) return t;
  }
  return Infinity;
}

function subsets(items: readonly number[], maxSize: number): number[][] {
  const out: number[][] = [];
  const walk = (from: number, current: number[]): void => {
    if (current.length > 0) out.push([...current]);
    if (current.length === maxSize) return;
    for (let i = from; i < items.length; i++) walk(i + 1, [...current, items[i]!]);
  };
  walk(0, []);
  return out;
}

function lexLess(a: readonly number[], b: readonly number[]): boolean {
  for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) return a[i]! < b[i]!;
  return false;
}

/**
 * The best schedule by the stated order, and how many complete schedules there were.
 *
 * @example
 * bruteForceCrews(problem).best.key[1]; // fewest problem gaps possible
 */
export function bruteForceCrews(problem: CrewProblem): { best: BruteSchedule; schedules: number } {
  let best: BruteSchedule | null = null;
  let schedules = 0;
  const crews: { crew: number[]; startMs: number }[] = [];
  const required: number[] = [];
  const unstaffed: number[] = [];
  const walk = (j: number, where: Where[]): void => {
    if (j === problem.jobs.length) {
      schedules++;
      let problems = 0;
      let shortBy = 0;
      problem.jobs.forEach((job, i) => {
        if (required[i]! > job.availableMinutes) problems++;
        shortBy += Math.max(0, required[i]! - job.availableMinutes);
      });
      const key = [unstaffed.reduce((a, b) => a + b, 0), problems, shortBy, required.reduce((a, b) => a + b, 0), ...required];
      if (!best || lexLess(key, best.key)) best = { crews: crews.map((c) => ({ crew: [...c.crew], startMs: c.startMs })), required: [...required], key };
      return;
    }
    const job = problem.jobs[j]!;
    const covering = problem.people.flatMap((person, p) => (person.roomIds.includes(job.roomId) ? [p] : []));
    let any = false;
    for (const crew of subsets(covering, job.wanted)) {
      const start = startOf(problem, job, crew, where);
      if (start === Infinity) continue;
      any = true;
      const next = where.map((w) => ({ ...w }));
      for (const p of crew) next[p] = { free: start + job.busyMinutes[crew.length]! * MIN, room: job.roomId };
      crews.push({ crew, startMs: start });
      required.push(Math.round((start - job.fromMs) / MIN) + job.requiredMinutes[crew.length]!);
      unstaffed.push(0);
      walk(j + 1, next);
      crews.pop();
      required.pop();
      unstaffed.pop();
    }
    if (!any) {
      crews.push({ crew: [], startMs: NaN });
      required.push(Math.max(job.availableMinutes, 0) + job.requiredMinutes[job.wanted]!);
      unstaffed.push(1);
      walk(j + 1, where);
      crews.pop();
      required.pop();
      unstaffed.pop();
    }
  };
  walk(0, problem.people.map(() => ({ free: -Infinity, room: null })));
  return { best: best!, schedules };
}
