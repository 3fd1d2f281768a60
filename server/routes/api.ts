import { Router } from 'express';
import type { Knex } from 'knex';
import type { Clock } from '../clock';
import type { DayEvents } from '../services/day-events';
import type { WorkerPool } from '../workers/pool';
import type { FixesPool } from '../workers/fixes-pool';
import { dayChangeRoutes } from './day-changes';
import { dayRoutes } from './days';
import { examRoutes } from './exams';
import { boardRoutes } from './board';
import { examProgressRoutes } from './exam-progress';
import { logRoutes } from './log';
import { shiftTaskRoutes } from './shift-tasks';
import { turnoverRoutes } from './turnovers';
import { auditRoutes } from './audit';
import { equipmentRoutes } from './equipment';
import { profileRoutes } from './profile';
import { roomSetupRoutes } from './room-setup';
import { userRoutes } from './users';

/**
 * Day-plan routes: days (plan, import, history, fixes, events) and exams (moves, staffing);
 * the day itself: board, arrivals, turnovers, shift tasks and the cleaning log.
 */
export function apiRoutes(deps: { db: Knex; clock: Clock; events: DayEvents; workers: WorkerPool; fixesPool: FixesPool }): Router {
  const router = Router();
  router.use('/days', dayRoutes(deps), dayChangeRoutes(deps));
  router.use('/exams', examRoutes(deps), examProgressRoutes(deps));
  // Rooms now, checklists, the cleaning log and shift tasks
  router.use(boardRoutes(deps));
  router.use('/turnovers', turnoverRoutes(deps));
  router.use('/shift-tasks', shiftTaskRoutes(deps));
  router.use(logRoutes(deps));
  // Setup (admin) and each user's own profile
  router.use('/rooms', roomSetupRoutes(deps));
  router.use('/equipment', equipmentRoutes(deps));
  router.use('/users', userRoutes(deps));
  router.use('/profile', profileRoutes(deps));
  router.use('/audit', auditRoutes(deps));
  return router;
}
