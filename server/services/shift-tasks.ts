import type { Knex } from 'knex';
import { DateTime } from 'luxon';
import type { BoardShiftTask } from '../../shared/api/board';
import { NotFoundError, Refusal, ValidationError } from '../errors';
import { appendLog } from './cleaning-log';
import { readSettings } from './settings';
import { defaultShiftTasks, occurrencesOn } from './shift-task-rules';
import type { UserRecord } from './users';

interface TaskRow {
  id: number;
  room_id: number;
  key: string;
  label: string;
  rrule: string;
  duration_minutes: number;
}

/**
 * Gives a room our default shift tasks (those it has already are kept). `zone`: the site's, for a
 * room set up now, whose rules then start after `now` (no task is overdue from before the room
 * existed); the demo seed leaves it out.
 */
export async function addDefaultShiftTasks(db: Knex, roomId: number, room: { opensAt: string; closesAt: string }, now: Date, zone?: string): Promise<void> {
  const from = zone ? DateTime.fromJSDate(now, { zone }) : undefined;
  const rows = defaultShiftTasks(room, from).map((t) => ({
    room_id: roomId,
    key: t.key,
    label: t.label,
    rrule: t.rrule,
    duration_minutes: t.durationMinutes,
    created_at: now.toISOString(),
  }));
  await db('shift_tasks').insert(rows).onConflict(['room_id', 'key']).ignore();
}

/**
 * One active room's shift tasks on a day (the Turnover screen's list), at the site's zone.
 *
 * @throws NotFoundError when there is no such active room
 */
export async function roomTasksOfDay(db: Knex, roomId: number, day: string, now: Date): Promise<BoardShiftTask[]> {
  if (!(await db('rooms').where({ id: roomId, active: true }).first('id'))) throw new NotFoundError(`No room ${roomId}.`);
  const { timezone } = await readSettings(db);
  return (await shiftTasksOfDay(db, [roomId], day, timezone, now)).get(roomId) ?? [];
}

/**
 * Each room's task occurrences on a local date, in time order, with who ticked them.
 * An occurrence is overdue once its whole slot (due + duration) has passed undone.
 */
export async function shiftTasksOfDay(db: Knex, roomIds: number[], day: string, zone: string, now: Date): Promise<Map<number, BoardShiftTask[]>> {
  const tasks: TaskRow[] = await db('shift_tasks').whereIn('room_id', roomIds).andWhere({ active: true }).orderBy('id');
  const done = await db('shift_task_done as d')
    .join('users as u', 'u.id', 'd.user_id')
    .whereIn('d.task_id', tasks.map((t) => t.id))
    .select('d.task_id', 'd.due_ms', 'd.done_at', 'u.display_name', 'u.username');
  const doneBy = new Map(done.map((d) => [`${d.task_id}|${Number(d.due_ms)}`, d]));
  const byRoom = new Map<number, BoardShiftTask[]>(roomIds.map((id) => [id, []]));
  for (const task of tasks) {
    for (const due of occurrencesOn(task.rrule, day, zone)) {
      const mark = doneBy.get(`${task.id}|${due.toMillis()}`);
      byRoom.get(task.room_id)!.push({
        taskId: task.id,
        key: task.key,
        label: task.label,
        due: due.toISO({ suppressMilliseconds: true })!,
        durationMinutes: task.duration_minutes,
        doneAt: mark?.done_at ?? null,
        doneBy: mark ? mark.display_name || mark.username : null,
        overdue: !mark && due.toMillis() + task.duration_minutes * 60_000 <= now.getTime(),
      });
    }
  }
  for (const list of byRoom.values()) list.sort((a, b) => Date.parse(a.due) - Date.parse(b.due) || a.taskId - b.taskId);
  return byRoom;
}

/**
 * Ticks off one occurrence of a task and logs it as a `shift task` entry.
 * Returns the occurrence as the board shows it now, and its day.
 */
export async function markShiftTaskDone(db: Knex, taskId: number, dueIso: string, user: UserRecord, zone: string, now: Date): Promise<{ task: BoardShiftTask; day: string }> {
  const task: (TaskRow & { room_name: string }) | undefined = await db('shift_tasks as t')
    .join('rooms as r', 'r.id', 't.room_id')
    .where('t.id', taskId)
    .first('t.*', 'r.name as room_name');
  if (!task) throw new NotFoundError(`No shift task ${taskId}.`);
  const dueMs = Date.parse(dueIso);
  const day = DateTime.fromMillis(dueMs, { zone }).toISODate()!;
  const due = occurrencesOn(task.rrule, day, zone).find((d) => d.toMillis() === dueMs);
  if (!due) throw new ValidationError(`${dueIso} is not an occurrence of "${task.label}".`, { problems: [{ field: 'due', message: 'not an occurrence of this task' }] });
  const at = DateTime.fromJSDate(now, { zone }).toISO({ suppressMilliseconds: true })!;
  await db.transaction(async (trx) => {
    const existing = await trx('shift_task_done').where({ task_id: taskId, due_ms: dueMs }).first();
    if (existing) {
      throw new Refusal('already_done', `"${task.label}" due ${due.toFormat('HH:mm')} was already ticked off at ${DateTime.fromISO(existing.done_at, { zone }).toFormat('HH:mm')}.`, { at: existing.done_at });
    }
    await trx('shift_task_done').insert({ task_id: taskId, due: due.toISO({ suppressMilliseconds: true }), due_ms: dueMs, done_at: at, user_id: user.id });
    await appendLog(
      trx,
      { at, atMs: now.getTime(), day, roomId: task.room_id, roomName: task.room_name, examAccession: null, cleanType: 'shift task', kind: 'shift task', stepKey: task.key, stepLabel: task.label },
      user,
    );
  });
  const tasks = (await shiftTasksOfDay(db, [task.room_id], day, zone, now)).get(task.room_id)!;
  return { task: tasks.find((t) => t.taskId === taskId && Date.parse(t.due) === dueMs)!, day };
}
