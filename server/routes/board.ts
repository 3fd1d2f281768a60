import { Router } from 'express';
import type { Knex } from 'knex';
import type { Clock } from '../clock';
import { requireUser } from '../middleware/roles';
import { loadBoard } from '../services/board';
import { loadChecklist } from '../services/checklist';
import type { DayEvents } from '../services/day-events';
import { readSettings } from '../services/settings';
import { shiftTasksOfDay } from '../services/shift-tasks';
import { NotFoundError } from '../errors';
import { dayOrToday, idParam } from './params';
import { parseDay } from './days';

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
    const roomId = idParam(req.params['id'], 'a room');
    const day = await dayOrToday(deps.db, req.query['date'], now);
    if (!(await deps.db('rooms').where({ id: roomId, active: true }).first('id'))) throw new NotFoundError(`No room ${roomId}.`);
    const { timezone } = await readSettings(deps.db);
    res.json({ tasks: (await shiftTasksOfDay(deps.db, [roomId], day, timezone, now)).get(roomId)! });
  });

  return router;
}
