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

/** Most problem gaps one `GET /api/days/:date/fixes` call covers (its `limit`, and the default). */
export const MAX_FIX_GAPS_PER_CALL = 20;

/**
 * A page ends early, after the gap that reaches this many changes in its fixes (a push on a
 * crowded list carries its whole cascade): the answer stays a few hundred kilobytes at most.
 */
export const MAX_FIX_CHANGES_PER_CALL = 2000;

/** `GET /api/days/:date/fixes` without `gap`: one page of the day's fixes. */
export interface FixesPage {
  /** The fixes of the gaps covered, gap by gap in plan order. */
  fixes: Fix[];
  /** The problem gaps this page covers (`toExamId`s), including those with no fix. */
  gaps: number[];
  /** `short` and `overlap` gaps in the whole day. */
  problemGaps: number;
  /** Pass as `after` for the next page; null on the last. */
  next: number | null;
}
