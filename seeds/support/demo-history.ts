import type { Knex } from 'knex';
import { DateTime } from 'luxon';
import { loadChecklist } from '../../server/services/checklist';
import { completeTurnover } from '../../server/services/turnover-complete';
import { tickStep } from '../../server/services/turnover-ticks';
import { finishExam } from '../../server/services/turnovers';
import { findActiveUser } from '../../server/services/users';
import { readSettings } from '../../server/services/settings';
import { markShiftTaskDone, shiftTasksOfDay } from '../../server/services/shift-tasks';

/**
 * Plays today's invented list forward to the moment of seeding, as the demo technologist would
 * have worked it: each exam that has ended is recorded finished at its planned end, its turnover's
 * steps ticked at their planned times plus an invented delay of 0–4 minutes (the same for every
 * step of one turnover, so no surface is ticked before it is dry) and closed when ready, so Reports
 * show actual turnovers apart from planned ones. So the board, the checklist and the
 * cleaning log start from a believable state instead of every room "in exam" and hours late.
 * The turnover under way at `now` is left open with the steps done by then; the rest is left to the user.
 * Shift tasks whose time has passed are ticked at their due time.
 */
export async function seedDemoHistory(knex: Knex, now: Date): Promise<void> {
  const { timezone } = await readSettings(knex);
  const day = DateTime.fromJSDate(now).setZone(timezone).toISODate()!;
  if (await knex('turnovers').where({ day }).first()) return;
  const techRow = await knex('users').where({ username: 'tech' }).first('id');
  const tech = techRow && (await findActiveUser(knex, techRow.id));
  if (!tech) return;
  const exams: { id: number; room_id: number; start_ms: number; duration_minutes: number }[] = await knex('exams')
    .where({ day })
    .orderBy([{ column: 'room_id' }, { column: 'start_ms' }]);
  const stoppedRooms = new Set<number>();
  for (const exam of exams) {
    const end = exam.start_ms + exam.duration_minutes * 60_000;
    if (stoppedRooms.has(exam.room_id) || end > now.getTime()) continue;
    const { turnoverId } = await finishExam(knex, exam.id, tech, new Date(end));
    const lateMs = ((exam.id * 7) % 5) * 60_000; // invented, deterministic: some turnovers run late
    const checklist = await loadChecklist(knex, exam.room_id, day, new Date(end), turnoverId);
    const holdEnd = checklist.airHoldUntil ? Date.parse(checklist.airHoldUntil) : 0;
    const readyMs = Math.max(holdEnd, ...checklist.steps.map((s) => Date.parse(s.planned.dryAt) + lateMs));
    for (const step of [...checklist.steps].sort((a, b) => Date.parse(a.planned.end) - Date.parse(b.planned.end))) {
      const at = Date.parse(step.planned.end) + lateMs;
      if (at > now.getTime()) break; // the turnover in progress right now: its later steps are left to the user
      await tickStep(knex, turnoverId, step.key, {}, tech, new Date(at));
    }
    if (readyMs > now.getTime()) {
      stoppedRooms.add(exam.room_id);
      continue;
    }
    await completeTurnover(knex, turnoverId, undefined, tech, new Date(readyMs));
  }
  const roomIds = [...new Set(exams.map((e) => e.room_id))];
  for (const tasks of (await shiftTasksOfDay(knex, roomIds, day, timezone, now)).values()) {
    for (const task of tasks) {
      const doneAt = Date.parse(task.due) + task.durationMinutes * 60_000;
      if (!task.doneAt && doneAt <= now.getTime()) await markShiftTaskDone(knex, task.taskId, task.due, tech, timezone, new Date(doneAt));
    }
  }
}
