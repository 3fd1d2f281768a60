import { withChanges } from '../fixes/apply-changes';
import { computeDayPlan } from '../turnover/day-plan';
import type { DayPlanInput } from '../turnover/day-plan-input';
import type { DayPlan } from '../turnover/day-plan-types';
import { wallTimeToMillis } from '../turnover/zoned-time';
import type { ClusterItem, ClusterSolution } from './cluster-model';
import { wholeGroup } from './clusters';
import { fitProposal } from './fit-proposal';
import { fitDay, type FitDay, type FitGroup, type FitRoom } from './instance';
import type { DayFitOptions, DayFitProposal, MipSolve } from './model';
import { remainingWithPeople } from './roster-judge';
import { rosterModel, type ModelPerson } from './roster-model';
import { solveLevels } from './solve-levels';
import type { SolveTally } from './solver-report';

/** Exams a part of the day may have for the exact roster model (its big-M rows grow with pairs of exams and people). */
export const ROSTER_EXACT_LIMIT = 8;

/** A part of the day that shares no person with the rest: its modality groups and the people who cover them. */
interface RosterPart {
  rooms: FitRoom[];
  items: ClusterItem[];
  people: ModelPerson[];
}

/**
 * "Make the day fit" on a small roster day, exactly: each part of the day with a gap the roster
 * finds short (modality groups joined by the people who cover rooms in both) is solved whole with
 * the roster model (`rosterModel`: crews, shifts, breaks and walking are variables and rows of
 * the MIP), so the proposal is the optimum judged with the roster's crews. Null when the day is
 * not small enough (a part over {@link ROSTER_EXACT_LIMIT} exams), when someone on the roster
 * covers a room with exams the model leaves out (closed, or without a protocol), or when a part's
 * solve finds no point: the caller then plans in rounds. A room nobody on the roster covers keeps
 * its own staff, as in the day plan.
 *
 * @example
 * proposeExactWithRoster(input, highsSolve, {}, computeDayPlan(input), Date.now() + 8_000)?.solver.roster; // 'exact'
 */
export function proposeExactWithRoster(input: DayPlanInput, solve: MipSolve, options: DayFitOptions, beforePlan: DayPlan, deadline: number): DayFitProposal | null {
  const now = options.now ?? Date.now;
  const started = now();
  const day = fitDay(input, options);
  const problems = new Set(beforePlan.rooms.flatMap((room) => room.gaps.filter((g) => g.verdict === 'short' || g.verdict === 'overlap').map((g) => g.toExamId)));
  const parts = rosterParts(day, problems, options.rosterExactLimit ?? ROSTER_EXACT_LIMIT);
  if (!parts) return null;
  const tally: SolveTally = { solves: 0, clusters: 0, mipGap: 0, timeLimited: false, neighbourhood: false };
  const places: ClusterSolution['places'] = new Map();
  const helpers: ClusterSolution['helpers'] = new Map();
  const roomOrder = new Map(input.rooms.map((room, i) => [room.id, i]));
  for (const [index, part] of parts.entries()) {
    tally.clusters++;
    const model = rosterModel(day, part.rooms, part.items, part.people, {
      grid: options.gridMinutes ?? 1,
      walkingMinutes: input.roster!.walkingMinutes,
      roomOrder,
      roomCount: input.rooms.length,
      helpers: options.helpersFromRoster ?? true,
    });
    const solved = solveLevels(model, solve, tally, now() + (deadline - now()) / (parts.length - index), now);
    // No point in time (or every arrangement leaves a turnover its people cannot reach in their
    // shifts, which the model does not write): the rounds plan the day instead.
    if (!solved) return null;
    for (const [id, place] of solved.solution.places) places.set(id, place);
    for (const [id, helper] of solved.solution.helpers) helpers.set(id, helper);
  }
  const nothingToDo = problems.size === 0;
  const proposal = fitProposal(day, places, helpers, beforePlan.summary, tally, now() - started, nothingToDo);
  const plan = computeDayPlan(withChanges(input, proposal.changes));
  const stays = new Map(Object.entries(options.fixed ?? {}).map(([id, why]) => [Number(id), why]));
  const remaining = remainingWithPeople(input, plan, proposal.remaining, stays, 'short with the roster’s crews however the day is arranged');
  return {
    ...proposal,
    remaining,
    objective: { ...proposal.objective, gapsLeft: remaining.length },
    after: plan.summary,
    solver: { ...proposal.solver, roster: 'exact' },
  };
}

/** The parts of the day with a problem gap; null when one is too large or the roster reaches past the model. */
function rosterParts(day: FitDay, problems: ReadonlySet<number>, limit: number): RosterPart[] | null {
  const { input } = day;
  const roster = input.roster!;
  const groupOf = new Map<number, FitGroup>();
  for (const group of day.groups) for (const r of group.rooms) groupOf.set(r.room.id, group);
  // A covered room with exams the model does not see (closed, no protocol) would hold people it cannot count.
  const withExams = new Set(input.exams.map((e) => e.roomId));
  if (roster.people.some((p) => p.roomIds.some((id) => withExams.has(id) && !groupOf.has(id)))) return null;
  // Groups joined by the people who cover rooms in more than one.
  const parent = new Map(day.groups.map((g) => [g, g]));
  const find = (g: FitGroup): FitGroup => (parent.get(g) === g ? g : find(parent.get(g)!));
  for (const person of roster.people) {
    const groups = person.roomIds.map((id) => groupOf.get(id)).filter((g): g is FitGroup => g !== undefined);
    for (const g of groups.slice(1)) parent.set(find(g), find(groups[0]!));
  }
  const minute = (hhmm: string) => Math.round((wallTimeToMillis(input.date, hhmm, input.timezone) - day.midnightMs) / 60_000);
  const parts: RosterPart[] = [];
  for (const root of new Set(day.groups.map(find))) {
    const groups = day.groups.filter((g) => find(g) === root);
    if (!groups.some((g) => g.exams.some((fe) => problems.has(fe.exam.id)))) continue;
    const rooms = groups.flatMap((g) => g.rooms);
    const people = roster.people.filter((p) => rooms.some((r) => p.roomIds.includes(r.room.id)));
    if (groups.reduce((n, g) => n + g.exams.length, 0) > limit) return null;
    parts.push({
      rooms,
      items: groups.flatMap((g) => wholeGroup(g)[0]!),
      people: people.map((p) => ({ id: p.id, label: p.label, start: minute(p.start), end: minute(p.end), breaks: p.breaks.map((b) => ({ start: minute(b.start), end: minute(b.end) })), roomIds: p.roomIds })),
    });
  }
  return parts;
}
