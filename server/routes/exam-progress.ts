import { Router } from 'express';
import type { Knex } from 'knex';
import { z } from 'zod';
import { NOTE_MAX_CHARS } from '../../shared/api/limits';
import type { Clock } from '../clock';
import { currentUser, requireRole } from '../middleware/roles';
import { markArrived, unmarkArrived } from '../services/arrivals';
import { loadChecklist } from '../services/checklist';
import type { DayEvents } from '../services/day-events';
import { finishExam } from '../services/turnovers';
import { parseInput } from '../validate';
import { publishDayEvent } from './announce';
import { idParam } from './params';

/** Only needed to record an end before the slot's start: why (logged). */
const finishSchema = z.object({ earlyReason: z.string().max(NOTE_MAX_CHARS).optional() });

/** What happens to an exam on the day itself: the patient arrives, the exam finishes. */
export function examProgressRoutes(deps: { db: Knex; clock: Clock; events: DayEvents }): Router {
  const router = Router();

  router.post('/:id/arrived', requireRole('frontdesk', 'charge', 'tech'), async (req, res) => {
    const user = currentUser(req);
    const { arrivedAt, day } = await markArrived(deps.db, idParam(req.params['id'], 'an exam'), user.id, deps.clock.now());
    publishDayEvent(deps, day, ['board'], 'arrived', user);
    res.json({ arrivedAt });
  });

  router.delete('/:id/arrived', requireRole('frontdesk', 'charge', 'tech'), async (req, res) => {
    const user = currentUser(req);
    const day = await unmarkArrived(deps.db, idParam(req.params['id'], 'an exam'));
    publishDayEvent(deps, day, ['board'], 'arrival undone', user);
    res.json({ arrivedAt: null });
  });

  /** "Exam finished": the actual end; opens the turnover after it. */
  router.post('/:id/finished', requireRole('tech', 'charge'), async (req, res) => {
    const { earlyReason } = parseInput(finishSchema, req.body ?? {}, 'exam end');
    const user = currentUser(req);
    const now = deps.clock.now();
    const ref = await finishExam(deps.db, idParam(req.params['id'], 'an exam'), user, now, earlyReason);
    publishDayEvent(deps, ref.day, ['board', 'log'], 'exam finished', user);
    res.status(201).json(await loadChecklist(deps.db, ref.roomId, ref.day, now, ref.turnoverId));
  });

  return router;
}
