import type { Knex } from 'knex';
import { DateTime } from 'luxon';
import type { ChangeReason, DayHistory, ExamEdit, ExamFields, ExamMove, PlanChange, PlanChangeRecord } from '../../shared/api/changes';
import { Refusal } from '../errors';
import { columnsOfFields, examColumnsForMove, storedFields, type ExamRow } from './exams';
import { applyRosterChange } from './roster';
import { readSettings } from './settings';

interface ChangeRow {
  id: number;
  day: string;
  user_id: number;
  reason: ChangeReason;
  summary: string;
  changes: string;
  reverts_id: number | null;
  undone_at: string | null;
  created_at: string;
  username: string;
  display_name: string;
  after_manual_change: number | boolean | null;
}

/** Records one user action (any number of moves/staffing changes) as one audit row. */
export async function recordChange(
  trx: Knex,
  entry: { day: string; userId: number; reason: ChangeReason; summary: string; changes: PlanChange[]; revertsId?: number | null },
  now: Date,
): Promise<number> {
  const [{ id }] = await trx('plan_changes').insert({
    day: entry.day,
    user_id: entry.userId,
    reason: entry.reason,
    summary: entry.summary.slice(0, 300),
    changes: JSON.stringify(entry.changes),
    reverts_id: entry.revertsId ?? null,
    created_at: now.toISOString(),
  }).returning('id');
  return id as number;
}

/**
 * The day's changes, newest first, with every time at the site's offset (the API's contract;
 * rows store UTC), and whether `userId` has an action of their own to undo or redo.
 */
export async function dayHistory(db: Knex, day: string, userId: number): Promise<DayHistory> {
  const { timezone } = await readSettings(db);
  const rows: ChangeRow[] = await db('plan_changes')
    .join('users', 'users.id', 'plan_changes.user_id')
    // the booking feed's flag lives on the message that made the change (at most one per change)
    .leftJoin('hl7_messages', 'hl7_messages.change_id', 'plan_changes.id')
    .where('plan_changes.day', day)
    .orderBy('plan_changes.id', 'desc')
    .select('plan_changes.*', 'users.username', 'users.display_name', 'hl7_messages.after_manual_change');
  // Retired rooms too: an old move still names the room it left.
  const rooms = new Map<number, string>((await db('rooms').select('id', 'name')).map((r: { id: number; name: string }) => [r.id, r.name]));
  const byId = new Map(rows.map((r) => [r.id, r]));
  const siteTime = (iso: string) => DateTime.fromISO(iso, { zone: timezone }).toISO({ suppressMilliseconds: true })!;
  const changes = rows.map((r): PlanChangeRecord => {
    const list = (JSON.parse(r.changes) as PlanChange[]).map((c): PlanChange => {
      if (c.type === 'move') return { ...c, from: { ...c.from, start: siteTime(c.from.start) }, to: { ...c.to, start: siteTime(c.to.start) } };
      if (c.type === 'exam') return { ...c, from: c.from && { ...c.from, start: siteTime(c.from.start) }, to: c.to && { ...c.to, start: siteTime(c.to.start) } };
      return c;
    });
    return {
      id: r.id,
      day: r.day,
      username: r.username,
      displayName: r.display_name,
      reason: r.reason,
      summary: summaryOf(r, byId, rooms, timezone),
      changes: list,
      revertsId: r.reverts_id,
      undone: r.undone_at !== null,
      afterManualChange: Boolean(r.after_manual_change),
      at: siteTime(r.created_at),
    };
  });
  const targets = await undoTargets(db, day, userId);
  return { changes, canUndo: targets.undo !== undefined, canRedo: targets.redo !== undefined };
}

/**
 * A single move is worded from what moved, not from the text stored at the time, so every
 * entry reads alike: "Moved A-2 from MR 1 10:05 to 10:20" (the room named again only when it
 * changed). Undo and redo word the action they revert. Anything else keeps its stored summary.
 */
function summaryOf(row: ChangeRow, byId: Map<number, ChangeRow>, rooms: Map<number, string>, zone: string): string {
  const reverted = row.reverts_id === null ? undefined : byId.get(row.reverts_id);
  if ((row.reason === 'undo' || row.reason === 'redo') && reverted) {
    return `${row.reason === 'undo' ? 'Undid' : 'Redid'}: ${summaryOf(reverted, byId, rooms, zone)}`;
  }
  const changes = JSON.parse(row.changes) as PlanChange[];
  if (row.reason === 'suggestion' || changes.length !== 1 || changes[0]!.type !== 'move') return row.summary;
  return moveWords(changes[0]!, rooms, zone);
}

function moveWords(move: ExamMove, rooms: Map<number, string>, zone: string): string {
  const clock = (iso: string) => DateTime.fromISO(iso, { zone }).toFormat('HH:mm');
  const room = (id: number) => rooms.get(id) ?? `room ${id}`;
  const to = move.to.roomId === move.from.roomId ? clock(move.to.start) : `${room(move.to.roomId)} ${clock(move.to.start)}`;
  return `Moved ${move.accession} from ${room(move.from.roomId)} ${clock(move.from.start)} to ${to}`;
}

/**
 * The user's own action an undo would revert (latest not undone) and the one a redo would
 * re-apply (most recently undone, unless they made a new action since).
 */
async function undoTargets(db: Knex, day: string, userId: number): Promise<{ undo?: ChangeRow; redo?: ChangeRow }> {
  const own = db('plan_changes').where({ day, user_id: userId }).whereNotIn('reason', ['undo', 'redo']);
  const undo: ChangeRow | undefined = await own.clone().whereNull('undone_at').orderBy('id', 'desc').first();
  const undone: ChangeRow | undefined = await own.clone().whereNotNull('undone_at').orderBy('undone_at', 'desc').orderBy('id', 'desc').first();
  return { undo, redo: undone && !(undo && undo.id > undone.id) ? undone : undefined };
}

/** Applies changes as they are described (moves to `to`, staffing to `to`); checks nothing moved meanwhile. */
export async function applyChanges(trx: Knex, changes: PlanChange[], userId: number, now: Date): Promise<void> {
  for (const change of changes) {
    if (change.type === 'move') {
      const exam = await trx('exams').where({ id: change.examId }).first();
      const since = { accession: change.accession, examId: change.examId };
      if (!exam) throw new Refusal('changed_since', `Exam ${change.accession} is no longer on the list.`, since);
      if (exam.room_id !== change.from.roomId || Date.parse(exam.start_at) !== Date.parse(change.from.start)) {
        throw new Refusal('changed_since', `Exam ${change.accession} has been moved since; reload the day and try again.`, since);
      }
      await trx('exams')
        .where({ id: change.examId })
        .update({ ...examColumnsForMove(change.to.roomId, change.to.start), version: exam.version + 1, updated_at: now.toISOString() });
    } else if (change.type === 'exam') {
      await applyExamEdit(trx, change, now);
    } else if (change.type === 'roster') {
      await applyRosterChange(trx, change, userId, now);
    } else {
      const current = await trx('gap_staffing').where({ to_exam_id: change.toExamId }).first();
      if ((current?.staff ?? null) !== change.from) {
        throw new Refusal('changed_since', `The staffing before ${change.accession} has changed since; reload the day and try again.`, { accession: change.accession, examId: change.toExamId });
      }
      if (change.to === null) await trx('gap_staffing').where({ to_exam_id: change.toExamId }).delete();
      else await trx('gap_staffing').insert({ to_exam_id: change.toExamId, staff: change.to, user_id: userId, updated_at: now.toISOString() }).onConflict('to_exam_id').merge();
    }
  }
}

/**
 * Re-applies (or, inverted, reverts) an exam added, edited or cancelled by hand, provided the
 * exam is still as the change left it: a re-added exam gets its old id back, so later history
 * entries still point at it. Staffing, arrivals and turnovers removed with a cancelled exam
 * are not restored.
 */
async function applyExamEdit(trx: Knex, change: ExamEdit, now: Date): Promise<void> {
  const exam: ExamRow | undefined = await trx('exams').where({ id: change.examId }).first();
  const since = { accession: change.accession, examId: change.examId };
  const asBefore = change.from === null ? exam === undefined : exam !== undefined && sameFields(storedFields(exam), change.from);
  if (!asBefore) throw new Refusal('changed_since', `Exam ${change.accession} has been changed since; reload the day and try again.`, since);
  const stamp = now.toISOString();
  if (change.to === null) {
    await trx('exams').where({ id: change.examId }).delete();
    return;
  }
  const day = exam?.day ?? DateTime.fromISO(change.to.start, { setZone: true }).toISODate()!;
  const taken = await trx('exams').where({ day, accession: change.to.accession }).whereNot({ id: change.examId }).first('id');
  if (taken) throw new Refusal('changed_since', `Accession ${change.to.accession} is on the list again since; reload the day and try again.`, since);
  if (exam) await trx('exams').where({ id: change.examId }).update({ ...columnsOfFields(change.to), version: exam.version + 1, updated_at: stamp });
  else await trx('exams').insert({ id: change.examId, day, ...columnsOfFields(change.to), version: 1, updated_at: stamp });
}

function sameFields(a: ExamFields & { accession: string }, b: ExamFields & { accession: string }): boolean {
  return (Object.keys(b) as (keyof typeof b)[]).every((key) => (key === 'start' ? Date.parse(a.start) === Date.parse(b.start) : a[key] === b[key]));
}

export function invert(changes: PlanChange[]): PlanChange[] {
  return [...changes].reverse().map((c) => ({ ...c, from: c.to, to: c.from }) as PlanChange);
}

/**
 * Undo: reverts the user's latest action of the day that is not undone, as a new action.
 * Redo: re-applies the action most recently undone, if the user made no new action since.
 */
export async function undoOrRedo(db: Knex, day: string, userId: number, mode: 'undo' | 'redo', now: Date): Promise<PlanChangeRecord | null> {
  return db.transaction(async (trx) => {
    const target = (await undoTargets(trx, day, userId))[mode];
    if (!target) return null;
    const original = JSON.parse(target.changes) as PlanChange[];
    const changes = mode === 'undo' ? invert(original) : original;
    await applyChanges(trx, changes, userId, now);
    const id = await recordChange(trx, { day, userId, reason: mode, summary: `${mode === 'undo' ? 'Undid' : 'Redid'}: ${target.summary}`, changes, revertsId: target.id }, now);
    await trx('plan_changes').where({ id: target.id }).update({ undone_at: mode === 'undo' ? now.toISOString() : null });
    return { id, day, username: '', displayName: '', reason: mode, summary: '', changes, revertsId: target.id, undone: false, afterManualChange: false, at: now.toISOString() };
  });
}
