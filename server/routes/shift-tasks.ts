import { Router } from 'express';
import type { Knex } from 'knex';
import { z } from 'zod';
import type { Clock } from '../clock';
import { currentUser, requireRole } from '../middleware/roles';
import type { DayEvents } from '../services/day-events';
import { readSettings } from '../services/settings';
import { markShiftTaskDone } from '../services/shift-tasks';
import { parseInput } from '../validate';
import { publishDayEvent } from './announce';
import { idParam } from './params';

const doneSchema = z.object({ due: z.string().datetime({ offset: true, message: 'due must be ISO 8601 with an offset' }) });

/** Ticking off a recurring shift task's occurrence (logged as a `shift task` entry). */
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

  return router;
}
