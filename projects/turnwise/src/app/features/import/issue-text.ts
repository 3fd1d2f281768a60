import type { ExamListIssue } from '@shared/exam-list/model';

/**
 * An issue as one line, the column named once: "Row 3, duration_min: must be whole minutes …".
 * The file checks write some messages as a sentence about the column ("duration_min must be …"),
 * which after "Row 3, duration_min" would say the column twice; only that leading repeat goes.
 *
 * @example
 * issueLine({ row: 3, column: 'duration_min', message: 'duration_min must be whole minutes from 5 to 480; got "4".' });
 * // { where: 'Row 3, duration_min', message: 'must be whole minutes from 5 to 480; got "4".' }
 */
export function issueLine(issue: ExamListIssue): { where: string; message: string } {
  const where = issue.column ? `Row ${issue.row}, ${issue.column}` : `Row ${issue.row}`;
  const repeated = issue.column && issue.message.startsWith(`${issue.column} `);
  return { where, message: repeated ? issue.message.slice(issue.column.length + 1) : issue.message };
}
