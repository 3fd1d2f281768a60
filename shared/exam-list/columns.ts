/**
 * The columns of the exam-list file (product brief, "Exam list file (ours)") and their value
 * sets. Kept free of Node APIs so the Import screen can show the same definitions.
 */

// The value sets are the engine's own, so the file and the turnover model cannot drift apart.
import { MOBILITIES, PRECAUTIONS, type Mobility, type Precaution } from '../turnover/model';

export { MOBILITIES, PRECAUTIONS, type Mobility, type Precaution };

/**
 * Spellings of the `contrast` column, compared case-insensitively. `yes`/`no` is the
 * documented form; the others are what spreadsheets and other systems commonly write.
 *
 * @example
 * CONTRAST_SPELLINGS.yes.includes('true'); // true
 */
export const CONTRAST_SPELLINGS = {
  yes: ['yes', 'y', 'true', '1'],
  no: ['no', 'n', 'false', '0'],
} as const;

/**
 * Length and range limits of the file's cells.
 *
 * @example
 * EXAM_LIST_LIMITS.notesMaxChars; // 500
 */
export const EXAM_LIST_LIMITS = {
  accessionMaxChars: 64,
  procedureMaxChars: 200,
  coilMaxChars: 64,
  notesMaxChars: 500,
  durationMinMinutes: 5,
  durationMaxMinutes: 480,
} as const;

/**
 * Definition of one column of the exam-list file.
 *
 * @example
 * const coil: ExamListColumnDefinition = { name: 'coil', required: false, description: 'Coil code.' };
 */
export interface ExamListColumnDefinition {
  /** Header as written in the file, after normalisation (see {@link normaliseHeader}). */
  readonly name: ExamListColumn;
  readonly required: boolean;
  /** One line for the Import screen's help. */
  readonly description: string;
}

/**
 * Name of a column of the exam-list file.
 *
 * @example
 * const c: ExamListColumn = 'duration_min';
 */
export type ExamListColumn =
  | 'accession'
  | 'room'
  | 'start'
  | 'duration_min'
  | 'procedure'
  | 'coil'
  | 'precaution'
  | 'mobility'
  | 'contrast'
  | 'notes';

/**
 * The columns in their documented order. The file may hold them in any order.
 *
 * @example
 * EXAM_LIST_COLUMNS.filter((c) => c.required).map((c) => c.name);
 * // ['accession', 'room', 'start', 'duration_min', 'procedure']
 */
export const EXAM_LIST_COLUMNS: readonly ExamListColumnDefinition[] = [
  { name: 'accession', required: true, description: 'Exam reference from your own systems; unique within the day.' },
  { name: 'room', required: true, description: 'A room name as set up, e.g. MR 2.' },
  { name: 'start', required: true, description: 'HH:MM site time on the day being imported, or ISO 8601 with an offset.' },
  { name: 'duration_min', required: true, description: `Whole minutes, ${EXAM_LIST_LIMITS.durationMinMinutes}–${EXAM_LIST_LIMITS.durationMaxMinutes}.` },
  { name: 'procedure', required: true, description: `Free text, up to ${EXAM_LIST_LIMITS.procedureMaxChars} characters.` },
  { name: 'coil', required: false, description: 'Coil code, e.g. head, spine, knee.' },
  { name: 'precaution', required: false, description: `One of ${PRECAUTIONS.join(', ')}; empty means none.` },
  { name: 'mobility', required: false, description: `One of ${MOBILITIES.join(', ')}; empty means ambulatory.` },
  { name: 'contrast', required: false, description: 'yes or no; empty means no.' },
  { name: 'notes', required: false, description: `Free text, up to ${EXAM_LIST_LIMITS.notesMaxChars} characters.` },
];

/**
 * Normalises a header cell for matching: trims, drops a byte-order mark, lower-cases, and
 * treats runs of spaces or hyphens as `_`, so `Duration Min` and `duration-min` both match.
 *
 * @example
 * normaliseHeader(' \uFEFFDuration Min '); // 'duration_min'
 */
export function normaliseHeader(cell: string): string {
  return cell
    .replace(/^\uFEFF/, '')
    .trim()
    .toLowerCase()
    .replace(/[\s-]+/g, '_');
}

/**
 * Finds the column definition a header cell names, if any.
 *
 * @example
 * findColumn('ROOM')?.required; // true
 * findColumn('patient');        // undefined
 */
export function findColumn(headerCell: string): ExamListColumnDefinition | undefined {
  const name = normaliseHeader(headerCell);
  return EXAM_LIST_COLUMNS.find((column) => column.name === name);
}
