import { Router } from 'express';
import type { Knex } from 'knex';
import multer from 'multer';
import { DateTime } from 'luxon';
import type { Clock } from '../clock';
import type { DayEvents } from '../services/day-events';
import { ValidationError } from '../errors';
import { currentUser, requireRole, requireUser } from '../middleware/roles';
import { loadDayPlan } from '../services/day-plan';
import { importExamList } from '../services/exam-import';

export const MAX_UPLOAD_BYTES = 5 * 1024 * 1024;

/** `YYYY-MM-DD` that is a real calendar day. */
export function parseDay(value: unknown): string {
  if (typeof value !== 'string' || !/^\d{4}-\d{2}-\d{2}$/.test(value) || !DateTime.fromISO(value).isValid) {
    throw new ValidationError(`"${String(value ?? '')}" is not a date; use YYYY-MM-DD.`);
  }
  return value;
}

export function dayRoutes(deps: { db: Knex; clock: Clock; events: DayEvents }): Router {
  const router = Router();
  const upload = multer({ storage: multer.memoryStorage(), limits: { fileSize: MAX_UPLOAD_BYTES, files: 1, fields: 5 } });

  router.get('/:date/plan', requireUser, async (req, res) => {
    res.json(await loadDayPlan(deps.db, parseDay(req.params['date'])));
  });

  router.post('/:date/exams/import', requireRole('scheduler', 'charge'), upload.single('file'), async (req, res) => {
    const day = parseDay(req.params['date']);
    if (!req.file) throw new ValidationError('Choose a file to import (multipart field "file").');
    const user = currentUser(req);
    const result = await importExamList(deps.db, {
      day,
      file: req.file,
      userId: user.id,
      dryRun: req.query['dryRun'] === 'true',
      now: deps.clock.now(),
    });
    if (!result.dryRun) deps.events.publish({ date: day, kind: 'plan', reason: 'import', by: user.displayName || user.username, at: deps.clock.now().toISOString() });
    res.json(result);
  });

  return router;
}
