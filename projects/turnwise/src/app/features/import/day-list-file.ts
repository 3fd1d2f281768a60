import { EXAM_LIST_COLUMNS, type ExamListColumn } from '@shared/exam-list/columns';
import type { DayPlanInput } from '@shared/turnover';

import { siteClock } from '../../shared/ui/site-time';

const HEADER = EXAM_LIST_COLUMNS.map((column) => column.name);

/** The exam-list file with its header only: the columns the import reads, in their usual order. */
export function templateCsv(): string {
  return toCsv([HEADER]);
}

/**
 * The day's list in the import format (CSV, one row per exam in room then time order, start as
 * HH:MM site time), so it can be edited and imported back unchanged.
 *
 * @example
 * dayListCsv(plan.input); // 'accession,room,start,duration_min,…\r\nA3004,MR 3,10:05,30,MR knee,knee,none,ambulatory,no,\r\n'
 */
export function dayListCsv(day: DayPlanInput): string {
  const rooms = new Map(day.rooms.map((room, index) => [room.id, { name: room.name, index }]));
  const exams = day.exams
    .filter((exam) => rooms.has(exam.roomId))
    .sort((a, b) => rooms.get(a.roomId)!.index - rooms.get(b.roomId)!.index || Date.parse(a.start) - Date.parse(b.start));
  const cells: Record<ExamListColumn, (exam: DayPlanInput['exams'][number]) => string> = {
    accession: (exam) => exam.accession,
    room: (exam) => rooms.get(exam.roomId)!.name,
    start: (exam) => siteClock(exam.start),
    duration_min: (exam) => String(exam.durationMinutes),
    procedure: (exam) => exam.procedure,
    coil: (exam) => exam.coil ?? '',
    precaution: (exam) => exam.precaution,
    mobility: (exam) => exam.mobility,
    contrast: (exam) => (exam.contrast ? 'yes' : 'no'),
    notes: (exam) => exam.notes ?? '',
  };
  return toCsv([HEADER, ...exams.map((exam) => HEADER.map((column) => cells[column](exam)))]);
}

/** RFC 4180: CRLF line ends, a cell quoted when it holds a comma, quote or line break. */
function toCsv(rows: readonly (readonly string[])[]): string {
  const quote = (cell: string) => (/[",\r\n]/.test(cell) ? `"${cell.replace(/"/g, '""')}"` : cell);
  return rows.map((row) => row.map(quote).join(',')).join('\r\n') + '\r\n';
}

/** A link target for a CSV download without a blob to revoke. */
export function csvHref(csv: string): string {
  return `data:text/csv;charset=utf-8,${encodeURIComponent(csv)}`;
}
