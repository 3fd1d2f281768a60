import type { Mobility, Precaution } from './columns';

/**
 * One valid exam of the file, ready to store.
 *
 * @example
 * const row: ExamListRow = { row: 2, accession: 'A1', room: 'MR 1', start: '2027-03-15T08:00:00-05:00',
 *   durationMinutes: 30, procedure: 'MR knee', coil: 'knee', precaution: 'none', mobility: 'ambulatory',
 *   contrast: false, notes: null };
 */
export interface ExamListRow {
  /** Row as the user sees it in a spreadsheet: header = 1, first exam = 2. */
  row: number;
  accession: string;
  /** The room's canonical name as set up, whatever case the file used. */
  room: string;
  /** ISO 8601 with the site's offset on that instant, e.g. `2027-03-14T08:30:00-05:00`. */
  start: string;
  durationMinutes: number;
  procedure: string;
  coil: string | null;
  precaution: Precaution;
  mobility: Mobility;
  contrast: boolean;
  notes: string | null;
}

/**
 * A problem with one cell (or, with `column: ''`, with a whole row or the whole file).
 *
 * @example
 * const issue: ExamListIssue = { row: 4, column: 'duration_min', message: 'duration_min must be whole minutes from 5 to 480; got "4".' };
 */
export interface ExamListIssue {
  row: number;
  /** The file's column name (e.g. `duration_min`), a spreadsheet letter for an unnamed column, or `''`. */
  column: string;
  message: string;
}

/**
 * Outcome of reading a file. Any error means the whole file is refused: `rows` then holds only
 * the rows that were valid on their own, for the preview, and must not be stored.
 *
 * @example
 * const { rows, errors } = parseExamTable(table, options);
 * if (errors.length > 0) throw new ValidationError('The exam list has errors.', errors);
 */
export interface ExamListResult {
  rows: ExamListRow[];
  /** The first problems, in file order (at most `maxErrors`). */
  errors: ExamListIssue[];
  /** How many problems the file has in all; more than `errors.length` when the list was cut. */
  errorCount: number;
  warnings: ExamListIssue[];
}

/**
 * What the file's contents are read against: the day being imported and the site's rooms.
 *
 * @example
 * const options: ExamListOptions = { date: '2027-03-15', timezone: 'America/Chicago', roomNames: ['MR 1', 'CT 1'] };
 */
export interface ExamListOptions {
  /** The day being imported, `YYYY-MM-DD`, in the site's zone. */
  date: string;
  /** The site's IANA zone, e.g. `America/Chicago`. */
  timezone: string;
  /** Room names as set up; matched case-insensitively. */
  roomNames: string[];
  /** Errors listed before the rest are only counted; default `EXAM_FILE_LIMITS.maxErrorsListed`. */
  maxErrors?: number;
}
