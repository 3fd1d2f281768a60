import type { Knex } from 'knex';
import { NotFoundError } from '../errors';
import { readSettings } from './settings';
import { localIso } from './turnovers';

/**
 * Marks the patient of an exam arrived (waiting). Marking twice keeps the first time: the
 * front desk may press again, the patient has not arrived twice. Returns the mark and the day.
 */
export async function markArrived(db: Knex, examId: number, userId: number, now: Date): Promise<{ arrivedAt: string; day: string }> {
  const exam = await db('exams').where({ id: examId }).first('day');
  if (!exam) throw new NotFoundError(`No exam ${examId}.`);
  const { timezone } = await readSettings(db);
  await db('arrivals').insert({ exam_id: examId, arrived_at: localIso(now, timezone), user_id: userId }).onConflict('exam_id').ignore();
  const mark = await db('arrivals').where({ exam_id: examId }).first('arrived_at');
  return { arrivedAt: mark.arrived_at, day: exam.day };
}

/** Removes a mistaken arrival mark (none is fine). Returns the exam's day. */
export async function unmarkArrived(db: Knex, examId: number): Promise<string> {
  const exam = await db('exams').where({ id: examId }).first('day');
  if (!exam) throw new NotFoundError(`No exam ${examId}.`);
  await db('arrivals').where({ exam_id: examId }).delete();
  return exam.day;
}
