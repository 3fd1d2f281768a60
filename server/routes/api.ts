import { Router } from 'express';
import type { Knex } from 'knex';
import type { Clock } from '../clock';

/** Day-plan routes (days, exams) are mounted here as they arrive. */
export function apiRoutes(_deps: { db: Knex; clock: Clock }): Router {
  return Router();
}
