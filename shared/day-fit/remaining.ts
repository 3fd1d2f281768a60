import type { FixDay } from '../fixes/fix-day';
import type { DayPlanExam } from '../turnover/day-plan-input';
import { isProblemVerdict } from '../fixes/room-gaps';
import type { FitDay } from './instance';
import type { FitRemainingGap } from './model';

const FIXED_WORDS: Readonly<Record<string, string>> = {
  arrived: 'has arrived',
  started: 'has started',
  pinned: 'is pinned',
  passed: 'is past its start time',
  'outside-hours': 'is outside its room’s hours',
};

/**
 * The gaps still `short` or `overlap` after the proposal, each with the reason it stays: a room
 * that cannot hold its exams and their turnovers within its hours, exams that may not move, a
 * room without model (closed, no protocol), or the solver's time running out.
 *
 * @example
 * remainingGaps(day, fixDay(after), false)[0].reason; // 'CT 2 cannot fit 14 exams between 07:00 and 19:00 …'
 */
export function remainingGaps(day: FitDay, after: FixDay, timeLimited: boolean, neighbourhood = false): FitRemainingGap[] {
  const { input } = day;
  const stays = new Map<number, string>();
  const modelled = new Set<number>();
  for (const group of day.groups) {
    for (const r of group.rooms) modelled.add(r.room.id);
    for (const fe of group.exams) if (fe.stays && fe.stays !== 'proposed') stays.set(fe.exam.id, fe.stays);
  }
  const byId = new Map(input.exams.map((e) => [e.id, e]));
  const clock = (ms: number) => day.toIso(Math.round((ms - day.midnightMs) / 60_000)).slice(11, 16);
  const out: FitRemainingGap[] = [];
  for (const room of input.rooms) {
    const judged = after.judged(room.id);
    const problems = judged.gaps.filter((g) => isProblemVerdict(g.verdict));
    if (problems.length === 0) continue;
    const group = day.groups.find((g) => g.rooms.some((r) => r.room.id === room.id));
    const fitRoom = group?.rooms.find((r) => r.room.id === room.id);
    let capacity: string | null = null;
    if (fitRoom) {
      const open = fitRoom.close - fitRoom.open;
      const need = judged.gaps.reduce((sum, g) => sum + g.requiredMinutes, 0) + judged.slots.reduce((sum, s) => sum + byId.get(s.exam.id)!.durationMinutes, 0);
      if (need > open) {
        capacity = `${room.name} cannot fit ${judged.slots.length} exams between ${clock(judged.opensMs)} and ${clock(judged.opensMs + open * 60_000)}: they and their turnovers need ${need} min, the room is open ${open} min`;
      }
    }
    for (const gap of problems) {
      const to = byId.get(gap.toExamId)!;
      const from = gap.fromExamId === null ? null : byId.get(gap.fromExamId)!;
      let reason: string;
      if (!modelled.has(room.id)) reason = room.closed ? `${room.name} is closed on this day` : `${room.name} has no protocol for ${room.modality}`;
      else if (capacity) reason = capacity;
      else if (stays.has(to.id) && (from === null || stays.has(from.id))) reason = neitherMayMove(from, to, stays)!;
      else if (timeLimited) reason = 'the solver’s time ran out before it found a way to clear this gap';
      else if (neighbourhood) reason = `not cleared by moving exams near it (up to 3 on either side, 180 min, among ${room.name}’s block of four rooms); a day this size is not searched whole`;
      else reason = `no place in the open ${room.modality} rooms’ hours clears this gap without moving an exam that may not move`;
      out.push({ fromExamId: gap.fromExamId, toExamId: gap.toExamId, accession: to.accession, roomId: room.id, verdict: gap.verdict, shortByMinutes: gap.shortByMinutes, reason });
    }
  }
  return out;
}

/**
 * Why a gap stays when neither of its exams may move ("neither exam may move: A-1 has arrived,
 * A-2 is pinned"); null when one of them may.
 *
 * @example
 * neitherMayMove(a, b, new Map([[a.id, 'arrived'], [b.id, 'pinned']])); // 'neither exam may move: A-1 has arrived, A-2 is pinned'
 */
export function neitherMayMove(from: DayPlanExam | null, to: DayPlanExam, stays: ReadonlyMap<number, string>): string | null {
  if (!stays.has(to.id) || (from !== null && !stays.has(from.id))) return null;
  return from
    ? `neither exam may move: ${from.accession} ${FIXED_WORDS[stays.get(from.id)!]}, ${to.accession} ${FIXED_WORDS[stays.get(to.id)!]}`
    : `${to.accession} ${FIXED_WORDS[stays.get(to.id)!]} and starts too soon after the room opens`;
}
