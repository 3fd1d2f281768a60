import { Router } from 'express';
import type { Knex } from 'knex';
import { z } from 'zod';
import { NOTE_MAX_CHARS } from '../../shared/api/limits';
import type { Clock } from '../clock';
import { currentUser, requireRole } from '../middleware/roles';
import { loadChecklist } from '../services/checklist';
import type { DayEvents } from '../services/day-events';
import { completeTurnover } from '../services/turnover-complete';
import { tickStep } from '../services/turnover-ticks';
import { parseInput } from '../validate';
import { publishDayEvent } from './announce';
import { idParam } from './params';

const tickSchema = z.object({
  productKey: z.string().min(1).max(40).optional(),
  earlyReason: z.string().max(NOTE_MAX_CHARS).optional(),
});
const completeSchema = z.object({ overrideReason: z.string().max(NOTE_MAX_CHARS).optional() });

/** The technologist's checklist: tick steps, complete the turnover. */
export function turnoverRoutes(deps: { db: Knex; clock: Clock; events: DayEvents }): Router {
  const router = Router();

  router.post('/:id/steps/:key/done', requireRole('tech', 'charge'), async (req, res) => {
    const input = parseInput(tickSchema, req.body ?? {}, 'step');
    const user = currentUser(req);
    const now = deps.clock.now();
    const ref = await tickStep(deps.db, idParam(req.params['id'], 'a turnover'), String(req.params['key']), input, user, now);
    publishDayEvent(deps, ref.day, ['board', 'log'], 'step done', user);
    res.json(await loadChecklist(deps.db, ref.roomId, ref.day, now, ref.turnoverId));
  });

  router.post('/:id/complete', requireRole('tech', 'charge'), async (req, res) => {
    const { overrideReason } = parseInput(completeSchema, req.body ?? {}, 'completion');
    const user = currentUser(req);
    const now = deps.clock.now();
    const ref = await completeTurnover(deps.db, idParam(req.params['id'], 'a turnover'), overrideReason, user, now);
    publishDayEvent(deps, ref.day, ['board', 'log'], 'turnover complete', user);
    res.json(await loadChecklist(deps.db, ref.roomId, ref.day, now, ref.turnoverId));
  });

  return router;
}
