import type { PlanChangeRecord } from '@shared/api/changes';

/**
 * The exams whose latest change is the booking feed's move over someone's hand change (the
 * history's `afterManualChange`), so the timeline can mark them. A later change to the exam, by
 * hand or by the feed, clears the mark; an undone change does not count.
 *
 * @example
 * movedByBookingSystem(history.changes); // Set { 41 } when the newest change to exam 41 is flagged
 */
export function movedByBookingSystem(changes: readonly PlanChangeRecord[]): ReadonlySet<number> {
  const seen = new Set<number>();
  const flagged = new Set<number>();
  // newest first, as the history answers
  for (const record of changes) {
    if (record.undone) continue;
    for (const change of record.changes) {
      const examId = change.type === 'move' || change.type === 'exam' ? change.examId : null;
      if (examId === null || seen.has(examId)) continue;
      seen.add(examId);
      if (record.afterManualChange) flagged.add(examId);
    }
  }
  return flagged;
}
