import { withChanges } from '../fixes/apply-changes';
import { computeDayPlan } from '../turnover/day-plan';
import type { DayPlan } from '../turnover/day-plan-types';
import type { FitDay, FitExam } from './instance';
import type { DayFitOptions } from './model';
import { judgePart, partsByPeople, problemCount } from './roster-push';
import { changesOf, type RosterArrangement } from './roster-windows';

/** Passes over the moved exams at most (a return kept can make room for one refused before). */
const MOST_PASSES = 2;

/**
 * Calls fewer patients: each exam a large roster day's proposal moves (most minutes first) is
 * put back where it was booked, or else half-way back, and kept there when the roster's
 * judgement of its part of the day (`judgePart`) has no more problem gaps and no more minutes
 * short (a return that leaves a gap beside it in its room short even with the largest crew the
 * room allows starting at once, where the exam's place now leaves none so, is refused without
 * that judgement: most are). The rounds and pushes clear gaps by moving whole runs of exams, and
 * some of those moves turn out not to be needed once the others are made; this takes them back.
 * A return stays in the room's hours and no earlier than the exam may start, as both its booked
 * place and its place now do (an exam booked outside its hours or before then stays where it
 * is). Never worse on any level (gaps, exams moved, minutes moved), not proven the best. Answers
 * the arrangement, its plan and how many exams came back (all the way or half).
 *
 * @example
 * settleBack(day, arrangement, plan, options, Date.now() + 1_000).returned; // 3
 */
export function settleBack(
  day: FitDay,
  start: RosterArrangement,
  startPlan: DayPlan,
  options: Pick<DayFitOptions, 'now' | 'gridMinutes'>,
  deadline: number,
): { arrangement: RosterArrangement; plan: DayPlan; returned: number } {
  const now = options.now ?? Date.now;
  const grid = options.gridMinutes ?? 1;
  const exams = new Map<number, FitExam>(day.groups.flatMap((g) => g.exams.map((fe) => [fe.exam.id, fe] as const)));
  const partOf = partsByPeople(day.input);
  let arrangement = start;
  let plan = startPlan;
  const returned = new Set<number>();
  const refused = new Set<string>();
  for (let pass = 0; pass < MOST_PASSES; pass++) {
    let changed = false;
    for (const id of movedMost(arrangement)) {
      const fe = exams.get(id)!;
      const at = arrangement.places.get(id)!;
      // All the way back, then half-way along its room (on the grid), where it is free to go.
      const half = at.roomId === fe.roomId ? at.start + Math.round((fe.start - at.start) / 2 / grid) * grid : null;
      for (const to of [{ roomId: fe.roomId, start: fe.start }, ...(half !== null && half !== at.start && half !== fe.start ? [{ roomId: fe.roomId, start: half }] : [])]) {
        if (now() >= deadline) return finish();
        const key = `${id}|${to.roomId}|${to.start}`;
        if (refused.has(key)) continue;
        const places = new Map(arrangement.places);
        if (to.roomId === fe.roomId && to.start === fe.start) places.delete(id);
        else places.set(id, to);
        const candidate = { places, staffing: arrangement.staffing };
        const parts = new Set([...(partOf.get(at.roomId) ?? []), ...(partOf.get(to.roomId) ?? [])]);
        // A return that leaves a gap beside it short even with the largest crew at once, where its
        // place now leaves none so, is not worth the engine's judgement.
        if (certainlyShort(candidate, id, to) && !certainlyShort(arrangement, id, at)) {
          refused.add(key);
          continue;
        }
        const judged = judgePart(plan, withChanges(day.input, changesOf(day, candidate)), parts);
        if (problemCount(judged.summary) <= problemCount(plan.summary) && judged.summary.minutesShort <= plan.summary.minutesShort) {
          arrangement = candidate;
          plan = judged;
          returned.add(id);
          changed = true;
          // What was refused before may go back now: tried again in the next pass.
          refused.clear();
          break;
        }
        refused.add(key);
      }
    }
    if (!changed) break;
  }
  return finish();

  /** Whether the exam at `to` leaves a gap next to it short even with the largest crew its room allows, right away. */
  function certainlyShort(arr: RosterArrangement, id: number, to: { roomId: number; start: number }): boolean {
    const room = day.input.rooms.find((r) => r.id === to.roomId)!;
    const inRoom = [...exams.values()]
      .map((x) => ({ x, at: arr.places.get(x.exam.id) ?? { roomId: x.roomId, start: x.start } }))
      .filter((e) => e.at.roomId === to.roomId)
      .sort((a, b) => a.at.start - b.at.start || a.x.exam.id - b.x.exam.id);
    const k = inRoom.findIndex((e) => e.x.exam.id === id);
    const fastest = (leaving: FitExam | null, arriving: FitExam) => {
      const most = day.helperStaff(room, arriving.exam) ?? day.baseStaff(room, arriving.exam);
      return Math.min(...Array.from({ length: most }, (_, q) => day.required(room, leaving?.exam ?? null, arriving.exam, q + 1)));
    };
    const prev = inRoom[k - 1];
    const next = inRoom[k + 1];
    const self = inRoom[k]!;
    if (prev && prev.at.start + prev.x.duration + fastest(prev.x, self.x) > self.at.start) return true;
    if (next && self.at.start + self.x.duration + fastest(self.x, next.x) > next.at.start) return true;
    return false;
  }

  function finish() {
    // The whole day once more: its people's work, as the parts left it.
    if (returned.size > 0) plan = computeDayPlan(withChanges(day.input, changesOf(day, arrangement)));
    return { arrangement, plan, returned: returned.size };
  }

  /** The exams the arrangement moves from their booked place, most minutes first (another room counts as moved). */
  function movedMost(arr: RosterArrangement): number[] {
    const out: [number, number][] = [];
    for (const [id, place] of arr.places) {
      const fe = exams.get(id);
      if (!fe || fe.stays !== null || (place.roomId === fe.roomId && place.start === fe.start)) continue;
      out.push([id, Math.abs(place.start - fe.start)]);
    }
    return out.sort((a, b) => b[1] - a[1] || a[0] - b[0]).map(([id]) => id);
  }
}

