import { Router } from 'express';
import type { Knex } from 'knex';
import type { Clock } from '../clock';
import type { DayEvents } from '../services/day-events';
import { dayChangeRoutes } from './day-changes';
import { dayRoutes } from './days';
import { examRoutes } from './exams';

/** Day-plan routes: days (plan, import, history, fixes, events) and exams (moves, staffing). */
export function apiRoutes(deps: { db: Knex; clock: Clock; events: DayEvents }): Router {
  const router = Router();
  router.use('/days', dayRoutes(deps), dayChangeRoutes(deps));
  router.use('/exams', examRoutes(deps));
  return router;
}
