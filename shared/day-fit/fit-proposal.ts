import type { ExamMove, PlanChange, StaffingChange } from '../api/changes';
import { withChanges } from '../fixes/apply-changes';
import { fixDay } from '../fixes/fix-day';
import type { ClusterSolution } from './cluster-model';
import type { FitDay } from './instance';
import type { DayFitProposal, FitCall, FitExamMove, FitHelperUse } from './model';
import { remainingGaps } from './remaining';
import { solverReport, type SolveTally } from './solver-report';

/**
 * The proposal from the places and helpers the solves chose: the moves and patients to call,
 * the helpers as staffing changes, and the day after as the engine (each room's own staff)
 * judges it, with the gaps left and why.
 */
export function fitProposal(
  day: FitDay,
  places: ReadonlyMap<number, { roomId: number; start: number }>,
  helpers: ClusterSolution['helpers'],
  before: DayFitProposal['before'],
  tally: SolveTally,
  milliseconds: number,
  nothingToDo: boolean,
): DayFitProposal {
  const { input } = day;
  const examById = new Map(input.exams.map((e) => [e.id, e]));
  const moves: FitExamMove[] = [];
  const calls: FitCall[] = [];
  const changes: PlanChange[] = [];
  for (const [examId, place] of [...places].sort((a, b) => a[0] - b[0])) {
    const exam = examById.get(examId)!;
    const fromStart = day.minuteOf(exam.start);
    if (place.roomId === exam.roomId && place.start === fromStart) continue;
    const to = { roomId: place.roomId, start: day.toIso(place.start) };
    const move: ExamMove = { type: 'move', examId, accession: exam.accession, from: { roomId: exam.roomId, start: exam.start }, to };
    changes.push(move);
    moves.push({ examId, accession: exam.accession, kind: place.roomId !== exam.roomId ? 'other-room' : 'shift', from: move.from, to, minutesMoved: Math.abs(place.start - fromStart) });
    if (place.start !== fromStart) calls.push({ examId, accession: exam.accession, fromStart: exam.start, toStart: to.start, fromRoomId: exam.roomId, toRoomId: place.roomId });
  }
  const roomById = new Map(input.rooms.map((r) => [r.id, r]));
  const helperUses: FitHelperUse[] = [];
  for (const [toExamId, { slot, busyFrom, busyTo, staffTo: to }] of [...helpers].sort((a, b) => a[0] - b[0])) {
    const exam = examById.get(toExamId)!;
    const room = roomById.get(places.get(toExamId)?.roomId ?? exam.roomId)!;
    const staffFrom = day.baseStaff(room, exam);
    const staffTo = to ?? day.helperStaff(room, exam)!;
    const change: StaffingChange = { type: 'staffing', toExamId, accession: exam.accession, from: input.staffOverrides?.[toExamId] ?? null, to: staffTo };
    changes.push(change);
    helperUses.push({ toExamId, accession: exam.accession, helperId: slot.helper.id, label: slot.helper.label, staffFrom, staffTo, roomId: room.id, busyFrom: day.toIso(busyFrom), busyTo: day.toIso(busyTo) });
  }
  const after = withChanges(input, changes);
  const judgedAfter = fixDay(after);
  // Isolation cases that end last in their room, having not been last before.
  const lastBefore = new Set(input.rooms.map((r) => judgedBefore(day, r.id)).filter((id): id is number => id !== null));
  for (const move of moves) {
    const exam = examById.get(move.examId)!;
    const slotsAfter = judgedAfter.judged(move.to.roomId).slots;
    if (exam.precaution !== 'none' && slotsAfter[slotsAfter.length - 1]?.exam.id === exam.id && !lastBefore.has(exam.id)) move.kind = 'isolation-last';
  }
  const remaining = remainingGaps(day, judgedAfter, tally.timeLimited, tally.neighbourhood);
  const ends = input.rooms.map((r) => judgedAfter.judged(r.id)).filter((r) => r.slots.length > 0).map((r) => r.endsMs);
  return {
    date: input.date,
    changes,
    moves,
    calls,
    helpers: helperUses,
    remaining,
    objective: {
      gapsLeft: remaining.length,
      examsMoved: moves.length,
      minutesMoved: moves.reduce((sum, m) => sum + m.minutesMoved, 0),
      dayEndsAt: ends.length ? day.toIso(Math.round((Math.max(...ends) - day.midnightMs) / 60_000)) : null,
      helpersAdded: helperUses.length,
    },
    before,
    after: judgedAfter.summary,
    solver: solverReport(tally, nothingToDo, milliseconds),
  };
}

function judgedBefore(day: FitDay, roomId: number): number | null {
  const exams = day.input.exams.filter((e) => e.roomId === roomId).map((e) => ({ id: e.id, at: day.minuteOf(e.start) }));
  exams.sort((a, b) => a.at - b.at || a.id - b.id);
  return exams.length ? exams[exams.length - 1]!.id : null;
}

