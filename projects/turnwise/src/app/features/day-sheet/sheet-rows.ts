import type { PlanExam, PlanGap, PlanRoom, PlanStep } from '@shared/api/plan';

/** A line of a room on the day sheet: an exam, or the turnover before one. */
export type SheetRow = { kind: 'exam'; exam: PlanExam } | { kind: 'turnover'; gap: PlanGap; from: string; to: string; before: string; steps: SheetStep[] };

/** A turnover step as printed: who does it counts from 1, as people say it. */
export interface SheetStep {
  step: PlanStep;
  person: number;
  /** The surface is still wet after the step ends. */
  drying: boolean;
}

/**
 * A room's exams in time order, each after the turnover that leads to it (the opening turnover
 * before the first exam). A room without a protocol has no gaps, so only its exams.
 *
 * @example
 * sheetRows(room).map((row) => row.kind); // ['turnover', 'exam', 'turnover', 'exam']
 */
export function sheetRows(room: PlanRoom): SheetRow[] {
  const exams = [...room.exams].sort((a, b) => Date.parse(a.start) - Date.parse(b.start));
  const byId = new Map(exams.map((exam) => [exam.id, exam]));
  const rows: SheetRow[] = [];
  for (const exam of exams) {
    const gap = room.gaps.find((candidate) => candidate.toExamId === exam.id);
    if (gap) {
      const from = gap.fromExamId === null ? room.opensAt : (byId.get(gap.fromExamId)?.end ?? room.opensAt);
      const steps = [...gap.steps]
        .sort((a, b) => Date.parse(a.start) - Date.parse(b.start) || a.person - b.person)
        .map((step) => ({ step, person: step.person + 1, drying: step.dryAt !== step.end }));
      rows.push({ kind: 'turnover', gap, from, to: exam.start, before: exam.accession, steps });
    }
    rows.push({ kind: 'exam', exam });
  }
  return rows;
}

/** A room long enough to start on a page of its own when printed; a shorter one is kept whole. */
export const LONG_ROOM_EXAMS = 6;
