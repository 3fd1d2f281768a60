/**
 * The crew problem in plain numbers: turnovers ("jobs") with their time windows and the minutes
 * each crew size needs, and people with their shifts, breaks and rooms. Times are milliseconds
 * on one clock (the day plan uses real instants, so a daylight-saving day counts true time).
 *
 * The schedule a choice of crews gives (the semantics every search and test shares):
 * - jobs are taken in `order` (the room's free time, then the day plan's room order);
 * - a person takes their jobs in that order; after a job they walk to a different room
 *   (`walkMs`), none to the same room and none before their first job;
 * - a job's crew starts together at the earliest time ≥ the room's free time when every member
 *   has arrived and is on shift, off break, for the whole of the crew's hands-on time
 *   (`busyMinutes[k]`: the last hands-on end of the solved turnover for k people);
 * - the room is ready at start + `requiredMinutes[k]` (the turnover's required time for k
 *   people, air hold included): dry times and the air hold need nobody. The gap's required
 *   minutes are then the minutes waited (rounded up) + that; its verdict follows as ever.
 */

export const MINUTE = 60_000;

/** One turnover to staff. */
export interface CrewJob {
  /** When the room is free (the leaving exam's end, or the opening). */
  fromMs: number;
  /** The arriving exam's start. */
  toMs: number;
  roomId: number;
  /** Whole minutes from `fromMs` to `toMs`, as the verdict counts them (negative on overlap). */
  availableMinutes: number;
  /** People the turnover wants (the room's staff, or its override); at least 1. */
  wanted: number;
  /** Index k (1 … wanted): the turnover's required minutes with k people, air hold included; index 0 unused. */
  requiredMinutes: readonly number[];
  /** Index k: the crew's hands-on minutes with k people (what keeps them in the room). */
  busyMinutes: readonly number[];
}

export interface CrewPerson {
  startMs: number;
  endMs: number;
  /** Sorted, not overlapping, inside the shift. */
  breaks: readonly { startMs: number; endMs: number }[];
  roomIds: readonly number[];
}

export interface CrewProblem {
  jobs: readonly CrewJob[];
  people: readonly CrewPerson[];
  walkMs: number;
}

/** Where a person stands while a schedule is built: free from, and in which room (null: not yet worked). */
export interface PersonState {
  freeMs: number;
  roomId: number | null;
}

/**
 * The earliest time ≥ `fromMs` at which the person can work `busyMs` without a break and inside
 * their shift; Infinity when none is left that day.
 *
 * @example
 * // shift 07:00–15:00 (as minutes ×60 000), break 10:00–10:30, 20 minutes of work from 09:50:
 * personFit(person, 9 * 3.6e6 + 50 * 6e4, 20 * 6e4); // 10:30
 */
export function personFit(person: CrewPerson, fromMs: number, busyMs: number): number {
  let t = Math.max(fromMs, person.startMs);
  for (const b of person.breaks) {
    if (t < b.endMs && t + busyMs > b.startMs) t = b.endMs;
  }
  return t + busyMs <= person.endMs ? t : Infinity;
}

/**
 * When the person can be in `roomId`, from where they stand: free there, or free elsewhere plus
 * the walk; -Infinity before their first job (they start the shift wherever they are needed).
 *
 * @example
 * arrivalAt({ freeMs: t, roomId: 2 }, 1, 3 * 60_000); // t + 3 minutes
 */
export function arrivalAt(state: PersonState, roomId: number, walkMs: number): number {
  if (state.roomId === null) return -Infinity;
  return state.roomId === roomId ? state.freeMs : state.freeMs + walkMs;
}

/**
 * When a crew starts a job: the least time ≥ the room's free time and every member's arrival at
 * which all of them can work the crew's hands-on time (a fixpoint: one member's break can push
 * the start past another's). Infinity when no such time is left in their shifts.
 *
 * @example
 * crewStart(problem, job, [0, 2], states, 2); // the start for people 0 and 2 working as two
 */
export function crewStart(problem: CrewProblem, job: CrewJob, crew: readonly number[], states: readonly PersonState[], k: number): number {
  const busy = job.busyMinutes[k]! * MINUTE;
  let t = job.fromMs;
  for (const p of crew) t = Math.max(t, arrivalAt(states[p]!, job.roomId, problem.walkMs));
  for (;;) {
    let next = t;
    for (const p of crew) next = Math.max(next, personFit(problem.people[p]!, t, busy));
    if (next === Infinity || next === t) return next;
    t = next;
  }
}

/**
 * People who cover the job's room (in person order).
 *
 * @example
 * eligiblePeople(problem, problem.jobs[0]); // [0, 2]
 */
export function eligiblePeople(problem: CrewProblem, job: CrewJob): number[] {
  const out: number[] = [];
  problem.people.forEach((person, p) => {
    if (person.roomIds.includes(job.roomId)) out.push(p);
  });
  return out;
}
