import { IANAZone, DateTime } from 'luxon';
import { EXAM_LIST_COLUMNS, type ExamListColumn } from './columns';
import { columnLetter, readHeader, type ExamListHeader } from './header';
import type { ExamListIssue, ExamListOptions, ExamListResult, ExamListRow } from './model';
import { examRowSchema, type ExamListCells } from './row-schema';

/**
 * Checks the day's exam list, given as a table of cells with the header in `table[0]`, and
 * lists every problem of every row (row numbers as in a spreadsheet: header = 1). Cells are
 * trimmed; fully blank rows are skipped; a cell starting with `=`, `+`, `-` or `@` is plain text.
 * Any error refuses the whole file; `rows` then only feeds the preview.
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
    return { rows: [], errors: [{ row: 1, column: '', message: 'The first row must be the header, e.g. accession,room,start,duration_min,procedure.' }], warnings: [] };
  }
  const header = readHeader(table[0]);
  const schema = examRowSchema(options);
  const rows: ExamListRow[] = [];
  const errors: ExamListIssue[] = [...header.errors];
  const warnings: ExamListIssue[] = [...header.warnings];
  const firstRowOfAccession = new Map<string, number>();
  let dataRows = 0;

  table.slice(1).forEach((rawCells, index) => {
    const row = index + 2;
    const cells = rawCells.map((cell) => (cell ?? '').trim());
    if (isBlank(cells)) return;
    dataRows += 1;
    const rowErrors = strayCells(cells, header, row);

    const record = cellsByColumn(cells, header);
    const parsed = schema.safeParse(record);
    if (!parsed.success) {
      for (const issue of parsed.error.issues) {
        const column = String(issue.path[0] ?? '');
        if (!header.missing.includes(column as ExamListColumn)) rowErrors.push({ row, column, message: issue.message });
      }
    }
    const accession = record.accession;
    const firstRow = firstRowOfAccession.get(accession);
    if (accession !== '' && firstRow !== undefined) {
      rowErrors.push({ row, column: 'accession', message: `Accession "${accession}" is already used on row ${firstRow}.` });
    } else if (accession !== '') {
      firstRowOfAccession.set(accession, row);
    }

    errors.push(...sortByColumn(rowErrors, header));
    if (!parsed.success || rowErrors.length > 0 || header.missing.length > 0) return;
    const value = parsed.data;
    if (value.start.warning) warnings.push({ row, column: 'start', message: value.start.warning });
    rows.push({
      row,
      accession: value.accession,
      room: value.room,
      start: value.start.start,
      durationMinutes: value.duration_min,
      procedure: value.procedure,
      coil: value.coil,
      precaution: value.precaution,
      mobility: value.mobility,
      contrast: value.contrast,
      notes: value.notes,
    });
  });

  if (dataRows === 0) errors.push({ row: 1, column: '', message: 'The file has a header but no exams.' });
  return { rows, errors, warnings };
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

function cellsByColumn(cells: string[], header: ExamListHeader): ExamListCells {
  const record = {} as ExamListCells;
  for (const { name } of EXAM_LIST_COLUMNS) {
    const position = header.positions[name];
    record[name] = position === undefined ? '' : (cells[position] ?? '');
  }
  return record;
}

// Data under no header is usually a comma inside an unquoted value that shifted the row.
function strayCells(cells: string[], header: ExamListHeader, row: number): ExamListIssue[] {
  return cells.flatMap((cell, index) =>
    cell === '' || header.named.has(index)
      ? []
      : [{ row, column: columnLetter(index), message: `Cell ${columnLetter(index)}${row} holds "${cell.slice(0, 40)}" but its column has no header; a comma inside a value needs "quotes".` }],
  );
}

// Errors read left to right as the file shows them; the duplicate check runs last but belongs to accession.
function sortByColumn(issues: ExamListIssue[], header: ExamListHeader): ExamListIssue[] {
  const position = (issue: ExamListIssue) => header.positions[issue.column as ExamListColumn] ?? Number.MAX_SAFE_INTEGER;
  return [...issues].sort((a, b) => position(a) - position(b));
}
