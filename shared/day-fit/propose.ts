import type { PlanChange } from '../api/changes';
import { withChanges } from '../fixes/apply-changes';
import { fixDay } from '../fixes/fix-day';
import { isProblemVerdict } from '../fixes/room-gaps';
import { wallTimeToMillis } from '../turnover/zoned-time';
import type { DayPlanInput } from '../turnover/day-plan-input';
import { clusterModel, type ClusterItem, type ClusterSolution, type HelperSlot } from './cluster-model';
import { fixedItem, neighbourhoods, wholeGroup, type Reach } from './clusters';
import { fitProposal } from './fit-proposal';
import { fitDay, type FitDay, type FitExam, type FitGroup } from './instance';
import type { DayFitOptions, DayFitProposal, MipSolve } from './model';
import { proposeWithRoster } from './roster-fit';
import { solveLevels } from './solve-levels';
import type { SolveTally } from './solver-report';

/** Larger neighbourhoods tried in turn for a group too large to solve whole. */
const REACHES: readonly Reach[] = [
  { neighbours: 0, shiftMinutes: 30, roomsPerBlock: 1, maxFree: 6 },
  { neighbours: 0, shiftMinutes: 30, roomsPerBlock: 4, maxFree: 6 },
  { neighbours: 1, shiftMinutes: 90, roomsPerBlock: 4, maxFree: 8 },
  { neighbours: 3, shiftMinutes: 180, roomsPerBlock: 4, maxFree: 10 },
];

/** Longest one solve of a neighbourhood may take (a small cluster that needs longer is rarely worth it). */
const MAX_SOLVE_SECONDS = 2;

/**
 * The whole-day proposal: changes (start shifts within hours, moves to another open room of the
 * same modality, helpers from spare people, isolation cases anywhere including last) that leave
 * no `short` or `overlap` gap, minimising lexicographically the gaps left, exams moved, minutes
 * patients are moved, the day's end and helpers added — solved in turn (the last three as one
 * safely weighted objective), each optimum kept as a bound for the next. Fixed exams never move.
 * A day with a roster is planned with the roster's crews (`proposeWithRoster`).
 *
 * @throws RangeError on a bad date, zone or start (as the day plan does)
 * @example
 * const proposal = proposeDayFit(input, highsSolve, { fixed: { 12: 'arrived' } });
 * proposal.calls; // [{ accession: 'A-7', fromStart: '…T10:05…', toStart: '…T10:20…', … }]
 */
export function proposeDayFit(input: DayPlanInput, solve: MipSolve, options: DayFitOptions = {}): DayFitProposal {
  return input.roster ? proposeWithRoster(input, solve, options, proposeWithStaff) : proposeWithStaff(input, solve, options);
}

/** The proposal with each turnover planned by its room's staff (or the day's override): no roster. */
function proposeWithStaff(input: DayPlanInput, solve: MipSolve, options: DayFitOptions): DayFitProposal {
  const now = options.now ?? Date.now;
  const started = now();
  const deadline = started + (options.timeLimitMs ?? 8_000);
  const day = fitDay(input, options);
  const judgedBefore = fixDay(input);
  const problemInto = new Set<number>();
  for (const room of input.rooms) for (const gap of judgedBefore.judged(room.id).gaps) if (isProblemVerdict(gap.verdict)) problemInto.add(gap.toExamId);
  for (const id of options.problems ?? []) problemInto.add(id);
  const slots = helperSlots(input, options);
  const tally: SolveTally = { solves: 0, clusters: 0, mipGap: 0, timeLimited: false, neighbourhood: false };
  const places = new Map<number, { roomId: number; start: number }>();
  const helpers: ClusterSolution['helpers'] = new Map();
  const groups = day.groups.filter((g) => g.exams.some((fe) => problemInto.has(fe.exam.id)));
  // Each group's share of the time left follows its share of the problem gaps left to solve.
  const problemsOf = (group: FitGroup) => group.exams.filter((fe) => problemInto.has(fe.exam.id)).length;
  let problemsLeft = groups.reduce((n, g) => n + problemsOf(g), 0);
  groups.forEach((group) => {
    const budgetMs = ((deadline - now()) * problemsOf(group)) / Math.max(1, problemsLeft);
    problemsLeft -= problemsOf(group);
    const solution = solveGroup(day, group, problemInto, slots, options, tally, now() + Math.max(200, budgetMs), solve);
    for (const [id, place] of solution.places) places.set(id, place);
    for (const [id, slot] of solution.helpers) helpers.set(id, slot);
  });
  return fitProposal(day, places, helpers, judgedBefore.summary, tally, now() - started, problemInto.size === 0);
}

function solveGroup(
  day: FitDay,
  group: FitGroup,
  problemInto: ReadonlySet<number>,
  slots: readonly HelperSlot[],
  options: DayFitOptions,
  tally: SolveTally,
  deadline: number,
  mip: MipSolve,
): ClusterSolution {
  const now = options.now ?? Date.now;
  const result: ClusterSolution = { places: new Map(), helpers: new Map() };
  const crewFrom = new Map(
    Object.entries(options.crewFrom ?? {}).map(([id, rooms]) => [Number(id), new Map(Object.entries(rooms).map(([roomId, ms]) => [Number(roomId), Math.ceil((ms - day.midnightMs) / 60_000)]))]),
  );
  const model = (items: ClusterItem[], helpersFor?: ReadonlySet<number>) =>
    clusterModel(day, group.rooms, items, slots, { grid: options.gridMinutes ?? 1, walkingMinutes: options.walkingMinutes ?? 0, crewFrom, helpersFor });
  if (group.exams.length <= (options.wholeGroupLimit ?? 12)) {
    const [items] = wholeGroup(group);
    tally.clusters++;
    const solved = solveLevels(model(items!), mip, tally, deadline, now);
    return solved?.solution ?? result;
  }
  tally.neighbourhood = true;
  let seeds = new Set([...group.exams].filter((fe) => problemInto.has(fe.exam.id)).map((fe) => fe.exam.id));
  let view: FitGroup = group;
  const reaches = REACHES.slice(0, options.reaches ?? REACHES.length);
  for (let tier = 0; tier < reaches.length && seeds.size > 0; tier++) {
    const clusters = neighbourhoods(day, view, seeds, reaches[tier]!);
    const unresolved = new Set<number>();
    clusters.forEach((clusterItems, index) => {
      tally.clusters++;
      // Exams an earlier cluster placed are constants at their new places.
      const items = clusterItems.map((it) => {
        const place = it.free ? undefined : result.places.get(it.fe.exam.id);
        return place ? fixedItem({ ...it.fe, start: place.start, roomId: place.roomId, stays: 'proposed' }, group.rooms) : it;
      });
      const budget = (deadline - now()) / (clusters.length - index);
      const clusterSeeds = items.filter((it) => seeds.has(it.fe.exam.id)).map((it) => it.fe.exam.id);
      if (now() >= deadline) return;
      // A neighbourhood offers helpers only on its problem gaps: a binary per spare slot on every
      // exam made a roster day's solves several times slower for little gain.
      const solved = solveLevels(model(items, new Set(clusterSeeds)), mip, tally, now() + Math.max(100, budget), now, MAX_SOLVE_SECONDS);
      const last = tier === reaches.length - 1;
      if (!solved || (solved.gapsLeft > 0 && !last) || (solved.gapsLeft > 0 && !better(day, group, result.places, solved.solution))) {
        if (!last) for (const id of clusterSeeds) unresolved.add(id);
        return;
      }
      for (const [id, place] of solved.solution.places) result.places.set(id, place);
      for (const [id, slot] of solved.solution.helpers) result.helpers.set(id, slot);
    });
    // Exams already placed stay at their new places for the next, wider, try.
    view = { ...group, exams: group.exams.map((fe): FitExam => {
      const place = result.places.get(fe.exam.id);
      return place ? { ...fe, start: place.start, roomId: place.roomId, stays: 'proposed' } : fe;
    }) };
    seeds = unresolved;
  }
  return result;
}

function helperSlots(input: DayPlanInput, options: DayFitOptions): HelperSlot[] {
  const midnight = wallTimeToMillis(input.date, '00:00', input.timezone);
  const minute = (hhmm: string) => Math.round((wallTimeToMillis(input.date, hhmm, input.timezone) - midnight) / 60_000);
  return (options.helpers ?? []).flatMap((helper) => helper.free.map((f) => ({ helper, from: minute(f.start), to: minute(f.end) })));
}

/**
 * A cluster that cannot clear every gap is kept only when the engine counts fewer problem gaps
 * in the group's rooms with it than without it, and no more minutes short in all (its "gap
 * left" relaxation says nothing of the gaps it would make: an exam whose gap is left may sit
 * deep in an overlap).
 */
function better(day: FitDay, group: FitGroup, placed: ReadonlyMap<number, { roomId: number; start: number }>, solution: ClusterSolution): boolean {
  const movesOf = (places: ReadonlyMap<number, { roomId: number; start: number }>): PlanChange[] =>
    [...places].map(([examId, to]) => {
      const exam = day.input.exams.find((e) => e.id === examId)!;
      return { type: 'move', examId, accession: exam.accession, from: { roomId: exam.roomId, start: exam.start }, to: { roomId: to.roomId, start: day.toIso(to.start) } };
    });
  const roomIds = new Set(group.rooms.map((r) => r.room.id));
  const input = { ...day.input, rooms: day.input.rooms.filter((r) => roomIds.has(r.id)), exams: day.input.exams.filter((e) => roomIds.has(e.roomId)) };
  const problems = (places: ReadonlyMap<number, { roomId: number; start: number }>) => {
    const judged = fixDay(withChanges(input, movesOf(places)));
    const gaps = input.rooms.flatMap((r) => judged.judged(r.id).gaps.filter((g) => isProblemVerdict(g.verdict)));
    return { count: gaps.length, minutes: gaps.reduce((sum, g) => sum + g.shortByMinutes, 0) };
  };
  const [without, withIt] = [problems(placed), problems(new Map([...placed, ...solution.places]))];
  return withIt.count < without.count && withIt.minutes <= without.minutes;
}
