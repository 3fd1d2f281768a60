import type { DayPlan } from '@shared/api/plan';

import { siteClock } from '../../shared/ui/site-time';

/** A patient whose slot moved: call them with the new time (and room, when it changed). */
export interface PatientToCall {
  examId: number;
  accession: string;
  fromRoom: string;
  from: string;
  toRoom: string;
  to: string;
}

/**
 * The exams whose start or room differ between two plans of the same day, in the new order of
 * time. Exams added or removed are not calls about a moved slot, so they are left out.
 *
 * @example
 * movedExams(before, after); // [{ accession: 'A3004', fromRoom: 'MR 3', from: '…T10:05…', toRoom: 'MR 3', to: '…T10:20…' }]
 */
export function movedExams(before: DayPlan, after: DayPlan): PatientToCall[] {
  const was = new Map(before.rooms.flatMap((room) => room.exams.map((exam) => [exam.id, { exam, room: room.name }] as const)));
  const moved: PatientToCall[] = [];
  for (const room of after.rooms) {
    for (const exam of room.exams) {
      const old = was.get(exam.id);
      if (!old || (Date.parse(old.exam.start) === Date.parse(exam.start) && old.room === room.name)) continue;
      moved.push({ examId: exam.id, accession: exam.accession, fromRoom: old.room, from: old.exam.start, toRoom: room.name, to: exam.start });
    }
  }
  return moved.sort((a, b) => Date.parse(a.to) - Date.parse(b.to) || a.accession.localeCompare(b.accession));
}

/**
 * Adds the latest moves to the list so far: a patient moved twice is called once, from the time
 * they were first told to the latest; one moved back to where they were needs no call.
 */
export function withMoves(list: readonly PatientToCall[], moves: readonly PatientToCall[]): PatientToCall[] {
  const byExam = new Map(list.map((call) => [call.examId, call]));
  for (const move of moves) {
    const first = byExam.get(move.examId);
    const merged = first ? { ...move, fromRoom: first.fromRoom, from: first.from } : move;
    if (Date.parse(merged.from) === Date.parse(merged.to) && merged.fromRoom === merged.toRoom) byExam.delete(move.examId);
    else byExam.set(move.examId, merged);
  }
  return [...byExam.values()].sort((a, b) => Date.parse(a.to) - Date.parse(b.to) || a.accession.localeCompare(b.accession));
}

/** "A3004: MR 3 10:05 → 10:20", or "… → MR 1 10:20" when the room changed too. */
export function callLine(call: PatientToCall): string {
  const to = call.toRoom === call.fromRoom ? siteClock(call.to) : `${call.toRoom} ${siteClock(call.to)}`;
  return `${call.accession}: ${call.fromRoom} ${siteClock(call.from)} → ${to}`;
}

/** The list as CSV (RFC 4180: CRLF, quoted when needed), times as site clock times of `date`. */
export function callsCsv(date: string, list: readonly PatientToCall[]): string {
  const quote = (cell: string) => (/[",\r\n]/.test(cell) ? `"${cell.replace(/"/g, '""')}"` : cell);
  const rows = [['date', 'accession', 'old_room', 'old_start', 'new_room', 'new_start']];
  for (const call of list) rows.push([date, call.accession, call.fromRoom, siteClock(call.from), call.toRoom, siteClock(call.to)]);
  return rows.map((row) => row.map(quote).join(',')).join('\r\n') + '\r\n';
}
