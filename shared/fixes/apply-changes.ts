import type { PlanChange } from '../api/changes';
import type { DayPlanInput } from '../turnover';

/**
 * The day-plan input with changes applied (exams moved, staffing set), without touching the
 * original: used to preview what a fix or a drag would do before anything is saved.
 *
 * @example
 * const after = computeDayPlan(withChanges(input, [{ type: 'move', examId: 7, accession: 'A7',
 *   from: { roomId: 1, start: '2027-03-15T09:00:00-05:00' }, to: { roomId: 1, start: '2027-03-15T09:10:00-05:00' } }]));
 */
export function withChanges(input: DayPlanInput, changes: readonly PlanChange[]): DayPlanInput {
  const moves = new Map<number, { roomId: number; start: string }>();
  const staffOverrides: Record<number, number> = { ...input.staffOverrides };
  for (const change of changes) {
    // Exams added, edited or cancelled by hand are never previewed: fixes and drags only move and staff.
    if (change.type === 'move') moves.set(change.examId, change.to);
    else if (change.type !== 'staffing') continue;
    else if (change.to === null) delete staffOverrides[change.toExamId];
    else staffOverrides[change.toExamId] = change.to;
  }
  const exams = input.exams.map((exam) => {
    const to = moves.get(exam.id);
    return to ? { ...exam, roomId: to.roomId, start: to.start } : exam;
  });
  return { ...input, exams, staffOverrides };
}
