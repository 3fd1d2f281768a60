import type { Knex } from 'knex';
import type { StaffingChange } from '../../shared/api/changes';
import { NotFoundError } from '../errors';
import { applyChanges, recordChange } from './plan-changes';

/** People on the turnover before an exam (null: back to the room's staff). Returns the exam's day. */
export async function setGapStaffing(db: Knex, examId: number, staff: number | null, userId: number, now: Date): Promise<string> {
  return db.transaction(async (trx) => {
    const exam = await trx('exams').where({ id: examId }).first();
    if (!exam) throw new NotFoundError(`No exam ${examId}.`);
    const current = await trx('gap_staffing').where({ to_exam_id: examId }).first();
    const change: StaffingChange = { type: 'staffing', toExamId: examId, accession: exam.accession, from: current?.staff ?? null, to: staff };
    await applyChanges(trx, [change], userId, now);
    const summary = staff === null ? `Turnover before ${exam.accession} back to the room's staffing` : `${staff} ${staff === 1 ? 'person' : 'people'} on the turnover before ${exam.accession}`;
    await recordChange(trx, { day: exam.day, userId, reason: 'staffing', summary, changes: [change] }, now);
    return exam.day as string;
  });
}

/** The room's usual number of people on a turnover. */
export async function setRoomStaffing(db: Knex, roomId: number, staff: number): Promise<void> {
  const updated = await db('rooms').where({ id: roomId, active: true }).update({ staff });
  if (updated === 0) throw new NotFoundError(`No room ${roomId}.`);
}
