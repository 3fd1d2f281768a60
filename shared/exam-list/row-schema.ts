import { z } from 'zod';
import { CellProblem, examRowChecks, type Checked } from './cell-checks';
import type { ExamListColumn } from './columns';
import type { ExamListOptions } from './model';

/**
 * One data row as trimmed text per column; a column the file lacks is `''`.
 *
 * @example
 * const cells: ExamListCells = { accession: 'A1', room: 'MR 1', start: '08:00', duration_min: '30',
 *   procedure: 'MR knee', coil: '', precaution: '', mobility: '', contrast: '', notes: '' };
 */
export type ExamListCells = Record<ExamListColumn, string>;

// Each column's rule lives in cell-checks; here it only becomes a zod issue.
function column<T>(check: (value: string) => Checked<T>) {
  return z.string().transform((value, ctx): T => {
    const result = check(value);
    if (!(result instanceof CellProblem)) return result;
    ctx.issues.push({ code: 'custom', message: result.message, input: undefined });
    return z.NEVER;
  });
}

/**
 * Builds the schema one data row is checked with, for callers that want zod's shape of the
 * result; {@link parseExamTable} applies the same checks directly. Every column is checked, so
 * a row reports all its problems at once; each issue's `path[0]` is the column.
 *
 * @example
 * const schema = examRowSchema({ date: '2027-03-15', timezone: 'America/Chicago', roomNames: ['MR 1'] });
 * schema.safeParse({ accession: 'A1', room: 'mr 1', start: '08:00', duration_min: '30',
 *   procedure: 'MR knee', coil: 'knee', precaution: '', mobility: '', contrast: 'no', notes: '' }).success; // true
 */
export function examRowSchema(options: ExamListOptions) {
  const checks = examRowChecks(options);
  return z.object({
    accession: column(checks.accession),
    room: column(checks.room),
    start: column(checks.start),
    duration_min: column(checks.duration_min),
    procedure: column(checks.procedure),
    coil: column(checks.coil),
    precaution: column(checks.precaution),
    mobility: column(checks.mobility),
    contrast: column(checks.contrast),
    notes: column(checks.notes),
  });
}
