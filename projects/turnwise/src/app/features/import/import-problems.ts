import type { Verdict } from '@shared/api/plan';
import type { ExamListRow } from '@shared/exam-list/model';
import { computeDayPlan, type DayPlanInput } from '@shared/turnover';

/** A gap the imported list would have (or has) that is not `fits`: where, when and how bad. */
export interface ImportProblem {
  room: string;
  /** The exam after the gap, and its start (ISO with the site's offset). */
  accession: string;
  start: string;
  verdict: Exclude<Verdict, 'fits'>;
  shortByMinutes: number;
}

/**
 * The problem gaps of a list of rows, by room (in the day's lane order) then time, computed with
 * the server's own engine and the day's own input (rooms, zone, snug margin: `PlannedDay.input`),
 * the rows replacing its exams as the import would. Rows in a room not set up are left out (the
 * server refuses those anyway).
 *
 * @example
 * importProblems(plan.input, result.rows); // [{ room: 'MR 1', accession: 'ACC-2', start: '…T08:45…', verdict: 'short', shortByMinutes: 10 }]
 */
export function importProblems(day: DayPlanInput, rows: readonly ExamListRow[]): ImportProblem[] {
  const roomIds = new Map(day.rooms.map((room) => [room.name, room.id]));
  const exams = rows
    .filter((row) => roomIds.has(row.room))
    .map((row, index) => ({ ...row, id: -(index + 1), roomId: roomIds.get(row.room)!, version: 0 }));
  const plan = computeDayPlan({ ...day, exams, staffOverrides: {} });
  const problems: ImportProblem[] = [];
  for (const room of plan.rooms) {
    const byId = new Map(room.exams.map((exam) => [exam.id, exam]));
    for (const gap of room.gaps) {
      if (gap.verdict === 'fits') continue;
      const exam = byId.get(gap.toExamId)!;
      problems.push({ room: room.name, accession: exam.accession, start: exam.start, verdict: gap.verdict, shortByMinutes: gap.shortByMinutes });
    }
  }
  return problems;
}
