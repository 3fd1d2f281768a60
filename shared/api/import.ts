import type { ExamListFieldChange } from '../exam-list/diff';
import type { ExamListIssue, ExamListRow } from '../exam-list/model';
import type { PlanSummary } from './plan';

/**
 * `POST /api/days/:date/exams/import` (multipart field `file`; `?dryRun=true` previews).
 * 200 with this body; 422 `{error, errors: ExamListIssue[], warnings}` when any row is bad.
 */
export interface ImportResult {
  dryRun: boolean;
  date: string;
  fileName: string;
  /** Rows in the file (exams on the new list). */
  imported: number;
  /** Accessions new to the day. */
  added: string[];
  /** Accessions already on the day whose fields change, with the file's column names and each change, day → file. */
  changed: { accession: string; fields: string[]; values: ExamListFieldChange[] }[];
  /** Accessions on the current list that the file drops. */
  removed: string[];
  unchanged: number;
  warnings: ExamListIssue[];
  /** The parsed rows, for the preview table. */
  rows: ExamListRow[];
  /** Verdict counts the new list has (dry run: would have). */
  summary: PlanSummary;
  /** The day's version the preview was computed at; send it back as `?dayVersion=` to commit. */
  dayVersion: number;
}

/** 422 body: every error by row and column, and the file's cells so the preview can mark them. */
export interface ImportRefusal {
  error: { code: string; message: string };
  /** The first problems (at most 200); `errorCount` counts them all. */
  errors: ExamListIssue[];
  errorCount?: number;
  warnings?: ExamListIssue[];
  /** The file as read (header first), at most the first 1,000 rows; absent when the file could not be read at all. */
  table?: string[][];
}
