/**
 * The roster file (ours): a CSV (UTF-8, header row) or the first sheet of an .xlsx, one row per
 * named person or per count of anonymous people. Columns, case-insensitive, any order:
 *
 * | column | required | values |
 * | --- | --- | --- |
 * | `name` | no | a person's name; empty for a count of anonymous people |
 * | `role` | yes | `technologist` or `aide` |
 * | `count` | no | people the row stands for, 1–20 (default 1; a named row is 1) |
 * | `start`, `end` | yes | the shift, `HH:MM` site time; the end after the start |
 * | `breaks` | no | `HH:MM-HH:MM`, several separated by `;` (e.g. `11:00-11:30; 13:00-13:10`) |
 * | `rooms` | yes | room names as set up, separated by `+` or `;` (e.g. `MR 1 + MR 2`) |
 *
 * A file with any bad row is refused whole, every problem named by row and column, as the exam
 * list is; nothing is half-imported.
 */
import type { RowProblem } from '../api/errors';
import { ROSTER_LIMITS, rosterRowSchema, type RosterRow } from '../api/roster';

export const ROSTER_FILE_COLUMNS = ['name', 'role', 'count', 'start', 'end', 'breaks', 'rooms'] as const;
type RosterColumn = (typeof ROSTER_FILE_COLUMNS)[number];
const REQUIRED: readonly RosterColumn[] = ['role', 'start', 'end', 'rooms'];

/** A schema path's first key, as the file's column. */
const COLUMN_OF: Readonly<Record<string, RosterColumn>> = { name: 'name', role: 'role', count: 'count', start: 'start', end: 'end', breaks: 'breaks', roomIds: 'rooms' };

export type RosterFileResult = { rows: RosterRow[]; errors?: undefined } | { rows?: undefined; errors: RowProblem[] };

/**
 * Reads a roster file's cells (`table[0]` the header; row numbers as the spreadsheet shows them,
 * the header being row 1) against the site's rooms in use.
 *
 * @example
 * parseRosterTable([['role', 'count', 'start', 'end', 'rooms'], ['aide', '3', '07:00', '15:00', 'MR 1 + MR 2']], rooms);
 * // { rows: [{ name: null, role: 'aide', count: 3, start: '07:00', end: '15:00', breaks: [], roomIds: [1, 2] }] }
 */
export function parseRosterTable(table: readonly (readonly string[])[], rooms: readonly { id: number; name: string }[]): RosterFileResult {
  const errors: RowProblem[] = [];
  const header = (table[0] ?? []).map((cell) => cell.trim().toLowerCase().replace(/[\s-]+/g, '_'));
  const at = new Map<RosterColumn, number>();
  header.forEach((cell, i) => {
    if ((ROSTER_FILE_COLUMNS as readonly string[]).includes(cell)) {
      if (at.has(cell as RosterColumn)) errors.push({ row: 1, column: cell, message: `the column "${cell}" appears twice` });
      else at.set(cell as RosterColumn, i);
    } else if (cell !== '') errors.push({ row: 1, column: table[0]![i]!, message: `unknown column (use ${ROSTER_FILE_COLUMNS.join(', ')})` });
  });
  for (const column of REQUIRED) if (!at.has(column)) errors.push({ row: 1, column, message: 'a required column is missing' });
  if (errors.length > 0) return { errors };

  const roomByName = new Map(rooms.map((room) => [room.name.trim().toLowerCase(), room.id]));
  const rows: RosterRow[] = [];
  const seenNames = new Map<string, number>();
  table.slice(1).forEach((cells, index) => {
    const row = index + 2;
    const cell = (column: RosterColumn) => (at.has(column) ? (cells[at.get(column)!] ?? '').trim() : '');
    if (ROSTER_FILE_COLUMNS.every((column) => cell(column) === '')) return; // a blank line
    const problem = (column: string, message: string) => errors.push({ row, column, message });

    const roomIds: number[] = [];
    for (const name of cell('rooms').split(/[+;]/).map((n) => n.trim()).filter((n) => n !== '')) {
      const id = roomByName.get(name.toLowerCase());
      if (id === undefined) problem('rooms', `no room "${name}" is set up (or it is retired)`);
      else if (!roomIds.includes(id)) roomIds.push(id);
    }
    const breaks: { start: string; end: string }[] = [];
    for (const text of cell('breaks').split(';').map((b) => b.trim()).filter((b) => b !== '')) {
      const match = /^(\d{1,2}:\d{2})\s*[-–]\s*(\d{1,2}:\d{2})$/.exec(text);
      if (!match) problem('breaks', `"${text}" is not a break: use HH:MM-HH:MM, several separated by ;`);
      else breaks.push({ start: match[1]!.padStart(5, '0'), end: match[2]!.padStart(5, '0') });
    }
    const countText = cell('count');
    const count = countText === '' ? 1 : Number(countText);
    const parsed = rosterRowSchema.safeParse({
      name: cell('name') === '' ? null : cell('name'),
      role: cell('role').toLowerCase(),
      count,
      start: cell('start').padStart(5, '0'),
      end: cell('end').padStart(5, '0'),
      breaks,
      roomIds,
    });
    if (!parsed.success) {
      for (const issue of parsed.error.issues) {
        const column = COLUMN_OF[String(issue.path[0])] ?? 'row';
        // Rooms already named their own problem; an empty list after unknown names says nothing new.
        if (column === 'rooms' && errors.some((e) => e.row === row && e.column === 'rooms')) continue;
        problem(column, issue.message);
      }
      return;
    }
    const name = parsed.data.name?.toLowerCase();
    if (name !== undefined) {
      const first = seenNames.get(name);
      if (first !== undefined) problem('name', `"${parsed.data.name}" is already on the roster (row ${first})`);
      else seenNames.set(name, row);
    }
    rows.push(parsed.data);
  });
  if (rows.length > ROSTER_LIMITS.rows) errors.push({ row: 1, column: 'row', message: `at most ${ROSTER_LIMITS.rows} rows` });
  if (rows.reduce((sum, r) => sum + r.count, 0) > ROSTER_LIMITS.people) errors.push({ row: 1, column: 'count', message: `at most ${ROSTER_LIMITS.people} people on one day` });
  errors.sort((a, b) => a.row - b.row);
  return errors.length > 0 ? { errors } : { rows };
}
