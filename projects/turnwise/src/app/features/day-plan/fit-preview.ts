import type { PlannedDay, PlanRoom } from '@shared/api/plan';
import type { DayFitAnswer } from '@shared/api/day-fit';
import { withChanges } from '@shared/fixes/apply-changes';
import { computeDayPlan } from '@shared/turnover';

/** Where an exam was before the proposal: drawn as a ghost in its old lane. */
export interface FitGhost {
  examId: number;
  accession: string;
  /** ISO with the site's offset. */
  start: string;
  startMs: number;
  endMs: number;
}

/** The day as the proposal would leave it, for the timeline. */
export interface FitPreview {
  /** Rooms recomputed with the proposal applied (same engine, same input as the plan); every room with a roster. */
  rooms: ReadonlyMap<number, PlanRoom>;
  /** Old places by room. */
  ghosts: ReadonlyMap<number, readonly FitGhost[]>;
  /** Exams the proposal moves, and gaps it adds a helper to. */
  proposed: ReadonlySet<number>;
}

/**
 * The proposal on the plan's own input: the touched rooms (every room, on a day with a roster)
 * recomputed in the browser, each moved
 * exam's old place kept as a ghost. Null when the engine refuses the input.
 *
 * @example
 * fitPreview(plannedDay, proposal)?.ghosts.get(1); // [{ examId: 7, accession: 'A-7', startMs: …, endMs: … }]
 */
export function fitPreview(day: PlannedDay, proposal: DayFitAnswer): FitPreview | null {
  const touched = new Set<number>();
  const ghosts = new Map<number, FitGhost[]>();
  const proposed = new Set<number>();
  for (const move of proposal.moves) {
    touched.add(move.from.roomId).add(move.to.roomId);
    proposed.add(move.examId);
    const exam = day.input.exams.find((e) => e.id === move.examId);
    const startMs = Date.parse(move.from.start);
    const list = ghosts.get(move.from.roomId) ?? [];
    list.push({ examId: move.examId, accession: move.accession, start: move.from.start, startMs, endMs: startMs + (exam?.durationMinutes ?? 0) * 60_000 });
    ghosts.set(move.from.roomId, list);
  }
  for (const helper of proposal.helpers) {
    touched.add(helper.roomId);
    proposed.add(helper.toExamId);
  }
  const after = withChanges(day.input, proposal.changes);
  try {
    // With a roster people are shared between rooms: the whole day is computed (as the server
    // judged the proposal) and every room taken from it, since a move can change another room's crew.
    const plan = after.roster
      ? computeDayPlan(after)
      : computeDayPlan({ ...after, rooms: after.rooms.filter((r) => touched.has(r.id)), exams: after.exams.filter((e) => touched.has(e.roomId)) });
    return { rooms: new Map(plan.rooms.map((room) => [room.id, room])), ghosts, proposed };
  } catch {
    return null;
  }
}
