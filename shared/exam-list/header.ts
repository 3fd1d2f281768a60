import { EXAM_LIST_COLUMNS, findColumn, type ExamListColumn } from './columns';
import type { ExamListIssue } from './model';

/**
 * What the header row says: where each known column sits, and what is wrong with it.
 *
 * @example
 * const header: ExamListHeader = readHeader(['accession', 'room']);
 * header.missing; // ['start', 'duration_min', 'procedure']
 */
export interface ExamListHeader {
  /** 0-based cell index of each column found. */
  positions: Partial<Record<ExamListColumn, number>>;
  /** Required columns the header lacks; their cells are not checked row by row. */
  missing: ExamListColumn[];
  /** Cell indexes with a header (known or not), so data anywhere else is a stray cell. */
  named: Set<number>;
  errors: ExamListIssue[];
  warnings: ExamListIssue[];
}

const HEADER_ROW = 1;

/**
 * Reads the header row: columns case-insensitive and in any order; an unknown column is
 * ignored with a warning; a missing required column or a repeated column is an error on row 1.
 *
 * @example
 * const header = readHeader(['Room', 'ACCESSION', 'start', 'duration_min', 'procedure', 'ward']);
 * header.positions.accession; // 1
 * header.warnings[0].message; // 'Column "ward" is not part of the exam list and was ignored.'
 */
export function readHeader(cells: string[]): ExamListHeader {
  const header: ExamListHeader = { positions: {}, missing: [], named: new Set(), errors: [], warnings: [] };
  cells.forEach((cell, index) => {
    const text = cell.replace(/^\uFEFF/, '').trim();
    if (text === '') return;
    header.named.add(index);
    const column = findColumn(text);
    if (!column) {
      header.warnings.push({ row: HEADER_ROW, column: text, message: `Column "${text}" is not part of the exam list and was ignored.` });
      return;
    }
    const earlier = header.positions[column.name];
    if (earlier !== undefined) {
      header.errors.push({
        row: HEADER_ROW,
        column: column.name,
        message: `Column ${column.name} appears twice (columns ${columnLetter(earlier)} and ${columnLetter(index)}); keep one.`,
      });
      return;
    }
    header.positions[column.name] = index;
  });

  const separator = guessOtherSeparator(cells);
  for (const column of EXAM_LIST_COLUMNS) {
    if (!column.required || header.positions[column.name] !== undefined) continue;
    header.missing.push(column.name);
    const hint = separator ? ` The header looks separated by "${separator}"; the file uses commas.` : '';
    header.errors.push({ row: HEADER_ROW, column: column.name, message: `Required column ${column.name} is missing.${hint}` });
  }
  return header;
}

/**
 * Spreadsheet letter of a 0-based column index, for naming cells the header does not name.
 *
 * @example
 * columnLetter(0);  // 'A'
 * columnLetter(27); // 'AB'
 */
export function columnLetter(index: number): string {
  let letters = '';
  for (let n = index + 1; n > 0; n = Math.floor((n - 1) / 26)) {
    letters = String.fromCharCode(65 + ((n - 1) % 26)) + letters;
  }
  return letters;
}

// A CSV saved with a European list separator arrives as one wide header cell.
function guessOtherSeparator(cells: string[]): string | undefined {
  const filled = cells.filter((cell) => cell.trim() !== '');
  if (filled.length !== 1) return undefined;
  return [';', '\t', '|'].find((separator) => filled[0].includes(separator));
}
