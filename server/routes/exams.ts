import { Router } from 'express';
import type { Knex } from 'knex';
import { examMoveSchema, gapStaffingSchema } from '../../shared/api/changes';
import type { Clock } from '../clock';
import { ValidationError } from '../errors';
import { currentUser, requireRole } from '../middleware/roles';
import type { DayEvents } from '../services/day-events';
import { loadDayPlan } from '../services/day-plan';
import { moveExam } from '../services/exam-moves';
import { setGapStaffing } from '../services/staffing';
import { parseInput } from '../validate';

function examId(value: unknown): number {
  const id = Number(value);
  if (!Number.isInteger(id) || id <= 0) throw new ValidationError(`"${String(value)}" is not an exam id.`);
  return id;
}

export function examRoutes(deps: { db: Knex; clock: Clock; events: DayEvents }): Router {
  const router = Router();

  /** Move a slot: along its lane (start), to another room (roomId), or both. Answers the day's new plan. */
  router.patch('/:id', requireRole('scheduler', 'charge'), async (req, res) => {
    const input = parseInput(examMoveSchema, req.body, 'move');
    const user = currentUser(req);
    const day = await moveExam(deps.db, examId(req.params['id']), input, user.id, deps.clock.now());
    deps.events.publish({ date: day, kind: 'plan', reason: input.reason, by: user.displayName || user.username, at: deps.clock.now().toISOString() });
    res.json(await loadDayPlan(deps.db, day));
  });

  /** Helpers on one turnover (the gap before this exam). */
  router.put('/:id/staffing', requireRole('charge'), async (req, res) => {
    const { staff } = parseInput(gapStaffingSchema, req.body, 'staffing');
    const user = currentUser(req);
    const day = await setGapStaffing(deps.db, examId(req.params['id']), staff, user.id, deps.clock.now());
    deps.events.publish({ date: day, kind: 'plan', reason: 'staffing', by: user.displayName || user.username, at: deps.clock.now().toISOString() });
    res.json(await loadDayPlan(deps.db, day));
  });

  return router;
}
