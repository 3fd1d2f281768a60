import { IANAZone, DateTime } from 'luxon';
import type { ExamListColumn, Mobility, Precaution } from './columns';
import { readHeader, type ExamListHeader } from './header';
import type { ExamListIssue, ExamListOptions, ExamListResult, ExamListRow } from './model';
import { CellProblem, examRowChecks, type Checked, type CheckedStart } from './cell-checks';
import { cellsByColumn, strayCells, trimmedCells } from './row-cells';
import { EXAM_FILE_LIMITS } from './file-limits';

/**
 * Checks the day's exam list, given as a table of cells with the header in `table[0]`, and
 * lists every problem of every row (row numbers as in a spreadsheet: header = 1). Cells are
 * trimmed; fully blank rows are skipped; a cell starting with `=`, `+`, `-` or `@` is plain text.
 * Any error refuses the whole file; `rows` then only feeds the preview. Only the first
 * `options.maxErrors` (default 200) errors are listed; `errorCount` counts them all.
 *
 * @throws RangeError when `options.date` is not a `YYYY-MM-DD` day or `options.timezone` is not
 *   an IANA zone: those come from the caller, not from the file.
 * @example
 * const result = parseExamTable(
 *   [['accession', 'room', 'start', 'duration_min', 'procedure'],
 *    ['A1', 'mr 1', '08:00', '30', 'MR knee']],
 *   { date: '2027-03-15', timezone: 'America/Chicago', roomNames: ['MR 1'] },
 * );
 * result.rows[0].room;  // 'MR 1'
 * result.rows[0].start; // '2027-03-15T08:00:00-05:00'
 */
export function parseExamTable(table: string[][], options: ExamListOptions): ExamListResult {
  assertOptions(options);
  if (table.length === 0 || isBlank(table[0])) {
    return { rows: [], errors: [{ row: 1, column: '', message: 'The first row must be the header, e.g. accession,room,start,duration_min,procedure.' }], errorCount: 1, warnings: [] };
  }
  const header = readHeader(table[0]);
  const checks = examRowChecks(options);
  const rows: ExamListRow[] = [];
  const maxErrors = options.maxErrors ?? EXAM_FILE_LIMITS.maxErrorsListed;
  const errors: ExamListIssue[] = header.errors.slice(0, maxErrors);
  let errorCount = header.errors.length;
  const warnings: ExamListIssue[] = [...header.warnings];
  const firstRowOfAccession = new Map<string, number>();
  let dataRows = 0;

  table.slice(1).forEach((rawCells, index) => {
    const row = index + 2;
    const cells = trimmedCells(rawCells);
    if (cells === null) return;
    dataRows += 1;
    const rowErrors = strayCells(cells, header, row);
    const record = cellsByColumn(cells, header);
    const problems = new RowProblems(row, header, rowErrors);
    const accessionValue = problems.take('accession', checks.accession(record.accession));
    const room = problems.take('room', checks.room(record.room));
    const start = problems.take('start', checks.start(record.start));
    const durationMinutes = problems.take('duration_min', checks.duration_min(record.duration_min));
    const procedure = problems.take('procedure', checks.procedure(record.procedure));
    const coil = problems.take('coil', checks.coil(record.coil));
    const precaution = problems.take('precaution', checks.precaution(record.precaution));
    const mobility = problems.take('mobility', checks.mobility(record.mobility));
    const contrast = problems.take('contrast', checks.contrast(record.contrast));
    const notes = problems.take('notes', checks.notes(record.notes));

    const accession = record.accession;
    const firstRow = firstRowOfAccession.get(accession);
    if (accession !== '' && firstRow !== undefined) {
      rowErrors.push({ row, column: 'accession', message: `Accession "${accession}" is already used on row ${firstRow}.` });
    } else if (accession !== '') {
      firstRowOfAccession.set(accession, row);
    }

    if (rowErrors.length > 0) {
      // A loop, not push(...spread): a row of a hundred thousand stray cells overflows the stack.
      for (const issue of sortByColumn(rowErrors, header)) {
        errorCount += 1;
        if (errors.length < maxErrors) errors.push(issue);
      }
    }
    if (problems.any || rowErrors.length > 0 || header.missing.length > 0) return;
    const checked = start as CheckedStart;
    if (checked.warning) warnings.push({ row, column: 'start', message: checked.warning });
    rows.push({
      row,
      accession: accessionValue as string,
      room: room as string,
      start: checked.start,
      durationMinutes: durationMinutes as number,
      procedure: procedure as string,
      coil: coil as string | null,
      precaution: precaution as Precaution,
      mobility: mobility as Mobility,
      contrast: contrast as boolean,
      notes: notes as string | null,
    });
  });

  if (dataRows === 0) {
    errorCount += 1;
    errors.push({ row: 1, column: '', message: 'The file has a header but no exams.' });
  }
  return { rows, errors, errorCount, warnings: warnings.slice(0, maxErrors) };
}

function assertOptions(options: ExamListOptions): void {
  if (!/^\d{4}-\d{2}-\d{2}$/.test(options.date) || !DateTime.fromISO(options.date).isValid) {
    throw new RangeError(`date must be a YYYY-MM-DD day; got "${options.date}".`);
  }
  if (!IANAZone.isValidZone(options.timezone)) {
    throw new RangeError(`timezone must be an IANA zone such as America/Chicago; got "${options.timezone}".`);
  }
}

function isBlank(cells: string[]): boolean {
  return cells.every((cell) => (cell ?? '').trim() === '');
}

/** Collects a row's cell problems as issues; a column the header lacks was reported once on row 1. */
class RowProblems {
  any = false;
  constructor(
    private readonly row: number,
    private readonly header: ExamListHeader,
    private readonly issues: ExamListIssue[],
  ) {}

  take<T>(column: ExamListColumn, result: Checked<T>): T | undefined {
    if (!(result instanceof CellProblem)) return result;
    this.any = true;
    if (!this.header.missing.includes(column)) this.issues.push({ row: this.row, column, message: result.message });
    return undefined;
  }
}

// Errors read left to right as the file shows them; the duplicate check runs last but belongs to accession.
function sortByColumn(issues: ExamListIssue[], header: ExamListHeader): ExamListIssue[] {
  const position = (issue: ExamListIssue) => header.positions[issue.column as ExamListColumn] ?? Number.MAX_SAFE_INTEGER;
  return [...issues].sort((a, b) => position(a) - position(b));
}
