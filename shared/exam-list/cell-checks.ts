import { CONTRAST_SPELLINGS, EXAM_LIST_LIMITS as LIMITS, MOBILITIES, PRECAUTIONS, type ExamListColumn, type Mobility, type Precaution } from './columns';
import { resolveStart } from './start-time';
import type { ExamListOptions } from './model';

/**
 * What is wrong with one cell, worded for the user. A class rather than a tagged object so a
 * good cell costs no allocation: a 10,000-row file checks 100,000 cells.
 *
 * @example
 * const problem = new CellProblem('room is required.');
 * problem.message; // 'room is required.'
 */
export class CellProblem {
  constructor(readonly message: string) {}
}

/**
 * A checked cell: its typed value, or the problem that refuses it.
 *
 * @example
 * const minutes: Checked<number> = examRowChecks(options).duration_min('30'); // 30
 */
export type Checked<T> = T | CellProblem;

/** A start cell read on the day being imported, with the warning a repeated fall-back time carries. */
export interface CheckedStart {
  start: string;
  warning?: string;
}

/**
 * The check of every column of a data row, keyed and ordered as the file's columns. Each takes
 * the trimmed cell (`''` when empty or when the file lacks the column).
 */
export interface ExamRowChecks {
  accession(value: string): Checked<string>;
  room(value: string): Checked<string>;
  start(value: string): Checked<CheckedStart>;
  duration_min(value: string): Checked<number>;
  procedure(value: string): Checked<string>;
  coil(value: string): Checked<string | null>;
  precaution(value: string): Checked<Precaution>;
  mobility(value: string): Checked<Mobility>;
  contrast(value: string): Checked<boolean>;
  notes(value: string): Checked<string | null>;
}

/**
 * Builds the column checks for one file: the rules behind {@link parseExamTable}, each
 * remembering its answers (a day list repeats its rooms, coils and times).
 *
 * @example
 * const checks = examRowChecks({ date: '2027-03-15', timezone: 'America/Chicago', roomNames: ['MR 1'] });
 * checks.room('mr  1');                      // 'MR 1'
 * (checks.duration_min('4') as CellProblem).message;
 * // 'duration_min must be whole minutes from 5 to 480; got "4".'
 */
export function examRowChecks(options: ExamListOptions): ExamRowChecks {
  return {
    accession: (value) => requiredText('accession', value, LIMITS.accessionMaxChars),
    room: roomCheck(options.roomNames),
    start: startCheck(options),
    duration_min: duration,
    procedure: (value) => requiredText('procedure', value, LIMITS.procedureMaxChars),
    coil: (value) => optionalText('coil', value, LIMITS.coilMaxChars),
    precaution: (value) => oneOf('precaution', PRECAUTIONS, 'none', value),
    mobility: (value) => oneOf('mobility', MOBILITIES, 'ambulatory', value),
    contrast,
    notes: (value) => optionalText('notes', value, LIMITS.notesMaxChars),
  };
}

// Cells are echoed in messages so the user can find them; a long note would drown the message.
function quote(value: string): string {
  return value.length > 40 ? `"${value.slice(0, 37)}…"` : `"${value}"`;
}

function withinLimit(column: ExamListColumn, value: string, maxChars: number): Checked<string> {
  // UTF-16 units never undercount code points, so a short value needs no counting.
  if (value.length <= maxChars) return value;
  // Counted in code points so an accented or emoji character counts once, as the user sees it.
  const length = [...value].length;
  return length > maxChars ? new CellProblem(`${column} is ${length} characters long; the limit is ${maxChars}.`) : value;
}

function requiredText(column: ExamListColumn, value: string, maxChars: number): Checked<string> {
  return value === '' ? new CellProblem(`${column} is required.`) : withinLimit(column, value, maxChars);
}

function optionalText(column: ExamListColumn, value: string, maxChars: number): Checked<string | null> {
  return value === '' ? null : withinLimit(column, value, maxChars);
}

function oneOf<T extends string>(column: ExamListColumn, values: readonly T[], empty: T, value: string): Checked<T> {
  if (value === '') return empty;
  const lower = value.toLowerCase();
  const match = values.find((allowed) => allowed === lower);
  return match ?? new CellProblem(`${column} must be one of ${values.join(', ')}; got ${quote(value)}.`);
}

function contrast(value: string): Checked<boolean> {
  const lower = value.toLowerCase();
  if (lower === '' || (CONTRAST_SPELLINGS.no as readonly string[]).includes(lower)) return false;
  if ((CONTRAST_SPELLINGS.yes as readonly string[]).includes(lower)) return true;
  return new CellProblem(`contrast must be yes or no; got ${quote(value)}.`);
}

function duration(value: string): Checked<number> {
  if (value === '') return new CellProblem('duration_min is required.');
  const minutes = /^\d+$/.test(value) ? Number(value) : NaN;
  if (!(minutes >= LIMITS.durationMinMinutes && minutes <= LIMITS.durationMaxMinutes)) {
    return new CellProblem(`duration_min must be whole minutes from ${LIMITS.durationMinMinutes} to ${LIMITS.durationMaxMinutes}; got ${quote(value)}.`);
  }
  return minutes;
}

function roomCheck(roomNames: string[]): (value: string) => Checked<string> {
  // Spaces are collapsed too, so "MR  2" typed with a double space still finds "MR 2".
  const key = (name: string) => name.trim().replace(/\s+/g, ' ').toLowerCase();
  const byKey = new Map(roomNames.map((name) => [key(name), name]));
  const known = roomNames.length > 0 ? `Known rooms: ${[...roomNames].sort().join(', ')}.` : 'No rooms are set up yet.';
  // A day list names the same few rooms on every row; each spelling is looked up once.
  const checked = new Map<string, Checked<string>>();
  return (value) => {
    if (value === '') return new CellProblem('room is required.');
    let result = checked.get(value);
    if (result === undefined) {
      result = byKey.get(key(value)) ?? new CellProblem(`Room ${quote(value)} is not set up. ${known}`);
      checked.set(value, result);
    }
    return result;
  };
}

function startCheck(options: ExamListOptions): (value: string) => Checked<CheckedStart> {
  // A day list repeats the same few hundred start times; resolving each once keeps big files fast.
  const checked = new Map<string, Checked<CheckedStart>>();
  return (value) => {
    if (value === '') return new CellProblem('start is required.');
    let result = checked.get(value);
    if (result === undefined) {
      const resolved = resolveStart(value, options);
      result = resolved.ok ? { start: resolved.start, warning: resolved.warning } : new CellProblem(resolved.message);
      checked.set(value, result);
    }
    return result;
  };
}
