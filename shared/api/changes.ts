import { z } from 'zod';
import { MOVE_REASONS, TURNOVER_STAFF, type ChangeReason } from './limits';
import type { RosterRow } from './roster';

export { CHANGE_REASONS, MOVE_REASONS, type ChangeReason, type MoveReason } from './limits';

export interface ExamMove {
  type: 'move';
  examId: number;
  accession: string;
  from: { roomId: number; start: string };
  to: { roomId: number; start: string };
}

export interface StaffingChange {
  type: 'staffing';
  /** The gap before this exam. */
  toExamId: number;
  accession: string;
  /** null: the room's staff. */
  from: number | null;
  to: number | null;
}

/** An exam as the day list stores it (the import's columns), room by id and start with the site's offset. */
export interface ExamFields {
  roomId: number;
  start: string;
  durationMinutes: number;
  procedure: string;
  coil: string | null;
  precaution: string;
  mobility: string;
  contrast: boolean;
  notes: string | null;
}

/**
 * One exam added (`from: null`), edited, or cancelled (`to: null`) by hand, outside an import.
 * `accession` is the one it has after the change (before it, for a cancel).
 */
export interface ExamEdit {
  type: 'exam';
  examId: number;
  accession: string;
  from: (ExamFields & { accession: string }) | null;
  to: (ExamFields & { accession: string }) | null;
}

/**
 * The day's own roster saved (`to`), or removed so the weekday's default applies again (`to: null`);
 * `from` is what it replaced. Rows as `shared/api/roster.ts` describes them.
 */
export interface RosterChange {
  type: 'roster';
  day: string;
  from: RosterRow[] | null;
  to: RosterRow[] | null;
}

export type PlanChange = ExamMove | StaffingChange | ExamEdit | RosterChange;

/** One row of the day's history. */
export interface PlanChangeRecord {
  id: number;
  day: string;
  username: string;
  displayName: string;
  reason: ChangeReason;
  summary: string;
  changes: PlanChange[];
  revertsId: number | null;
  undone: boolean;
  /** Made by the booking feed (reason `hl7`) and moved an exam someone had changed by hand since the feed's last message about it. */
  afterManualChange: boolean;
  at: string;
}

/** `GET /api/days/:date/history`: the day's changes, and what the signed-in user may undo or redo. */
export interface DayHistory {
  changes: PlanChangeRecord[];
  /** The user has an action of their own on this day that `POST …/undo` would revert. */
  canUndo: boolean;
  /** `POST …/redo` would re-apply the user's last undone action (no new action of theirs since). */
  canRedo: boolean;
}

/** `PATCH /api/exams/:id` body. */
export const examMoveSchema = z
  .object({
    start: z.string().datetime({ offset: true, message: 'start must be ISO 8601 with an offset' }).optional(),
    roomId: z.number().int().positive().optional(),
    version: z.number().int().min(0),
    reason: z.enum(MOVE_REASONS).default('api'),
  })
  .refine((b) => b.start !== undefined || b.roomId !== undefined, 'give start, roomId or both');
export type ExamMoveInput = z.input<typeof examMoveSchema>;

const cell = z.union([z.string(), z.null()]).optional();

/**
 * `POST /api/days/:date/exams` body: one exam in the import's columns, as the file spells them.
 * Cells are checked by the import's own rules (`shared/exam-list`), so only their types are
 * checked here; `duration_min` may be a number and `contrast` a boolean.
 */
export const examFormSchema = z.object({
  accession: cell,
  room: cell,
  start: cell,
  duration_min: z.union([z.string(), z.number(), z.null()]).optional(),
  procedure: cell,
  coil: cell,
  precaution: cell,
  mobility: cell,
  contrast: z.union([z.string(), z.boolean(), z.null()]).optional(),
  notes: cell,
});
export type ExamFormInput = z.input<typeof examFormSchema>;

/** `PUT /api/exams/:id` body: the whole exam again, with the version it was read at. */
export const examEditSchema = examFormSchema.extend({ version: z.number().int().min(0) });
export type ExamEditInput = z.input<typeof examEditSchema>;

/** `DELETE /api/exams/:id?version=N` query. */
export const examCancelQuery = z.object({ version: z.coerce.number().int().min(0) });

const staff = z.number().int().min(TURNOVER_STAFF.min).max(TURNOVER_STAFF.max);

/** `PUT /api/exams/:id/staffing` body: people on the turnover before this exam, null for the room's. */
export const gapStaffingSchema = z.object({ staff: staff.nullable() });

/** `PATCH /api/rooms/:id/staffing` body. */
export const roomStaffingSchema = z.object({ staff });

/** Server-sent event on `GET /api/days/:date/events`. */
export interface DayEvent {
  date: string;
  kind: 'plan' | 'board' | 'log';
  reason: string;
  by: string | null;
  at: string;
}
