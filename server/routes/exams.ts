import { Router } from 'express';
import type { Knex } from 'knex';
import { examCancelQuery, examEditSchema, examMoveSchema, gapStaffingSchema } from '../../shared/api/changes';
import { cancelExam, editExam } from '../services/exam-edits';
import type { Clock } from '../clock';
import { currentUser, requireRole } from '../middleware/roles';
import type { DayEvents } from '../services/day-events';
import { loadDayPlan } from '../services/day-plan';
import { moveExam } from '../services/exam-moves';
import { setGapStaffing } from '../services/staffing';
import { parseInput } from '../validate';
import { publishDayEvent } from './announce';
import { idParam } from './params';

export function examRoutes(deps: { db: Knex; clock: Clock; events: DayEvents }): Router {
  const router = Router();

  /** Move a slot: along its lane (start), to another room (roomId), or both. Answers the day's new plan. */
  router.patch('/:id', requireRole('scheduler', 'charge'), async (req, res) => {
    const input = parseInput(examMoveSchema, req.body, 'move');
    const user = currentUser(req);
    const day = await moveExam(deps.db, idParam(req.params['id'], 'an exam'), input, user.id, deps.clock.now());
    publishDayEvent(deps, day, 'plan', input.reason, user);
    res.json(await loadDayPlan(deps.db, day));
  });

  /** Edits an exam's fields (the import's columns) at the version read. Answers the day's new plan. */
  router.put('/:id', requireRole('scheduler', 'charge'), async (req, res) => {
    const input = parseInput(examEditSchema, req.body ?? {}, 'exam');
    const user = currentUser(req);
    const day = await editExam(deps.db, idParam(req.params['id'], 'an exam'), input, { userId: user.id, now: deps.clock.now() });
    publishDayEvent(deps, day, 'plan', 'exam edited', user);
    res.json(await loadDayPlan(deps.db, day));
  });

  /** Cancels an exam (`?version=`, the version read). Answers the day's new plan. */
  router.delete('/:id', requireRole('scheduler', 'charge'), async (req, res) => {
    const { version } = parseInput(examCancelQuery, req.query, 'cancel');
    const user = currentUser(req);
    const day = await cancelExam(deps.db, idParam(req.params['id'], 'an exam'), version, { userId: user.id, now: deps.clock.now() });
    publishDayEvent(deps, day, 'plan', 'exam cancelled', user);
    res.json(await loadDayPlan(deps.db, day));
  });

  /** Helpers on one turnover (the gap before this exam). */
  router.put('/:id/staffing', requireRole('charge'), async (req, res) => {
    const { staff } = parseInput(gapStaffingSchema, req.body, 'staffing');
    const user = currentUser(req);
    const day = await setGapStaffing(deps.db, idParam(req.params['id'], 'an exam'), staff, user.id, deps.clock.now());
    publishDayEvent(deps, day, 'plan', 'staffing', user);
    res.json(await loadDayPlan(deps.db, day));
  });

  return router;
}
