import type { DayPlanPerson } from '../turnover/day-plan-input';
import type { GapPeopleReason } from '../turnover/day-plan-types';
import type { TurnoverPlan } from '../turnover/model';
import { assignCrews, type AssignCrewsOptions, type CrewChoice } from './assign-crews';
import { arrivalAt, MINUTE, personFit, type CrewJob, type CrewPerson, type CrewProblem, type PersonState } from './crew-problem';

/** A gap of a room the roster covers, as the day plan hands it over. */
export interface RosterGapInput {
  roomId: number;
  /** The room's place in the plan (breaks ties between rooms free at the same time). */
  roomOrder: number;
  toExamId: number;
  /** When the room is free (the leaving exam's end, or the opening) and the arriving exam's start. */
  fromMs: number;
  toMs: number;
  availableMinutes: number;
  /** The room's staff or the gap's override. */
  wanted: number;
  /** The solved turnover with k people (1 … wanted). */
  turnover: (k: number) => TurnoverPlan;
}

/** A reason with its time still an instant (the day plan formats it). */
export type PeopleReasonAt = Omit<GapPeopleReason, 'until'> & { untilMs: number | null };

export interface RosterGapResult {
  /** Person ids; empty when nobody could do it. */
  crew: string[];
  /** When the crew starts; for a gap nobody can do, the arriving exam's start (or the free time if later). */
  startMs: number;
  /** The turnover as worked (with the crew's size; the room's wanted size when nobody). */
  turnover: TurnoverPlan;
  /** Minutes waited (rounded up) + the turnover's required minutes. */
  requiredMinutes: number;
  unstaffed: boolean;
  reason: PeopleReasonAt | null;
}

export interface PersonWorkAt {
  roomId: number;
  toExamId: number;
  startMs: number;
  endMs: number;
}

export interface StaffGapsResult {
  /** Per gap, in the order given. */
  gaps: RosterGapResult[];
  /** Per person id: their hands-on work in time order. */
  work: Map<string, PersonWorkAt[]>;
  provenOptimal: boolean;
}

/**
 * Staffs the gaps of the rooms a roster covers from its people (see {@link assignCrews} for the
 * order the day is optimal by) and says, per gap, who works it and why it waited or ran short-handed.
 *
 * @param wallTime the plan date's `HH:MM` as an instant (daylight saving counted)
 * @example
 * const { gaps } = staffGaps(inputs, roster.people, roster.walkingMinutes, wallTime);
 * gaps[3].reason; // { kind: 'busy', personId: 'r2-1', roomId: 2, untilMs: …, wanted: 1, got: 1, waitedMinutes: 6 }
 */
export function staffGaps(
  inputs: readonly RosterGapInput[],
  people: readonly DayPlanPerson[],
  walkingMinutes: number,
  wallTime: (hhmm: string) => number,
  options?: AssignCrewsOptions,
): StaffGapsResult {
  const order = inputs.map((_, i) => i).sort((a, b) => {
    const x = inputs[a]!;
    const y = inputs[b]!;
    return x.fromMs - y.fromMs || x.roomOrder - y.roomOrder || x.toExamId - y.toExamId;
  });
  const jobs: CrewJob[] = order.map((i) => toJob(inputs[i]!));
  const crewPeople: CrewPerson[] = people.map((person) => ({
    startMs: wallTime(person.start),
    endMs: wallTime(person.end),
    breaks: person.breaks.map((b) => ({ startMs: wallTime(b.start), endMs: wallTime(b.end) })).sort((a, b) => a.startMs - b.startMs),
    roomIds: person.roomIds,
  }));
  const problem: CrewProblem = { jobs, people: crewPeople, walkMs: walkingMinutes * MINUTE };
  const assignment = assignCrews(problem, options);

  const work = new Map<string, PersonWorkAt[]>(people.map((p) => [p.id, []]));
  const states = crewPeople.map((): PersonState => ({ freeMs: -Infinity, roomId: null }));
  const before: PersonState[][] = [];
  assignment.choices.forEach((choice, j) => {
    before.push(states.map((s) => ({ ...s })));
    const job = jobs[j]!;
    const endMs = choice.startMs + job.busyMinutes[choice.crew.length]! * MINUTE;
    for (const p of choice.crew) {
      states[p] = { freeMs: endMs, roomId: job.roomId };
      work.get(people[p]!.id)!.push({ roomId: job.roomId, toExamId: inputs[order[j]!]!.toExamId, startMs: choice.startMs, endMs });
    }
  });

  const gaps: RosterGapResult[] = new Array(inputs.length);
  assignment.choices.forEach((choice, j) => {
    const input = inputs[order[j]!]!;
    const job = jobs[j]!;
    const unstaffed = choice.crew.length === 0;
    const k = unstaffed ? job.wanted : choice.crew.length;
    gaps[order[j]!] = {
      crew: choice.crew.map((p) => people[p]!.id),
      startMs: unstaffed ? job.fromMs + Math.max(job.availableMinutes, 0) * MINUTE : choice.startMs,
      turnover: input.turnover(k),
      requiredMinutes: choice.outcome.required,
      unstaffed,
      reason: reasonFor(problem, people, job, choice, before[j]!, work),
    };
  });
  return { gaps, work, provenOptimal: assignment.provenOptimal };
}

function toJob(input: RosterGapInput): CrewJob {
  const requiredMinutes = [0];
  const busyMinutes = [0];
  for (let k = 1; k <= input.wanted; k++) {
    const turnover = input.turnover(k);
    requiredMinutes.push(turnover.requiredMinutes);
    busyMinutes.push(turnover.steps.reduce((end, step) => Math.max(end, step.end), 0));
  }
  return { fromMs: input.fromMs, toMs: input.toMs, roomId: input.roomId, availableMinutes: input.availableMinutes, wanted: input.wanted, requiredMinutes, busyMinutes };
}

/**
 * Why a crew started late or is smaller than wanted: the member who arrived last and what held
 * them (a shift not started, a break, work in another room); else, for a crew short of people,
 * the first other person covering the room and where they are when the room is free (busy, on a
 * break, off shift, or kept for another room's turnover). Null when the crew is whole and on time.
 */
function reasonFor(
  problem: CrewProblem,
  people: readonly DayPlanPerson[],
  job: CrewJob,
  choice: CrewChoice,
  states: readonly PersonState[],
  work: ReadonlyMap<string, readonly PersonWorkAt[]>,
): PeopleReasonAt | null {
  const got = choice.crew.length;
  const base = { wanted: job.wanted, got, waitedMinutes: 0 };
  if (got === 0) return { kind: 'nobody', personId: null, roomId: null, untilMs: null, ...base };
  const waitedMinutes = Math.ceil((choice.startMs - job.fromMs) / MINUTE - 1e-9);
  const busy = job.busyMinutes[got]! * MINUTE;
  if (waitedMinutes > 0) {
    let latest = choice.crew[0]!;
    let latestAt = -Infinity;
    for (const p of choice.crew) {
      const at = personFit(problem.people[p]!, Math.max(job.fromMs, arrivalAt(states[p]!, job.roomId, problem.walkMs)), busy);
      if (at > latestAt) [latest, latestAt] = [p, at];
    }
    const person = problem.people[latest]!;
    const arrival = arrivalAt(states[latest]!, job.roomId, problem.walkMs);
    const id = people[latest]!.id;
    if (arrival > job.fromMs && states[latest]!.roomId !== null && states[latest]!.roomId !== job.roomId) {
      return { kind: 'busy', personId: id, roomId: states[latest]!.roomId, untilMs: states[latest]!.freeMs, ...base, waitedMinutes };
    }
    if (person.startMs > job.fromMs) return { kind: 'off-shift', personId: id, roomId: null, untilMs: person.startMs, ...base, waitedMinutes };
    const inBreak = person.breaks.find((b) => b.endMs <= choice.startMs && b.endMs > job.fromMs);
    if (inBreak) return { kind: 'break', personId: id, roomId: null, untilMs: inBreak.endMs, ...base, waitedMinutes };
    return { kind: 'busy', personId: id, roomId: states[latest]!.roomId, untilMs: states[latest]!.freeMs, ...base, waitedMinutes };
  }
  if (got >= job.wanted) return null;
  const others = problem.people.flatMap((person, p) => (person.roomIds.includes(job.roomId) && !choice.crew.includes(p) ? [p] : []));
  if (others.length === 0) return { kind: 'nobody', personId: null, roomId: null, untilMs: null, ...base };
  for (const p of others) {
    const person = problem.people[p]!;
    const id = people[p]!.id;
    const t = job.fromMs;
    const working = work.get(id)!.find((w) => w.startMs <= t + busy && w.endMs > t);
    if (working) return { kind: 'busy', personId: id, roomId: working.roomId, untilMs: working.endMs, ...base };
    if (t < person.startMs || t >= person.endMs) return { kind: 'off-shift', personId: id, roomId: null, untilMs: t < person.startMs ? person.startMs : null, ...base };
    const inBreak = person.breaks.find((b) => t < b.endMs && t + busy > b.startMs);
    if (inBreak) return { kind: 'break', personId: id, roomId: null, untilMs: inBreak.endMs, ...base };
    const next = work.get(id)!.find((w) => w.startMs >= t);
    if (next) return { kind: 'busy', personId: id, roomId: next.roomId, untilMs: next.endMs, ...base };
  }
  // Others were free but a smaller crew was as good: nothing was lost for want of people.
  return null;
}
