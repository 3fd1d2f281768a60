import type { MoveReason } from '@shared/api/limits';
import type { PlanExam, PlanRoom } from '@shared/api/plan';

import { siteClock } from '../../shared/ui/site-time';
import { verdictWords } from './gap-view';

/** A slot being moved and not yet saved: by pointer (`drag`) or arrow keys (`keyboard`). */
export interface PendingMove {
  exam: PlanExam;
  roomId: number;
  startMs: number;
  reason: MoveReason;
}

const MINUTE = 60_000;

/**
 * The next lane up (`-1`) or down (`1`) from `roomId` that takes the exam: a slot only moves
 * between rooms of its own modality, so other lanes are skipped. Null when there is none.
 */
export function nextLane(rooms: readonly PlanRoom[], roomId: number, modality: string, direction: -1 | 1): number | null {
  const index = rooms.findIndex((room) => room.id === roomId);
  for (let i = index + direction; i >= 0 && i < rooms.length; i += direction) {
    if (rooms[i].modality === modality) return rooms[i].id;
  }
  return null;
}

/**
 * The rooms with the slot moved but no gaps recomputed: what the lanes show while dragging
 * when the engine cannot preview (e.g. room details still loading), so the block still follows.
 */
export function movedWithoutGaps(rooms: readonly PlanRoom[], move: PendingMove, start: string, end: string): PlanRoom[] {
  return rooms.map((room) => {
    const touched = room.id === move.roomId || room.exams.some((exam) => exam.id === move.exam.id);
    if (!touched) return room;
    const exams = room.exams.filter((exam) => exam.id !== move.exam.id);
    if (room.id === move.roomId) exams.push({ ...move.exam, roomId: room.id, start, end });
    exams.sort((a, b) => Date.parse(a.start) - Date.parse(b.start));
    return { ...room, exams, gaps: [] };
  });
}

/** "ACC-2 to MR 1 at 08:55 — before: fits; after: short by 4 min", read out while moving. */
export function moveStatus(move: PendingMove, room: PlanRoom | undefined): string {
  const at = room?.exams.find((exam) => exam.id === move.exam.id);
  if (!room || !at) return '';
  const before = room.gaps.find((gap) => gap.toExamId === move.exam.id);
  const after = room.gaps.find((gap) => gap.fromExamId === move.exam.id);
  const parts = [`${move.exam.accession} to ${room.name} at ${siteClock(at.start)}`];
  if (before) parts.push(`gap before: ${verdictWords(before)}`);
  if (after) parts.push(`gap after: ${verdictWords(after)}`);
  return parts.join(' — ');
}

/** Keeps a slot inside the drawn day, whole 5-minute steps included. */
export function clampStart(startMs: number, durationMinutes: number, range: { startMs: number; endMs: number }): number {
  return Math.min(Math.max(startMs, range.startMs), range.endMs - durationMinutes * MINUTE);
}
