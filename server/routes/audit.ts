import { Router } from 'express';
import type { Knex } from 'knex';
import { z } from 'zod';
import { AUDIT_PAGE_MAX } from '../../shared/api/audit';
import { requireRole } from '../middleware/roles';
import { listAudit } from '../services/audit';
import { parseInput } from '../validate';

const pageSchema = z.object({
  limit: z.coerce.number().int().min(1).max(AUDIT_PAGE_MAX).default(25),
  offset: z.coerce.number().int().min(0).default(0),
});

/** Setup → Audit (admin): every setup change, newest first, a page at a time. */
export function auditRoutes(deps: { db: Knex }): Router {
  const router = Router();
  router.get('/', requireRole('admin'), async (req, res) => {
    res.json(await listAudit(deps.db, parseInput(pageSchema, req.query, 'query')));
  });
  return router;
}
