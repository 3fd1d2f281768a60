import { normaliseHeader } from '@shared/exam-list/columns';
import { columnLetter } from '@shared/exam-list/header';
import type { ExamListIssue } from '@shared/exam-list/model';

/** A cell of the refused file, with the problems found in it (none for a good cell). */
export interface MarkedCell {
  text: string;
  problems: string[];
}

/** A line of the refused file: its spreadsheet row number (header = 1) and its cells. */
export interface MarkedRow {
  row: number;
  cells: MarkedCell[];
  /** Problems with the row as a whole (or with a column the file does not have). */
  problems: string[];
}

/** The refused file with each problem pinned to the cell, row or header it is about. */
export interface MarkedTable {
  header: MarkedRow | null;
  rows: MarkedRow[];
  width: number;
}

/**
 * Pins every issue of a refused import to the cell it is about, so the screen can show the file
 * as the scheduler wrote it with the bad cells marked. A cell is found by its header (matched
 * the way the parser matches it) or by its spreadsheet letter for a column with no header.
 */
export function markRefusedTable(table: readonly (readonly string[])[], issues: readonly ExamListIssue[]): MarkedTable {
  const width = Math.max(0, ...table.map((cells) => cells.length));
  const lines: MarkedRow[] = table.map((cells, index) => ({
    row: index + 1,
    cells: Array.from({ length: width }, (_, column) => ({ text: cells[column] ?? '', problems: [] })),
    problems: [],
  }));
  const headerCells = (table[0] ?? []).map((cell) => normaliseHeader(cell));

  for (const issue of issues) {
    const line = lines[issue.row - 1];
    if (!line) continue;
    const column = columnIndex(issue.column, headerCells, width);
    if (column === null) line.problems.push(issue.message);
    else line.cells[column].problems.push(issue.message);
  }
  return { header: lines[0] ?? null, rows: lines.slice(1), width };
}

function columnIndex(column: string, headerCells: string[], width: number): number | null {
  if (column === '') return null;
  const byName = headerCells.indexOf(normaliseHeader(column));
  if (byName >= 0) return byName;
  for (let index = 0; index < width; index++) {
    if (columnLetter(index) === column.toUpperCase()) return index;
  }
  return null;
}
