import type { ExamMove } from '@shared/api/changes';
import type { DayPlan, PlanRoom } from '@shared/api/plan';
import type { Room } from '@shared/api/rooms';
import { withChanges } from '@shared/fixes/apply-changes';
import { computeDayPlan, type DayPlanInput } from '@shared/turnover';

import { siteClock } from '../../shared/ui/site-time';

/** Where a slot would go: the exam, its would-be room and start (ISO with offset). */
export interface SlotMove {
  examId: number;
  roomId: number;
  start: string;
}

/**
 * What the engine needs to recompute the day in the browser, rebuilt from the plan the server
 * sent plus each room's air changes (only `/api/rooms` has them). A gap whose staff differs
 * from its room's is a helper the charge technologist added, so it becomes a staff override.
 */
export function dayPlanInputOf(plan: DayPlan, rooms: readonly Room[], snugMarginMinutes: number): DayPlanInput {
  const byId = new Map(rooms.map((room) => [room.id, room]));
  const staffOverrides: Record<number, number> = {};
  for (const room of plan.rooms) {
    for (const gap of room.gaps) if (gap.staff !== room.staff) staffOverrides[gap.toExamId] = gap.staff;
  }
  return {
    date: plan.date,
    timezone: plan.timezone,
    snugMarginMinutes,
    rooms: plan.rooms.map((room) => ({
      id: room.id,
      name: room.name,
      modality: room.modality,
      staff: room.staff,
      // 0 makes the engine refuse an airborne gap rather than invent a rate: the preview then shows nothing.
      airChangesPerHour: byId.get(room.id)?.airChangesPerHour ?? 0,
      opensAt: siteClock(room.opensAt),
      closesAt: siteClock(room.closesAt),
    })),
    exams: plan.rooms.flatMap((room) =>
      room.exams.map((exam) => ({
        id: exam.id,
        accession: exam.accession,
        roomId: room.id,
        start: exam.start,
        durationMinutes: exam.durationMinutes,
        procedure: exam.procedure,
        coil: exam.coil,
        precaution: exam.precaution,
        mobility: exam.mobility,
        contrast: exam.contrast,
        notes: exam.notes,
        version: exam.version,
      })),
    ),
    staffOverrides,
  };
}

/**
 * The rooms a move touches (where the slot was and where it would go), recomputed with the same
 * engine as the server; other rooms cannot change, so they are not computed. Null when the
 * engine refuses the input (e.g. a room whose air changes are not known yet).
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
    const plan = computeDayPlan({
      ...moved,
      rooms: moved.rooms.filter((room) => touched.has(room.id)),
      exams: moved.exams.filter((candidate) => touched.has(candidate.roomId)),
    });
    return new Map(plan.rooms.map((room) => [room.id, room]));
  } catch {
    return null;
  }
}
