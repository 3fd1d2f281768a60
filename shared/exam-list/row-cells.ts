/** How one data row's cells are read before their values are checked. */
import { columnLetter, type ExamListHeader } from './header';
import type { ExamListColumn } from './columns';
import type { ExamListIssue } from './model';

/**
 * One data row as trimmed text per column; a column the file lacks is `''`.
 *
 * @example
 * const cells: ExamListCells = { accession: 'A1', room: 'MR 1', start: '08:00', duration_min: '30',
 *   procedure: 'MR knee', coil: '', precaution: '', mobility: '', contrast: '', notes: '' };
 */
export type ExamListCells = Record<ExamListColumn, string>;

/**
 * A data row's cells trimmed (a missing cell as `''`), or null for a blank row.
 *
 * @example
 * trimmedCells([' A1 ', 'MR 1']); // ['A1', 'MR 1']
 * trimmedCells(['', '  ']);      // null
 */
export function trimmedCells(rawCells: string[]): string[] | null {
  const cells = new Array<string>(rawCells.length);
  let blank = true;
  for (let i = 0; i < rawCells.length; i++) {
    cells[i] = (rawCells[i] ?? '').trim();
    if (cells[i] !== '') blank = false;
  }
  return blank ? null : cells;
}

/**
 * A row's cells by column name, `''` for a column the header lacks. Written out rather than
 * looped over the columns: one object shape for every row is faster.
 *
 * @example
 * cellsByColumn(['MR 1', 'A1'], readHeader(['room', 'accession'])).accession; // 'A1'
 */
export function cellsByColumn(cells: string[], { positions: at }: ExamListHeader): ExamListCells {
  return {
    accession: cellAt(cells, at.accession),
    room: cellAt(cells, at.room),
    start: cellAt(cells, at.start),
    duration_min: cellAt(cells, at.duration_min),
    procedure: cellAt(cells, at.procedure),
    coil: cellAt(cells, at.coil),
    precaution: cellAt(cells, at.precaution),
    mobility: cellAt(cells, at.mobility),
    contrast: cellAt(cells, at.contrast),
    notes: cellAt(cells, at.notes),
  };
}

function cellAt(cells: string[], position: number | undefined): string {
  return position === undefined ? '' : (cells[position] ?? '');
}

/**
 * An error for each filled cell under no header: usually a comma inside an unquoted value that
 * shifted the row.
 *
 * @example
 * strayCells(['A1', 'left'], readHeader(['accession']), 2)[0].message;
 * // 'Cell B2 holds "left" but its column has no header; a comma inside a value needs "quotes".'
 */
export function strayCells(cells: string[], header: ExamListHeader, row: number): ExamListIssue[] {
  const issues: ExamListIssue[] = [];
  for (let index = 0; index < cells.length; index++) {
    const cell = cells[index];
    if (cell === '' || header.named.has(index)) continue;
    issues.push({ row, column: columnLetter(index), message: `Cell ${columnLetter(index)}${row} holds "${cell.slice(0, 40)}" but its column has no header; a comma inside a value needs "quotes".` });
  }
  return issues;
}
