import { Router } from 'express';
import type { Knex } from 'knex';
import { reportQuerySchema } from '../../shared/api/reports';
import type { Clock } from '../clock';
import { requireRole } from '../middleware/roles';
import { buildReport } from '../services/reports';
import { parseInput } from '../validate';

/**
 * `GET /api/reports?from=&to=&room=`: the Reports screen's numbers for a range of at most
 * REPORT_MAX_DAYS days (a longer or reversed range is a 422 naming the problem), charge
 * technologists and admins. The screen draws and exports them (CSV) itself.
 */
export function reportRoutes(deps: { db: Knex; clock: Clock }): Router {
  const router = Router();
  router.get('/', requireRole('charge'), async (req, res) => {
    const query = parseInput(reportQuerySchema, req.query, 'report');
    res.json(await buildReport(deps.db, query, deps.clock.now()));
  });
  return router;
}
