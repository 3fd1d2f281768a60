import type { Knex } from 'knex';
import type { ChangeReason, PlanChange, PlanChangeRecord } from '../../shared/api/changes';
import { Refusal } from '../errors';
import { examColumnsForMove } from './exams';

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
}

/** Records one user action (any number of moves/staffing changes) as one audit row. */
export async function recordChange(
  trx: Knex,
  entry: { day: string; userId: number; reason: ChangeReason; summary: string; changes: PlanChange[]; revertsId?: number | null },
  now: Date,
): Promise<number> {
  const [id] = await trx('plan_changes').insert({
    day: entry.day,
    user_id: entry.userId,
    reason: entry.reason,
    summary: entry.summary.slice(0, 300),
    changes: JSON.stringify(entry.changes),
    reverts_id: entry.revertsId ?? null,
    created_at: now.toISOString(),
  });
  return id as number;
}

export async function dayHistory(db: Knex, day: string): Promise<PlanChangeRecord[]> {
  const rows: ChangeRow[] = await db('plan_changes')
    .join('users', 'users.id', 'plan_changes.user_id')
    .where('plan_changes.day', day)
    .orderBy('plan_changes.id', 'desc')
    .select('plan_changes.*', 'users.username', 'users.display_name');
  return rows.map((r) => ({
    id: r.id,
    day: r.day,
    username: r.username,
    displayName: r.display_name,
    reason: r.reason,
    summary: r.summary,
    changes: JSON.parse(r.changes) as PlanChange[],
    revertsId: r.reverts_id,
    undone: r.undone_at !== null,
    at: r.created_at,
  }));
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

export function invert(changes: PlanChange[]): PlanChange[] {
  return [...changes].reverse().map((c) => ({ ...c, from: c.to, to: c.from }) as PlanChange);
}

/**
 * Undo: reverts the user's latest action of the day that is not undone, as a new action.
 * Redo: re-applies the action most recently undone, if the user made no new action since.
 */
export async function undoOrRedo(db: Knex, day: string, userId: number, mode: 'undo' | 'redo', now: Date): Promise<PlanChangeRecord | null> {
  return db.transaction(async (trx) => {
    const own = trx('plan_changes').where({ day, user_id: userId }).whereNotIn('reason', ['undo', 'redo']);
    let target: ChangeRow | undefined;
    if (mode === 'undo') {
      target = await own.clone().whereNull('undone_at').orderBy('id', 'desc').first();
    } else {
      const latestAction = await own.clone().whereNull('undone_at').orderBy('id', 'desc').first();
      target = await own.clone().whereNotNull('undone_at').orderBy('undone_at', 'desc').orderBy('id', 'desc').first();
      if (target && latestAction && latestAction.id > target.id) target = undefined;
    }
    if (!target) return null;
    const original = JSON.parse(target.changes) as PlanChange[];
    const changes = mode === 'undo' ? invert(original) : original;
    await applyChanges(trx, changes, userId, now);
    const id = await recordChange(trx, { day, userId, reason: mode, summary: `${mode === 'undo' ? 'Undid' : 'Redid'}: ${target.summary}`, changes, revertsId: target.id }, now);
    await trx('plan_changes').where({ id: target.id }).update({ undone_at: mode === 'undo' ? now.toISOString() : null });
    return { id, day, username: '', displayName: '', reason: mode, summary: '', changes, revertsId: target.id, undone: false, at: now.toISOString() };
  });
}
