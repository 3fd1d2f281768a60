import type { Knex } from 'knex';
import type { DayPlanExam } from '../../shared/turnover';
import type { ExamListKeyed, ExamListRow } from '../../shared/exam-list';
import type { ExamFields } from '../../shared/api/changes';

type Exam = ExamFields & { accession: string };

export interface ExamRow {
  id: number;
  day: string;
  accession: string;
  room_id: number;
  start_at: string;
  start_ms: number;
  duration_minutes: number;
  procedure: string;
  coil: string | null;
  precaution: string;
  mobility: string;
  contrast: number | boolean;
  notes: string | null;
  version: number;
  pinned?: number | boolean;
}

export function toPlanExam(row: ExamRow): DayPlanExam {
  return {
    id: row.id,
    accession: row.accession,
    roomId: row.room_id,
    start: row.start_at,
    durationMinutes: row.duration_minutes,
    procedure: row.procedure,
    coil: row.coil,
    precaution: row.precaution as DayPlanExam['precaution'],
    mobility: row.mobility as DayPlanExam['mobility'],
    contrast: Boolean(row.contrast),
    notes: row.notes,
    version: row.version,
    ...(row.pinned ? { pinned: true } : {}),
  };
}

export async function examsOfDay(db: Knex, day: string): Promise<ExamRow[]> {
  return db<ExamRow>('exams').where({ day }).orderBy([{ column: 'room_id' }, { column: 'start_ms' }, { column: 'id' }]);
}

/** The stored list in the file's terms, for comparing with an incoming file. */
export function toListed(row: ExamRow, roomNames: Map<number, string>): ExamListKeyed {
  return {
    accession: row.accession,
    room: roomNames.get(row.room_id) ?? `#${row.room_id}`,
    start: row.start_at,
    durationMinutes: row.duration_minutes,
    procedure: row.procedure,
    coil: row.coil,
    precaution: row.precaution as ExamListKeyed['precaution'],
    mobility: row.mobility as ExamListKeyed['mobility'],
    contrast: Boolean(row.contrast),
    notes: row.notes,
  };
}

/** Column values of an imported row (the day and version are set by the caller). */
export function examColumns(row: ExamListRow | ExamListKeyed, roomId: number) {
  return {
    accession: row.accession,
    room_id: roomId,
    start_at: row.start,
    start_ms: Date.parse(row.start),
    duration_minutes: row.durationMinutes,
    procedure: row.procedure,
    coil: row.coil,
    precaution: row.precaution,
    mobility: row.mobility,
    contrast: row.contrast,
    notes: row.notes,
  };
}

/** Columns of an exam placed in a room at a start (ISO with the site offset). */
export function examColumnsForMove(roomId: number, start: string) {
  return { room_id: roomId, start_at: start, start_ms: Date.parse(start) };
}

/** An exam's stored fields, as a change records them. */
export function storedFields(row: ExamRow): Exam {
  return {
    accession: row.accession,
    roomId: row.room_id,
    start: row.start_at,
    durationMinutes: row.duration_minutes,
    procedure: row.procedure,
    coil: row.coil,
    precaution: row.precaution,
    mobility: row.mobility,
    contrast: Boolean(row.contrast),
    notes: row.notes,
  };
}

/** The columns of an exam as a change describes it. */
export function columnsOfFields(fields: Exam) {
  return {
    accession: fields.accession,
    room_id: fields.roomId,
    start_at: fields.start,
    start_ms: Date.parse(fields.start),
    duration_minutes: fields.durationMinutes,
    procedure: fields.procedure,
    coil: fields.coil,
    precaution: fields.precaution,
    mobility: fields.mobility,
    contrast: fields.contrast,
    notes: fields.notes,
  };
}

