import type { PlanChange } from '../api/changes';
import type { PlanSummary, Verdict } from '../api/plan';

export const FIX_KINDS = ['push-later', 'other-room', 'add-helper', 'isolation-last'] as const;
export type FixKind = (typeof FIX_KINDS)[number];

/** A proposed fix for one `short` or `overlap` gap, with its effect computed before it is applied. */
export interface Fix {
  /** Stable for the same plan: `${kind}:${toExamId}`. */
  id: string;
  kind: FixKind;
  /** The arriving exam of the problem gap. */
  toExamId: number;
  title: string;
  /** What it does to the day, in words (cascade, day end, still short…). */
  detail: string;
  changes: PlanChange[];
  effect: {
    /** The problem gap's verdict afterwards (the gap before `toExamId`, or the gap it moved into). */
    verdictAfter: Verdict;
    shortByAfter: number;
    /** Gaps that are `short`/`overlap` afterwards but were not before. */
    newProblems: number;
    /** Last exam end of the rooms it touches, before and after. */
    dayEndsBefore: string;
    dayEndsAfter: string;
    summaryAfter: PlanSummary;
  };
}
