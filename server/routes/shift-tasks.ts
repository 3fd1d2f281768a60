import { Router } from 'express';
import type { Knex } from 'knex';
import { z } from 'zod';
import type { Clock } from '../clock';
import { shiftTaskInputSchema, shiftTaskUpdateSchema } from '../../shared/api/shift-tasks';
import { currentUser, requireRole } from '../middleware/roles';
import type { DayEvents } from '../services/day-events';
import { readSettings } from '../services/settings';
import { createShiftTask, listShiftTasks, retireShiftTask, updateShiftTask } from '../services/shift-task-setup';
import { markShiftTaskDone } from '../services/shift-tasks';
import { parseInput } from '../validate';
import { publishDayEvent } from './announce';
import { idParam } from './params';

const doneSchema = z.object({ due: z.string().datetime({ offset: true, message: 'due must be ISO 8601 with an offset' }) });

/**
 * Ticking off a recurring shift task's occurrence (logged as a `shift task` entry), and Setup →
 * Shift tasks (admin): list, add, edit and retire the recurring tasks of every room.
 */
export function shiftTaskRoutes(deps: { db: Knex; clock: Clock; events: DayEvents }): Router {
  const router = Router();

  router.post('/:taskId/done', requireRole('tech', 'charge'), async (req, res) => {
    const { due } = parseInput(doneSchema, req.body ?? {}, 'shift task');
    const user = currentUser(req);
    const { timezone } = await readSettings(deps.db);
    const result = await markShiftTaskDone(deps.db, idParam(req.params['taskId'], 'a shift task'), due, user, timezone, deps.clock.now());
    publishDayEvent(deps, result.day, ['board', 'log'], 'shift task', user);
    res.status(201).json({ task: result.task });
  });

  // the board and the Turnover screen list today's occurrences: open screens refetch
  const changed = (user: { displayName: string; username: string }) => publishDayEvent(deps, '*', 'board', 'setup', user);

  router.get('/', requireRole('admin'), async (_req, res) => {
    res.json({ tasks: await listShiftTasks(deps.db) });
  });

  router.post('/', requireRole('admin'), async (req, res) => {
    const input = parseInput(shiftTaskInputSchema, req.body, 'shift task');
    const task = await createShiftTask(deps.db, input, currentUser(req), deps.clock.now());
    changed(currentUser(req));
    res.status(201).json({ task });
  });

  router.put('/:taskId', requireRole('admin'), async (req, res) => {
    const input = parseInput(shiftTaskUpdateSchema, req.body, 'shift task');
    const task = await updateShiftTask(deps.db, idParam(req.params['taskId'], 'a shift task'), input, currentUser(req), deps.clock.now());
    changed(currentUser(req));
    res.json({ task });
  });

  router.post('/:taskId/retire', requireRole('admin'), async (req, res) => {
    const task = await retireShiftTask(deps.db, idParam(req.params['taskId'], 'a shift task'), currentUser(req), deps.clock.now());
    changed(currentUser(req));
    res.json({ task });
  });

  return router;
}
