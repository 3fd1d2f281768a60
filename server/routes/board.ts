import { Router } from 'express';
import type { Knex } from 'knex';
import type { Clock } from '../clock';
import { requireUser } from '../middleware/roles';
import { loadBoard } from '../services/board';
import { loadChecklist } from '../services/checklist';
import type { DayEvents } from '../services/day-events';
import { roomTasksOfDay } from '../services/shift-tasks';
import { dayOrToday, idParam, parseDay } from './params';

/** Rooms now, a room's turnover checklist and its shift tasks: every signed-in role reads them. */
export function boardRoutes(deps: { db: Knex; clock: Clock; events: DayEvents }): Router {
  const router = Router();

  router.get('/days/:date/board', requireUser, async (req, res) => {
    res.json(await loadBoard(deps.db, parseDay(req.params['date']), deps.clock.now()));
  });

  router.get('/rooms/:id/turnover', requireUser, async (req, res) => {
    const now = deps.clock.now();
    const day = await dayOrToday(deps.db, req.query['date'], now);
    res.json(await loadChecklist(deps.db, idParam(req.params['id'], 'a room'), day, now));
  });

  router.get('/rooms/:id/tasks', requireUser, async (req, res) => {
    const now = deps.clock.now();
    const day = await dayOrToday(deps.db, req.query['date'], now);
    res.json({ tasks: await roomTasksOfDay(deps.db, idParam(req.params['id'], 'a room'), day, now) });
  });

  return router;
}
