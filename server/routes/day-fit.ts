import { Router } from 'express';
import type { Knex } from 'knex';
import type { Clock } from '../clock';
import { currentUser, requireRole } from '../middleware/roles';
import type { DayEvents } from '../services/day-events';
import { applyFit, pinExam, proposeFit } from '../services/day-fit';
import { loadDayPlan } from '../services/day-plan';
import { parseInput } from '../validate';
import type { DayFitPool } from '../workers/day-fit-pool';
import { dayFitApplySchema, examPinSchema } from '../../shared/api/day-fit';
import { publishDayEvent } from './announce';
import { idParam, parseDay } from './params';

interface DayFitDeps {
  db: Knex;
  clock: Clock;
  events: DayEvents;
  dayFitPool: DayFitPool;
}

/** "Make the day fit": the whole-day proposal (solved in a worker) and applying it. */
export function dayFitRoutes(deps: DayFitDeps): Router {
  const router = Router();

  router.post('/:date/fit', requireRole('charge'), async (req, res) => {
    res.json(await proposeFit(deps.db, deps.dayFitPool, parseDay(req.params['date']), deps.clock.now()));
  });

  router.post('/:date/fit/apply', requireRole('charge'), async (req, res) => {
    const day = parseDay(req.params['date']);
    const body = parseInput(dayFitApplySchema, req.body, 'proposal');
    const user = currentUser(req);
    const changeId = await applyFit(deps.db, day, body, user.id, deps.clock.now());
    publishDayEvent(deps, day, 'plan', 'day fit', user);
    res.json({ changeId, plan: await loadDayPlan(deps.db, day) });
  });

  return router;
}

/** `PUT /api/exams/:id/pin`: pin or unpin an exam (those who move slots). */
export function examPinRoutes(deps: Omit<DayFitDeps, 'dayFitPool'>): Router {
  const router = Router();
  router.put('/:id/pin', requireRole('scheduler', 'charge'), async (req, res) => {
    const examId = idParam(req.params['id'], 'exam');
    const { pinned } = parseInput(examPinSchema, req.body, 'pin');
    const day = await pinExam(deps.db, examId, pinned);
    publishDayEvent(deps, day, 'plan', pinned ? 'pinned' : 'unpinned', currentUser(req));
    res.json({ examId, pinned });
  });
  return router;
}
