import type { PlanExam, PlanGap, PlanRoom } from '@shared/api/plan';

/** One line of a room's card, in time order. */
export type RoomItem =
  | { kind: 'exam'; exam: PlanExam }
  /** `from` is null for the opening gap, between the room opening and its first exam. */
  | { kind: 'gap'; gap: PlanGap; from: PlanExam | null; to: PlanExam }
  /** Exams left out by the problem filter because every gap around them fits. */
  | { kind: 'hidden'; exams: number };

/**
 * A room's exams in order with each gap before the exam it leads to. With `onlyProblems`, keeps
 * the gaps that do not fit and the exams on either side of them, and says how many exams were
 * left out in between, so a filtered card still reads as a day.
 */
export function roomSequence(room: PlanRoom, onlyProblems = false): RoomItem[] {
  const exams = [...room.exams].sort((a, b) => Date.parse(a.start) - Date.parse(b.start) || a.id - b.id);
  const byId = new Map(exams.map((exam) => [exam.id, exam]));
  const gapBefore = new Map(room.gaps.map((gap) => [gap.toExamId, gap]));

  const all: RoomItem[] = [];
  for (const exam of exams) {
    const gap = gapBefore.get(exam.id);
    if (gap) all.push({ kind: 'gap', gap, from: gap.fromExamId === null ? null : (byId.get(gap.fromExamId) ?? null), to: exam });
    all.push({ kind: 'exam', exam });
  }
  if (!onlyProblems) return all;

  const problems = all.filter((item) => item.kind === 'gap' && item.gap.verdict !== 'fits');
  const kept = new Set<number>();
  for (const item of problems) {
    if (item.kind !== 'gap') continue;
    kept.add(item.to.id);
    if (item.from) kept.add(item.from.id);
  }

  const shown: RoomItem[] = [];
  let hidden = 0;
  for (const item of all) {
    const keep = item.kind === 'gap' ? problems.includes(item) : item.kind === 'exam' && kept.has(item.exam.id);
    if (!keep) {
      if (item.kind === 'exam') hidden += 1;
      continue;
    }
    if (hidden > 0) shown.push({ kind: 'hidden', exams: hidden });
    hidden = 0;
    shown.push(item);
  }
  if (hidden > 0 && shown.length > 0) shown.push({ kind: 'hidden', exams: hidden });
  return shown;
}

/** True when some gap of the room is snug, short or overlapping. */
export function hasProblemGap(room: PlanRoom): boolean {
  return room.gaps.some((gap) => gap.verdict !== 'fits');
}
