import { Router } from 'express';
import type { Knex } from 'knex';
import type { Clock } from '../clock';
import { dayRoutes } from './days';

/** Day-plan routes: days (plan, import) and, later, exams. */
export function apiRoutes(deps: { db: Knex; clock: Clock }): Router {
  const router = Router();
  router.use('/days', dayRoutes(deps));
  return router;
}
