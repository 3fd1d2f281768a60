import type { Knex } from 'knex';
import type { Problem } from '../../shared/api/errors';
import type { RosterChange } from '../../shared/api/changes';
import { dayRosterInputSchema, ROSTER_LIMITS, WALKING_MINUTES, type DayRoster, type RosterRow, type RosterSource, type WeeklyRoster } from '../../shared/api/roster';
import { expandRoster } from '../../shared/roster/expand';
import type { DayPlanRoster } from '../../shared/turnover/day-plan-input';
import { HttpError, Refusal, ValidationError } from '../errors';
import { parseRosterTable } from '../../shared/roster/roster-file';
import { readExamFile, type UploadedExamFile } from './exam-file';
import { unreadableFile } from './file-refusal';
import { listRooms } from './rooms';
import { recordAudit, type Actor } from './audit';
import { recordChange } from './plan-changes';
import { weekdayOf } from './room-hours';
import { readSettings } from './settings';

interface RosterRecord {
  rows: string;
}

const parseRows = (record: RosterRecord | undefined): RosterRow[] | null => (record ? (JSON.parse(record.rows) as RosterRow[]) : null);

/** The day's own rows (null: none saved for it). */
async function ownRows(db: Knex, day: string): Promise<RosterRow[] | null> {
  return parseRows(await db('day_rosters').where({ day }).first('rows'));
}

/**
 * The roster in force on a day: its own if saved, else its weekday's default, else none.
 *
 * @example
 * const { source, people } = await readDayRoster(db, '2027-05-03'); // 'weekly', 5 people
 */
export async function readDayRoster(db: Knex, day: string): Promise<DayRoster> {
  const [own, weekly, settings] = await Promise.all([
    ownRows(db, day),
    db('weekly_rosters').where({ weekday: weekdayOf(day) }).first('rows') as Promise<RosterRecord | undefined>,
    readSettings(db),
  ]);
  const weeklyRows = parseRows(weekly);
  const [source, rows]: [RosterSource, RosterRow[]] = own
    ? ['day', own]
    : weeklyRows && weeklyRows.length > 0
      ? ['weekly', weeklyRows]
      : ['none', []];
  return { date: day, source, rows, people: expandRoster(rows), walkingMinutes: settings.walkingMinutes ?? WALKING_MINUTES.default };
}

/**
 * What the day plan needs of the roster (undefined without one, so the plan is as before rosters).
 *
 * @example
 * await rosterForPlan(db, '2027-05-03'); // { source: 'day', people: [...], walkingMinutes: 3 }
 */
export async function rosterForPlan(db: Knex, day: string): Promise<DayPlanRoster | undefined> {
  const roster = await readDayRoster(db, day);
  if (roster.source === 'none') return undefined;
  return { source: roster.source, people: roster.people, walkingMinutes: roster.walkingMinutes };
}

/**
 * Every room a roster names must be set up and in use: one problem per row naming its unknown or
 * retired rooms (a room retired after the roster was saved simply leaves the plan).
 */
async function roomProblems(db: Knex, rows: readonly Pick<RosterRow, 'roomIds'>[], field: (i: number) => string): Promise<Problem[]> {
  const rooms: { id: number; name: string; active: boolean | number }[] = await db('rooms').select('id', 'name', 'active');
  const byId = new Map(rooms.map((r) => [r.id, r]));
  const problems: Problem[] = [];
  rows.forEach((row, i) => {
    const unknown = row.roomIds.filter((id) => !byId.has(id));
    const retired = row.roomIds.filter((id) => byId.has(id) && !byId.get(id)!.active).map((id) => byId.get(id)!.name);
    if (unknown.length > 0) problems.push({ field: field(i), message: `no room ${unknown.join(', ')} is set up` });
    if (retired.length > 0) problems.push({ field: field(i), message: `${retired.join(', ')} ${retired.length === 1 ? 'is' : 'are'} retired` });
  });
  return problems;
}

/**
 * A roster request's rows, or one 422 listing every problem: the schema's (times, breaks, names,
 * counts) and, for every row whose rooms are a list of ids, its unknown or retired rooms.
 *
 * @example
 * const rows = await parseRosterRows(db, req.body); // or ValidationError with details.problems
 */
export async function parseRosterRows(db: Knex, body: unknown): Promise<RosterRow[]> {
  const parsed = dayRosterInputSchema.safeParse(body);
  const problems: Problem[] = parsed.success ? [] : parsed.error.issues.map((issue) => ({ field: issue.path.join('.') || 'roster', message: issue.message }));
  const raw = (body as { rows?: unknown } | null)?.rows;
  if (Array.isArray(raw) && raw.length <= ROSTER_LIMITS.rows) {
    const withRooms = raw.map((row) => {
      const ids = (row as { roomIds?: unknown } | null)?.roomIds;
      return { roomIds: Array.isArray(ids) ? ids.filter((id): id is number => Number.isInteger(id) && id > 0).slice(0, 100) : [] };
    });
    problems.push(...(await roomProblems(db, withRooms, (i) => `rows.${i}.roomIds`)));
  }
  if (problems.length > 0 || !parsed.success) {
    throw new ValidationError(`Invalid roster: ${problems.map((p) => `${p.field}: ${p.message}`).join('; ')}`, { problems });
  }
  return parsed.data.rows;
}

function people(rows: readonly RosterRow[]): string {
  const n = rows.reduce((sum, row) => sum + row.count, 0);
  return `${n} ${n === 1 ? 'person' : 'people'}`;
}

/**
 * Saves the day's own roster, rows as {@link parseRosterRows} gives them (replacing whatever was in force), in one transaction with one history
 * entry (reason `roster`, undoable); the day's version rises by trigger.
 *
 * @example
 * await saveDayRoster(db, '2027-05-03', rows, user.id, now); // { source: 'day', … }
 */
export async function saveDayRoster(db: Knex, day: string, rows: RosterRow[], userId: number, now: Date): Promise<DayRoster> {
  await db.transaction(async (trx) => {
    const change: RosterChange = { type: 'roster', day, from: await ownRows(trx, day), to: rows };
    await applyRosterChange(trx, change, userId, now);
    await recordChange(trx, { day, userId, reason: 'roster', summary: `Roster saved: ${people(rows)} on shift`, changes: [change] }, now);
  });
  return readDayRoster(db, day);
}

/**
 * Removes the day's own roster, so its weekday's default applies again; a history entry as a save.
 *
 * @example
 * await clearDayRoster(db, '2027-05-03', user.id, now); // { source: 'weekly', … }
 */
export async function clearDayRoster(db: Knex, day: string, userId: number, now: Date): Promise<DayRoster> {
  await db.transaction(async (trx) => {
    const from = await ownRows(trx, day);
    if (from === null) return;
    const change: RosterChange = { type: 'roster', day, from, to: null };
    await applyRosterChange(trx, change, userId, now);
    await recordChange(trx, { day, userId, reason: 'roster', summary: "Roster back to the weekday's default", changes: [change] }, now);
  });
  return readDayRoster(db, day);
}

/**
 * Writes a roster change as described (undo and redo come here too), provided the day's own
 * roster is still what the change replaced: else 409 `changed_since`.
 */
export async function applyRosterChange(trx: Knex, change: RosterChange, userId: number, now: Date): Promise<void> {
  const current = await ownRows(trx, change.day);
  if (JSON.stringify(current) !== JSON.stringify(change.from)) {
    throw new Refusal('changed_since', `The roster of ${change.day} has changed since; reload the day and try again.`, { rosterDay: change.day });
  }
  if (change.to === null) {
    await trx('day_rosters').where({ day: change.day }).delete();
    return;
  }
  await trx('day_rosters')
    .insert({ day: change.day, rows: JSON.stringify(change.to), updated_at: now.toISOString(), updated_by: userId })
    .onConflict('day')
    .merge();
}

/**
 * Every weekday's default roster, Monday to Sunday.
 *
 * @example
 * (await readWeeklyRoster(db)).weekdays[0]; // { weekday: 1, rows: [...] }
 */
export async function readWeeklyRoster(db: Knex): Promise<WeeklyRoster> {
  const stored: { weekday: number; rows: string }[] = await db('weekly_rosters').select('weekday', 'rows');
  const byDay = new Map(stored.map((r) => [Number(r.weekday), JSON.parse(r.rows) as RosterRow[]]));
  return { weekdays: [1, 2, 3, 4, 5, 6, 7].map((weekday) => ({ weekday, rows: byDay.get(weekday) ?? [] })) };
}

const WEEKDAY_NAMES = ['Monday', 'Tuesday', 'Wednesday', 'Thursday', 'Friday', 'Saturday', 'Sunday'];

/**
 * Saves one weekday's default roster with a setup-audit row in the same transaction; the setup
 * version rises by trigger (every day without its own roster may plan differently).
 *
 * @example
 * await saveWeeklyRoster(db, 1, rows, actor, now);
 */
export async function saveWeeklyRoster(db: Knex, weekday: number, rows: RosterRow[], by: Actor, now: Date): Promise<WeeklyRoster> {
  await db.transaction(async (trx) => {
    const before = parseRows(await trx('weekly_rosters').where({ weekday }).first('rows'));
    if (JSON.stringify(before ?? []) === JSON.stringify(rows)) return;
    await trx('weekly_rosters')
      .insert({ weekday, rows: JSON.stringify(rows), updated_at: now.toISOString(), updated_by: by.id })
      .onConflict('weekday')
      .merge();
    await recordAudit(
      trx,
      by,
      { area: 'roster', action: 'changed', subject: `${WEEKDAY_NAMES[weekday - 1]} roster`, before: { rows: before ?? [] }, after: { rows } },
      now,
    );
  });
  return readWeeklyRoster(db);
}

/** A roster file is a few dozen rows: bounded well below an exam list. */
export const ROSTER_FILE_MAX_BYTES = 256 * 1024;

export interface RosterFileAnswer {
  dryRun: boolean;
  rows: RosterRow[];
  /** The day's roster after a commit; null for a preview. */
  roster: DayRoster | null;
}

/**
 * Reads a roster file (CSV or .xlsx, `shared/roster/roster-file.ts`) for a day: a preview
 * (`dryRun`) answers its rows; a commit saves them as the day's roster (history entry, version).
 * A file with any bad row is refused whole: 422 `validation_failed` with `errors:[{row, column,
 * message}]`, as the exam list is.
 *
 * @example
 * await importRosterFile(db, { day, file, userId, dryRun: true, now }); // { dryRun: true, rows, roster: null }
 */
export async function importRosterFile(
  db: Knex,
  request: { day: string; file: UploadedExamFile; userId: number; dryRun: boolean; now: Date },
): Promise<RosterFileAnswer> {
  let table: string[][];
  try {
    table = await readExamFile(request.file);
  } catch (error) {
    // The exam list's reader words a header-only file for exams; a roster lists people.
    if (error instanceof HttpError && /header row but no exams/.test(error.message)) {
      throw unreadableFile('The file has a header row but no people.');
    }
    throw error;
  }
  const parsed = parseRosterTable(table, await listRooms(db));
  if (parsed.errors) {
    const shown = parsed.errors.slice(0, 200);
    throw new ValidationError(
      `The roster file has ${parsed.errors.length} ${parsed.errors.length === 1 ? 'problem' : 'problems'}; nothing was imported.`,
      { problems: shown.map((e) => ({ field: `row ${e.row}, ${e.column}`, message: e.message })) },
      { errors: shown, errorCount: parsed.errors.length },
    );
  }
  if (request.dryRun) return { dryRun: true, rows: parsed.rows, roster: null };
  return { dryRun: false, rows: parsed.rows, roster: await saveDayRoster(db, request.day, parsed.rows, request.userId, request.now) };
}
