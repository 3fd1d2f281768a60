import type { Knex } from 'knex';
import type { ShiftTaskView } from '../../shared/api/shift-tasks';
import { NotFoundError } from '../errors';
import { changedFields, recordAudit, type Actor } from './audit';

interface Row {
  id: number;
  room_id: number;
  room_name: string;
  key: string;
  label: string;
  rrule: string;
  duration_minutes: number;
  active: number | boolean;
  created_at: string;
}

const toView = (r: Row): ShiftTaskView => ({
  id: r.id,
  roomId: r.room_id,
  roomName: r.room_name,
  key: r.key,
  label: r.label,
  rrule: r.rrule,
  durationMinutes: r.duration_minutes,
  retired: !r.active,
  createdAt: r.created_at,
});

const rows = (db: Knex) => db('shift_tasks as t').join('rooms as r', 'r.id', 't.room_id').select('t.*', 'r.name as room_name');

/** Every room's recurring tasks, retired ones last (a retired task keeps its ticks in the log). */
export async function listShiftTasks(db: Knex): Promise<ShiftTaskView[]> {
  const found: Row[] = await rows(db).orderBy([{ column: 't.active', order: 'desc' }, { column: 'r.sort_order' }, { column: 'r.name' }, { column: 't.id' }]);
  return found.map(toView);
}

async function getTask(db: Knex, id: number): Promise<ShiftTaskView> {
  const row: Row | undefined = await rows(db).where('t.id', id).first();
  if (!row) throw new NotFoundError(`No shift task ${id}.`);
  return toView(row);
}

const audited = (t: { label: string; rrule: string; durationMinutes: number }) => ({ label: t.label, rrule: t.rrule, durationMinutes: t.durationMinutes });

/** A new recurring task in an active room; its key is made from its id, so two tasks may share a name. */
export async function createShiftTask(
  db: Knex,
  input: { roomId: number; label: string; rrule: string; durationMinutes: number },
  by: Actor,
  now: Date,
): Promise<ShiftTaskView> {
  return db.transaction(async (trx) => {
    const room = await trx('rooms').where({ id: input.roomId, active: true }).first('id', 'name');
    if (!room) throw new NotFoundError(`No room ${input.roomId}.`);
    const [{ id }] = await trx('shift_tasks').insert({
      room_id: input.roomId,
      key: `pending-${now.getTime()}`,
      label: input.label,
      rrule: input.rrule,
      duration_minutes: input.durationMinutes,
      created_at: now.toISOString(),
    }).returning('id');
    await trx('shift_tasks').where({ id }).update({ key: `task-${id}` });
    await recordAudit(trx, by, { area: 'shift task', action: 'created', subject: `${room.name}: ${input.label}`, before: null, after: audited(input) }, now);
    return getTask(trx, id as number);
  });
}

/** A new name, rule or length; ticks already made stay (they are keyed by the occurrence's instant). */
export async function updateShiftTask(db: Knex, id: number, input: { label: string; rrule: string; durationMinutes: number }, by: Actor, now: Date): Promise<ShiftTaskView> {
  return db.transaction(async (trx) => {
    const before = await getTask(trx, id);
    await trx('shift_tasks').where({ id }).update({ label: input.label, rrule: input.rrule, duration_minutes: input.durationMinutes });
    const after = await getTask(trx, id);
    const diff = changedFields(audited(before), audited(after));
    if (Object.keys(diff.after).length > 0) await recordAudit(trx, by, { area: 'shift task', action: 'changed', subject: `${after.roomName}: ${after.label}`, ...diff }, now);
    return after;
  });
}

/** Off the board and the Turnover screen from now on; its past ticks stay in the cleaning log. */
export async function retireShiftTask(db: Knex, id: number, by: Actor, now: Date): Promise<ShiftTaskView> {
  return db.transaction(async (trx) => {
    const before = await getTask(trx, id);
    if (before.retired) return before;
    await trx('shift_tasks').where({ id }).update({ active: false });
    await recordAudit(trx, by, { area: 'shift task', action: 'retired', subject: `${before.roomName}: ${before.label}`, before: { retired: false }, after: { retired: true } }, now);
    return getTask(trx, id);
  });
}
