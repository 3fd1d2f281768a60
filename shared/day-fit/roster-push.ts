import { withChanges } from '../fixes/apply-changes';
import { computeDayPlan } from '../turnover/day-plan';
import type { DayPlanInput } from '../turnover/day-plan-input';
import type { DayPlan, PlanSummary } from '../turnover/day-plan-types';
import type { FitDay, FitExam, FitRoom } from './instance';
import type { DayFitOptions } from './model';
import { lexicallyLess } from './roster-judge';
import { changesOf, type RosterArrangement } from './roster-windows';

/** Passes over the gaps left at most (each pass tries every gap once). */
const MOST_PASSES = 4;

/**
 * Clears what the roster still finds short by pushing exams along their room, judged with the
 * roster's whole day: for a gap short by d minutes, the exam after it and the ones after that
 * which have less than d minutes to spare go d minutes later, or the exam before it and the ones
 * before that go d minutes earlier. Each exam pushed must be free to move, stay in its room's
 * hours and start no earlier than it may (`notBefore`). Of the two, the better (fewer problem
 * gaps, then fewer exams moved, minutes moved, minutes short) is kept when the whole day has
 * fewer problem gaps: never worse. Two engine runs a gap, on the part of the day its people join
 * (`judgePart`), so it works on days too large for a model of their people; not proven the best.
 *
 * @example
 * pushAlongRooms(day, arrangement, plan, options, Date.now() + 2_000).plan.summary.short; // fewer
 */
export function pushAlongRooms(
  day: FitDay,
  start: RosterArrangement,
  startPlan: DayPlan,
  options: Pick<DayFitOptions, 'now' | 'gridMinutes'>,
  deadline: number,
): { arrangement: RosterArrangement; plan: DayPlan; kept: number } {
  const now = options.now ?? Date.now;
  const exams = new Map<number, FitExam>(day.groups.flatMap((g) => g.exams.map((fe) => [fe.exam.id, fe] as const)));
  const hours = new Map<number, FitRoom>(day.groups.flatMap((g) => g.rooms.map((r) => [r.room.id, r] as const)));
  // Rooms no person joins are judged apart: a push in one part of the day changes nothing in another.
  const partOf = partsByPeople(day.input);
  let arrangement = start;
  let plan = startPlan;
  let kept = 0;
  for (let pass = 0; pass < MOST_PASSES; pass++) {
    let changed = false;
    for (const { roomId, toExamId } of problemGaps(plan)) {
      if (now() >= deadline) break;
      // The gap may have been cleared (or moved) by a push kept earlier in this pass.
      const room = plan.rooms.find((r) => r.id === roomId)!;
      const at = room.exams.findIndex((e) => e.id === toExamId);
      const gap = room.gaps.find((g) => g.toExamId === toExamId);
      if (at < 0 || !gap || (gap.verdict !== 'short' && gap.verdict !== 'overlap')) continue;
      // On a grid of starts, a whole number of its steps.
      const grid = options.gridMinutes ?? 1;
      const d = Math.ceil(gap.shortByMinutes / grid) * grid;
      let best: { arrangement: RosterArrangement; plan: DayPlan; score: number[] } | null = null;
      for (const way of [1, -1] as const) {
        const pushed = pushFrom(room, way === 1 ? at : at - 1, way, d);
        if (!pushed) continue;
        const places = new Map(arrangement.places);
        for (const [id, start] of pushed) places.set(id, { roomId, start });
        const candidate = { places, staffing: arrangement.staffing };
        const judged = judgePart(plan, withChanges(day.input, changesOf(day, candidate)), partOf.get(roomId)!);
        const score = [problemCount(judged.summary), ...moved(candidate), judged.summary.minutesShort];
        if (!best || lexicallyLess(score, best.score)) best = { arrangement: candidate, plan: judged, score };
      }
      if (best && problemCount(best.plan.summary) < problemCount(plan.summary)) {
        ({ arrangement, plan } = best);
        kept++;
        changed = true;
      }
    }
    if (!changed) break;
  }
  // The whole day once more: its people's work, as the parts left it.
  if (kept > 0) plan = computeDayPlan(withChanges(day.input, changesOf(day, arrangement)));
  return { arrangement, plan, kept };

  /**
   * The new starts (minutes) of the exams pushed `d` minutes `way` (1 later, -1 earlier) from the
   * one at `index` in the room's plan, on along the room while the next gap has less than `d`
   * minutes to spare; null when one of them may not move or would leave its hours.
   */
  function pushFrom(room: DayPlan['rooms'][number], index: number, way: 1 | -1, d: number): Map<number, number> | null {
    const open = hours.get(room.id);
    if (d <= 0 || !open) return null;
    const pushed = new Map<number, number>();
    const gapInto = new Map(room.gaps.map((g) => [g.toExamId, g]));
    for (let k = index; k >= 0 && k < room.exams.length; k += way) {
      const exam = room.exams[k]!;
      const fe = exams.get(exam.id);
      if (!fe || fe.stays !== null) return null;
      const to = day.minuteOf(exam.start) + way * d;
      if (to < open.open || to < fe.earliest || to + fe.duration > open.close) return null;
      pushed.set(exam.id, to);
      // Later: the gap after this exam must absorb d; earlier: the gap before it (the opening's too).
      const absorbs = way === 1 ? room.exams[k + 1] : exam;
      const gap = absorbs ? gapInto.get(absorbs.id) : undefined;
      if (!gap) break;
      if (day.minuteOf(absorbs!.start) - day.minuteOf(gap.readyAt) >= d) break;
      if (gap.fromExamId === null) return null;
    }
    return pushed.size > 0 ? pushed : null;
  }

  /** Exams moved and minutes moved from the day's own places, for choosing between two pushes. */
  function moved(arr: RosterArrangement): number[] {
    let count = 0;
    let minutes = 0;
    for (const [id, place] of arr.places) {
      const fe = exams.get(id);
      if (!fe || (place.roomId === fe.roomId && place.start === fe.start)) continue;
      count++;
      minutes += Math.abs(place.start - fe.start);
    }
    return [count, minutes];
  }
}

/** Each room's part of the day: the rooms joined to it by people who cover both (itself alone when nobody covers it). */
export function partsByPeople(input: DayPlanInput): Map<number, ReadonlySet<number>> {
  const partOf = new Map<number, Set<number>>(input.rooms.map((r) => [r.id, new Set([r.id])]));
  for (const person of input.roster?.people ?? []) {
    const merged = new Set(person.roomIds.flatMap((id) => [...(partOf.get(id) ?? [])]));
    for (const id of merged) partOf.set(id, merged);
  }
  return partOf;
}

/**
 * The plan of `input` judged only in `part` (its rooms, their exams and the people who cover
 * them), with the rest of the day as `plan` has it: the same verdicts as the whole day's, as no
 * one joins the part to another room.
 */
export function judgePart(plan: DayPlan, input: DayPlanInput, part: ReadonlySet<number>): DayPlan {
  const roster = input.roster ? { ...input.roster, people: input.roster.people.filter((p) => p.roomIds.some((id) => part.has(id))) } : undefined;
  const sub = computeDayPlan({ ...input, rooms: input.rooms.filter((r) => part.has(r.id)), exams: input.exams.filter((e) => part.has(e.roomId)), ...(roster ? { roster } : {}) });
  const fresh = new Map(sub.rooms.map((r) => [r.id, r]));
  const rooms = plan.rooms.map((r) => fresh.get(r.id) ?? r);
  const summary: PlanSummary = { fits: 0, snug: 0, short: 0, overlap: 0, minutesShort: 0 };
  for (const gap of rooms.flatMap((r) => r.gaps)) {
    summary[gap.verdict]++;
    summary.minutesShort += gap.shortByMinutes;
  }
  return { ...plan, rooms, summary };
}

/** The problem gaps of a plan in time order. */
function problemGaps(plan: DayPlan): { roomId: number; toExamId: number; at: number }[] {
  return plan.rooms
    .flatMap((room) => room.gaps.filter((g) => g.verdict === 'short' || g.verdict === 'overlap').map((g) => ({ roomId: room.id, toExamId: g.toExamId, at: Date.parse(g.readyAt) })))
    .sort((a, b) => a.at - b.at);
}

/** Short and overlapping gaps of a plan's summary: what the roster's steps count first. */
export const problemCount = (summary: PlanSummary) => summary.short + summary.overlap;
