import type { ExamMove } from '@shared/api/changes';
import type { PlanRoom } from '@shared/api/plan';
import { withChanges } from '@shared/fixes/apply-changes';
import { computeDayPlan, type DayPlanInput } from '@shared/turnover';

/** Where a slot would go: the exam, its would-be room and start (ISO with offset). */
export interface SlotMove {
  examId: number;
  roomId: number;
  start: string;
}

/**
 * The rooms a move touches (where the slot was and where it would go), recomputed with the same
 * engine as the server on the input the plan came with (`PlannedDay.input`); without a roster
 * other rooms cannot change, so they are not computed. With one, people are shared between rooms,
 * so the whole day is computed (as the server does) and the touched rooms taken from it. Null when
 * the engine refuses the input.
 */
export function previewMove(input: DayPlanInput, move: SlotMove): Map<number, PlanRoom> | null {
  const exam = input.exams.find((candidate) => candidate.id === move.examId);
  if (!exam) return null;
  const touched = new Set([exam.roomId, move.roomId]);
  const change: ExamMove = {
    type: 'move',
    examId: exam.id,
    accession: exam.accession,
    from: { roomId: exam.roomId, start: exam.start },
    to: { roomId: move.roomId, start: move.start },
  };
  const moved = withChanges(input, [change]);
  try {
    const plan = moved.roster
      ? computeDayPlan(moved)
      : computeDayPlan({
          ...moved,
          rooms: moved.rooms.filter((room) => touched.has(room.id)),
          exams: moved.exams.filter((candidate) => touched.has(candidate.roomId)),
        });
    return new Map(plan.rooms.filter((room) => touched.has(room.id)).map((room) => [room.id, room]));
  } catch {
    return null;
  }
}
