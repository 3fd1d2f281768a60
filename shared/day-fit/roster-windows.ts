import type { PlanChange } from '../api/changes';
import { withChanges } from '../fixes/apply-changes';
import { computeDayPlan } from '../turnover/day-plan';
import type { DayPlanInput } from '../turnover/day-plan-input';
import type { DayPlan } from '../turnover/day-plan-types';
import { wallTimeToMillis } from '../turnover/zoned-time';
import type { ClusterItem, ClusterSolution } from './cluster-model';
import { fixedItem, freeItem } from './clusters';
import type { FitDay, FitExam, FitRoom } from './instance';
import type { DayFitOptions, MipSolve } from './model';
import { problemsOf } from './roster-judge';
import { rosterModel, type ModelPerson } from './roster-model';
import { solveLevels } from './solve-levels';
import type { SolveTally } from './solver-report';

/** Minutes before and after a problem exam's start that a window takes in. */
const BEFORE = 30;
const AFTER = 20;
/** Minutes a free exam of a window may move, and how many of them a window frees. */
const SHIFT = 30;
const MOST_FREE = 3;
/** Minutes after a window's last exam its crews must have started by (and their hands-on minutes fit in). */
const CREW_SLACK = 60;
/** Longest one window's solve may take. */
const MAX_SOLVE_SECONDS = 1;

/** Where every exam the proposal moves goes, and the crews it gives a turnover (minutes after midnight). */
export interface RosterArrangement {
  places: Map<number, { roomId: number; start: number }>;
  staffing: Map<number, number>;
}

/**
 * Improves a large roster day's proposal window by window with the exact roster model: around
 * each gap the roster still finds short, the exams of the rooms of its modality that share people
 * with its room, from 30 minutes before its start to 20 after, are the model (up to 3 of them
 * free to move 30 minutes, in their own room, then on a second pass also to another of those
 * rooms; the rest constants, with the exam just before the window ending where its next turnover
 * starts), and the people's work elsewhere, as the roster plans it
 * now, holds them like a break (widened by the walk). A window's answer is kept only when the
 * roster's judgement of the whole day with it finds fewer problem gaps and no more minutes short:
 * never worse, not proven the best. Answers the arrangement, its plan and how many windows were kept.
 *
 * @example
 * improveInWindows(day, arrangement, plan, highsSolve, options, deadline, tally).plan.summary.short; // fewer than before
 */
export function improveInWindows(
  day: FitDay,
  start: RosterArrangement,
  startPlan: DayPlan,
  solve: MipSolve,
  options: DayFitOptions,
  deadline: number,
  tally: SolveTally,
): { arrangement: RosterArrangement; plan: DayPlan; kept: number } {
  const now = options.now ?? Date.now;
  const { input } = day;
  const roster = input.roster!;
  let arrangement = start;
  let plan = startPlan;
  const roomOrder = new Map(input.rooms.map((room, i) => [room.id, i]));
  const groupRooms = new Map<number, FitRoom[]>();
  for (const group of day.groups) for (const r of group.rooms) groupRooms.set(r.room.id, group.rooms);
  const original = new Map(day.groups.flatMap((g) => g.exams).map((fe) => [fe.exam.id, fe]));
  const minute = (iso: string) => day.minuteOf(iso);
  const tried = new Set<string>();
  let kept = 0;
  for (;;) {
    // Each gap first with its exams in their own room, then free to go to another room of the window.
    const left = problemsOf(plan);
    const tier = left.some((id) => !tried.has(`0|${id}`)) ? 0 : 1;
    const next = left.find((id) => !tried.has(`${tier}|${id}`));
    if (next === undefined || now() >= deadline) break;
    tried.add(`${tier}|${next}`);
    const window = windowAround(next, tier === 1);
    if (!window) continue;
    tally.clusters++;
    tally.neighbourhood = true;
    const model = rosterModel(day, window.rooms, window.items, window.people, {
      grid: options.gridMinutes ?? 1,
      walkingMinutes: roster.walkingMinutes,
      roomOrder,
      roomCount: input.rooms.length,
      helpers: options.helpersFromRoster ?? true,
      noJob: window.noJob,
      crewBy: window.crewBy,
    });
    const solved = solveLevels(model, solve, tally, Math.min(deadline, now() + MAX_SOLVE_SECONDS * 1000), now, MAX_SOLVE_SECONDS);
    if (!solved) continue;
    const places = new Map(arrangement.places);
    const staffing = new Map(arrangement.staffing);
    for (const [id, place] of solved.solution.places) places.set(id, place);
    // The window's crews: a helper where it took one, the room's staff where it took none.
    for (const it of window.items) staffing.delete(it.fe.exam.id);
    for (const id of solved.solution.helpers.keys()) {
      const exam = original.get(id)!.exam;
      const room = input.rooms.find((r) => r.id === (places.get(id)?.roomId ?? exam.roomId))!;
      staffing.set(id, day.helperStaff(room, exam)!);
    }
    const candidate = { places, staffing };
    const judged = computeDayPlan(withChanges(input, changesOf(day, candidate)));
    const [was, is] = [plan.summary, judged.summary];
    if (is.short + is.overlap < was.short + was.overlap && is.minutesShort <= was.minutesShort) {
      arrangement = candidate;
      plan = judged;
      kept++;
    }
  }
  return { arrangement, plan, kept };

  function windowAround(examId: number, otherRooms: boolean): { rooms: FitRoom[]; items: ClusterItem[]; people: ModelPerson[]; noJob: Set<number>; crewBy: number } | null {
    const fe = original.get(examId);
    if (!fe) return null;
    const here = placeOf(fe);
    const sameModality = groupRooms.get(here.roomId);
    if (!sameModality) return null;
    // The rooms its people also cover, of its modality (where its exams may go).
    const people = roster.people.filter((p) => p.roomIds.includes(here.roomId));
    const rooms = sameModality.filter((r) => r.room.id === here.roomId || people.some((p) => p.roomIds.includes(r.room.id)));
    const from = here.start - BEFORE;
    const to = here.start + AFTER;
    const items: ClusterItem[] = [];
    const noJob = new Set<number>();
    const inWindow: FitExam[] = [];
    for (const r of rooms) {
      const list = [...original.values()].filter((x) => placeOf(x).roomId === r.room.id).sort((a, b) => placeOf(a).start - placeOf(b).start || a.exam.id - b.exam.id);
      const before = list.filter((x) => placeOf(x).start < from).at(-1);
      const after = list.find((x) => placeOf(x).start > to);
      // The exam just before the window ends where the window's first turnover starts; the one
      // just after it has its turnover from the window's last exam.
      if (before) {
        noJob.add(items.length);
        items.push(fixedItem(atPlace(before), rooms));
      }
      if (after) items.push(fixedItem(atPlace(after), rooms));
      for (const x of list) if (placeOf(x).start >= from && placeOf(x).start <= to) inWindow.push(x);
    }
    // Free: the problem exam and its nearest neighbours that may move, the rest constants.
    const movable = inWindow
      .filter((x) => x.stays === null)
      .sort((a, b) => Math.abs(placeOf(a).start - here.start) - Math.abs(placeOf(b).start - here.start) || (placeOf(a).roomId === here.roomId ? -1 : 1));
    const free = new Set(movable.slice(0, MOST_FREE).map((x) => x.exam.id));
    for (const x of inWindow) {
      if (!free.has(x.exam.id)) {
        items.push(fixedItem(atPlace(x), rooms));
        continue;
      }
      const at = placeOf(x);
      const it = freeItem(x, otherRooms ? rooms : rooms.filter((r) => r.room.id === at.roomId), Math.max(from, at.start - SHIFT), Math.min(to, at.start + SHIFT));
      items.push(it.rooms.length > 0 ? it : fixedItem(atPlace(x), rooms));
    }
    if (!items.some((it) => it.free)) return null;
    const jobs = new Set(items.filter((_, k) => !noJob.has(k)).map((it) => it.fe.exam.id));
    // Everyone who covers a room of the window, held elsewhere by the work the roster gives them
    // now. A crew starts no earlier than the window's first exam ends and, here, no later than
    // CREW_SLACK minutes after its last one: breaks and work outside that span cannot matter.
    const walk = roster.walkingMinutes;
    const crew = roster.people.filter((p) => rooms.some((r) => p.roomIds.includes(r.room.id)));
    const work = new Map((plan.people?.people ?? []).map((p) => [p.id, p.work]));
    const clock = (hhmm: string) => Math.round((wallTimeToMillis(input.date, hhmm, input.timezone) - day.midnightMs) / 60_000);
    const spanFrom = Math.min(...items.map((it) => it.lo));
    const crewBy = Math.max(...items.map((it) => it.hi + it.fe.duration)) + CREW_SLACK;
    const matters = (b: { start: number; end: number }) => b.end > spanFrom && b.start < crewBy + CREW_SLACK;
    return {
      rooms,
      items,
      noJob,
      crewBy,
      people: crew.map((p) => ({
        id: p.id,
        label: p.label,
        start: clock(p.start),
        end: clock(p.end),
        roomIds: p.roomIds,
        breaks: [
          ...p.breaks.map((b) => ({ start: clock(b.start), end: clock(b.end) })),
          ...(work.get(p.id) ?? []).filter((w) => !jobs.has(w.toExamId)).map((w) => ({ start: minute(w.start) - walk, end: minute(w.end) + walk })),
        ].filter(matters),
      })),
    };
  }

  function placeOf(fe: FitExam): { roomId: number; start: number } {
    return arrangement.places.get(fe.exam.id) ?? { roomId: fe.roomId, start: fe.start };
  }

  /** The exam as a constant where the arrangement has it (its own start counts for "moved"). */
  function atPlace(fe: FitExam): FitExam {
    const at = placeOf(fe);
    return { ...fe, start: at.start, roomId: at.roomId };
  }
}

/** The plan changes of an arrangement: moves from the day's places, then staffing. */
export function changesOf(day: FitDay, arrangement: RosterArrangement): PlanChange[] {
  const examById = new Map(day.input.exams.map((e) => [e.id, e]));
  const changes: PlanChange[] = [];
  for (const [examId, to] of arrangement.places) {
    const exam = examById.get(examId)!;
    if (to.roomId === exam.roomId && to.start === day.minuteOf(exam.start)) continue;
    changes.push({ type: 'move', examId, accession: exam.accession, from: { roomId: exam.roomId, start: exam.start }, to: { roomId: to.roomId, start: day.toIso(to.start) } });
  }
  for (const [toExamId, to] of arrangement.staffing) {
    const exam = examById.get(toExamId)!;
    changes.push({ type: 'staffing', toExamId, accession: exam.accession, from: day.input.staffOverrides?.[toExamId] ?? null, to });
  }
  return changes;
}

/** An arrangement from a proposal's changes. */
export function arrangementOf(day: FitDay, changes: readonly PlanChange[]): RosterArrangement {
  const places = new Map<number, { roomId: number; start: number }>();
  const staffing = new Map<number, number>();
  for (const change of changes) {
    if (change.type === 'move') places.set(change.examId, { roomId: change.to.roomId, start: day.minuteOf(change.to.start) });
    if (change.type === 'staffing' && change.to !== null) staffing.set(change.toExamId, change.to);
  }
  return { places, staffing };
}

/** The helpers of an arrangement as a proposal names them: the last of the turnover's crew in the plan, and their work there. */
export function helperUses(day: FitDay, arrangement: RosterArrangement, plan: DayPlan): ClusterSolution['helpers'] {
  const gaps = new Map(plan.rooms.flatMap((room) => room.gaps.map((gap) => [gap.toExamId, gap])));
  const people = new Map((plan.people?.people ?? []).map((p) => [p.id, p]));
  const helpers: ClusterSolution['helpers'] = new Map();
  for (const [examId, staffTo] of arrangement.staffing) {
    const crew = gaps.get(examId)?.crew ?? [];
    const person = people.get(crew[crew.length - 1] ?? '');
    const piece = person?.work.find((w) => w.toExamId === examId);
    const [busyFrom, busyTo] = piece ? [day.minuteOf(piece.start), day.minuteOf(piece.end)] : [0, 0];
    const helper = { id: person?.id ?? '', label: person?.label ?? 'a person on the roster', free: [], roomIds: person ? [...person.roomIds] : null };
    helpers.set(examId, { slot: { helper, from: busyFrom, to: busyTo }, busyFrom, busyTo, staffTo });
  }
  return helpers;
}
