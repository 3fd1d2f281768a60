import type { DayPlan, PlanGap, PlanRoom } from '@shared/api/plan';

/** A gap that needs looking at (any verdict but `fits`), with its room, for "next problem". */
export interface ProblemGap {
  gap: PlanGap;
  room: PlanRoom;
  /** When the exam after the gap starts, ms since the epoch: problems are walked in time order. */
  atMs: number;
}

/**
 * Every snug, short or overlapping gap of the day, in time order (then lane order): what the
 * summary counts and "N to check" counts, so both can lead to them one by one.
 *
 * @example
 * problemGaps(plan).map((p) => p.gap.toExamId); // [2, 21]
 */
export function problemGaps(plan: DayPlan): ProblemGap[] {
  const problems: ProblemGap[] = [];
  plan.rooms.forEach((room) => {
    const starts = new Map(room.exams.map((exam) => [exam.id, Date.parse(exam.start)]));
    for (const gap of room.gaps) if (gap.verdict !== 'fits') problems.push({ gap, room, atMs: starts.get(gap.toExamId) ?? 0 });
  });
  const lane = new Map(plan.rooms.map((room, index) => [room.id, index]));
  return problems.sort((a, b) => a.atMs - b.atMs || lane.get(a.room.id)! - lane.get(b.room.id)!);
}

/**
 * The problem after (`1`) or before (`-1`) the gap shown, wrapping round the day. When no problem
 * is shown: from `fromMs` (now, on today: the first still ahead, or the last gone by), else the
 * day's first (or last). Null when the day has none.
 *
 * @example
 * stepProblem(problems, null, 1, Date.now()); // the first problem gap whose exam has not started yet
 */
export function stepProblem(problems: readonly ProblemGap[], currentToExamId: number | null, direction: 1 | -1, fromMs: number | null = null): ProblemGap | null {
  if (problems.length === 0) return null;
  const index = problems.findIndex((problem) => problem.gap.toExamId === currentToExamId);
  if (index >= 0) return problems[(index + direction + problems.length) % problems.length];
  if (fromMs !== null) {
    const found = direction === 1 ? problems.find((p) => p.atMs >= fromMs) : [...problems].reverse().find((p) => p.atMs < fromMs);
    if (found) return found;
  }
  return direction === 1 ? problems[0] : problems[problems.length - 1];
}

/** A room's first problem gap, from `fromMs` (now, on today) when it has one still ahead. */
export function firstProblemIn(problems: readonly ProblemGap[], roomId: number, fromMs: number | null): ProblemGap | undefined {
  const inRoom = problems.filter((p) => p.room.id === roomId);
  return (fromMs === null ? undefined : inRoom.find((p) => p.atMs >= fromMs)) ?? inRoom[0];
}
