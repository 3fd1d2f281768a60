import { z } from 'zod';
import { CONTRAST_SPELLINGS, EXAM_LIST_LIMITS as LIMITS, MOBILITIES, PRECAUTIONS, type ExamListColumn } from './columns';
import { resolveStart } from './start-time';
import type { ExamListOptions } from './model';

/**
 * One data row as trimmed text per column; a column the file lacks is `''`.
 *
 * @example
 * const cells: ExamListCells = { accession: 'A1', room: 'MR 1', start: '08:00', duration_min: '30',
 *   procedure: 'MR knee', coil: '', precaution: '', mobility: '', contrast: '', notes: '' };
 */
export type ExamListCells = Record<ExamListColumn, string>;

type Context = z.core.$RefinementCtx<string>;

function fail(ctx: Context, message: string): never {
  ctx.issues.push({ code: 'custom', message, input: undefined });
  return z.NEVER;
}

// Cells are echoed in messages so the user can find them; a long note would drown the message.
function quote(value: string): string {
  return value.length > 40 ? `"${value.slice(0, 37)}…"` : `"${value}"`;
}

function withinLimit(ctx: Context, column: ExamListColumn, value: string, maxChars: number): string {
  // Counted in code points so an accented or emoji character counts once, as the user sees it.
  const length = [...value].length;
  return length > maxChars ? fail(ctx, `${column} is ${length} characters long; the limit is ${maxChars}.`) : value;
}

function requiredText(column: ExamListColumn, maxChars: number) {
  return z.string().transform((value, ctx) =>
    value === '' ? fail(ctx, `${column} is required.`) : withinLimit(ctx, column, value, maxChars),
  );
}

function optionalText(column: ExamListColumn, maxChars: number) {
  return z.string().transform((value, ctx) => (value === '' ? null : withinLimit(ctx, column, value, maxChars)));
}

function oneOf<T extends string>(column: ExamListColumn, values: readonly T[], empty: T) {
  return z.string().transform((value, ctx): T => {
    if (value === '') return empty;
    const match = values.find((allowed) => allowed === value.toLowerCase());
    return match ?? fail(ctx, `${column} must be one of ${values.join(', ')}; got ${quote(value)}.`);
  });
}

const contrast = z.string().transform((value, ctx) => {
  const lower = value.toLowerCase();
  if (lower === '' || (CONTRAST_SPELLINGS.no as readonly string[]).includes(lower)) return false;
  if ((CONTRAST_SPELLINGS.yes as readonly string[]).includes(lower)) return true;
  return fail(ctx, `contrast must be yes or no; got ${quote(value)}.`);
});

const duration = z.string().transform((value, ctx) => {
  if (value === '') return fail(ctx, 'duration_min is required.');
  const minutes = /^\d+$/.test(value) ? Number(value) : NaN;
  if (!(minutes >= LIMITS.durationMinMinutes && minutes <= LIMITS.durationMaxMinutes)) {
    return fail(ctx, `duration_min must be whole minutes from ${LIMITS.durationMinMinutes} to ${LIMITS.durationMaxMinutes}; got ${quote(value)}.`);
  }
  return minutes;
});

function room(roomNames: string[]) {
  // Spaces are collapsed too, so "MR  2" typed with a double space still finds "MR 2".
  const key = (name: string) => name.trim().replace(/\s+/g, ' ').toLowerCase();
  const byKey = new Map(roomNames.map((name) => [key(name), name]));
  const known = roomNames.length > 0 ? `Known rooms: ${[...roomNames].sort().join(', ')}.` : 'No rooms are set up yet.';
  return z.string().transform((value, ctx) => {
    if (value === '') return fail(ctx, 'room is required.');
    return byKey.get(key(value)) ?? fail(ctx, `Room ${quote(value)} is not set up. ${known}`);
  });
}

function start(options: ExamListOptions) {
  // A day list repeats the same few hundred start times; resolving each once keeps big files fast.
  const resolvedByValue = new Map<string, ReturnType<typeof resolveStart>>();
  return z.string().transform((value, ctx) => {
    if (value === '') return fail(ctx, 'start is required.');
    let resolved = resolvedByValue.get(value);
    if (!resolved) resolvedByValue.set(value, (resolved = resolveStart(value, options)));
    return resolved.ok ? { start: resolved.start, warning: resolved.warning } : fail(ctx, resolved.message);
  });
}

/**
 * Builds the schema one data row is checked with. Every column is checked, so a row reports
 * all its problems at once; each issue's `path[0]` is the column.
 *
 * @example
 * const schema = examRowSchema({ date: '2027-03-15', timezone: 'America/Chicago', roomNames: ['MR 1'] });
 * schema.safeParse({ accession: 'A1', room: 'mr 1', start: '08:00', duration_min: '30',
 *   procedure: 'MR knee', coil: 'knee', precaution: '', mobility: '', contrast: 'no', notes: '' }).success; // true
 */
export function examRowSchema(options: ExamListOptions) {
  return z.object({
    accession: requiredText('accession', LIMITS.accessionMaxChars),
    room: room(options.roomNames),
    start: start(options),
    duration_min: duration,
    procedure: requiredText('procedure', LIMITS.procedureMaxChars),
    coil: optionalText('coil', LIMITS.coilMaxChars),
    precaution: oneOf('precaution', PRECAUTIONS, 'none'),
    mobility: oneOf('mobility', MOBILITIES, 'ambulatory'),
    contrast,
    notes: optionalText('notes', LIMITS.notesMaxChars),
  });
}
