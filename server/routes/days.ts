import { Router, type RequestHandler } from 'express';
import type { Knex } from 'knex';
import multer from 'multer';
import type { Clock } from '../clock';
import type { DayEvents } from '../services/day-events';
import { z } from 'zod';
import { EXAM_FILE_LIMITS } from '../../shared/exam-list/file-limits';
import { HttpError, ValidationError } from '../errors';
import { FileLimitError } from '../services/file-limits';
import type { WorkerPool } from '../workers/pool';
import { parseInput } from '../validate';
import { currentUser, requireRole, requireUser } from '../middleware/roles';
import { loadCachedDayPlan, loadDayPlan } from '../services/day-plan';
import { addExam } from '../services/exam-edits';
import { examFormSchema } from '../../shared/api/changes';
import { importExamList } from '../services/exam-import';
import { digestAfterImport } from '../services/notices/import-digest';
import type { NoticeDeps } from './notices';
import { recordImportVerdicts } from '../services/import-verdicts';
import { publishDayEvent } from './announce';
import { parseDay } from './params';

const dryRunQuery = z.object({
  dryRun: z.enum(['true', 'false']).optional(),
  dayVersion: z.coerce.number().int().min(0).optional(),
});

export function dayRoutes(deps: { db: Knex; clock: Clock; events: DayEvents; workers: WorkerPool; notices?: NoticeDeps }): Router {
  const router = Router();
  const multipart = multer({
    storage: multer.memoryStorage(),
    limits: { fileSize: EXAM_FILE_LIMITS.maxUploadBytes, files: 1, fields: 5, parts: 6, headerPairs: 50 },
  }).single('file');
  // A truncated body or a broken boundary is the client's fault: 400, never a 500.
  const upload: RequestHandler = (req, res, next) => multipart(req, res, (err?: unknown) => next(err ? uploadError(err) : undefined));

  // Served from the plan cache with a strong ETag: an unchanged day answers 304 to a revalidation.
  // `private, no-cache` (not no-store) so a browser may keep it but must ask before each use.
  router.get('/:date/plan', requireUser, async (req, res) => {
    const { json, etag } = await loadCachedDayPlan(deps.db, parseDay(req.params['date']));
    res.set({ ETag: etag, 'Cache-Control': 'private, no-cache' });
    if (req.fresh) {
      res.status(304).end();
      return;
    }
    res.type('application/json').send(json);
  });

  router.post('/:date/exams/import', requireRole('scheduler', 'charge'), upload, async (req, res) => {
    const day = parseDay(req.params['date']);
    const query = parseInput(dryRunQuery, req.query, 'import');
    if (!req.file) throw new ValidationError('Choose a file to import (multipart field "file").');
    const user = currentUser(req);
    const result = await importExamList(deps.db, deps.workers, {
      day,
      file: req.file,
      userId: user.id,
      dryRun: query.dryRun === 'true',
      now: deps.clock.now(),
      expectedDayVersion: query.dayVersion,
    });
    if (!result.dryRun) {
      // Reports' "as imported": the plan the import left, before any move or fix
      await recordImportVerdicts(deps.db, day);
      publishDayEvent(deps, day, 'plan', 'import', user);
    }
    // a digest of the problem gaps to those who asked for it; queued only, sent by the notice loop
    if (!result.dryRun) await digestAfterImport(deps.db, deps.notices, { day, userId: user.id, now: deps.clock.now() });
    res.json(result);
  });

  /** Adds one exam by hand, checked by the import's rules. Answers the day's new plan. */
  router.post('/:date/exams', requireRole('scheduler', 'charge'), async (req, res) => {
    const day = parseDay(req.params['date']);
    const input = parseInput(examFormSchema, req.body ?? {}, 'exam');
    const user = currentUser(req);
    await addExam(deps.db, day, input, { userId: user.id, now: deps.clock.now() });
    publishDayEvent(deps, day, 'plan', 'exam added', user);
    res.status(201).json(await loadDayPlan(deps.db, day));
  });

  return router;
}

function uploadError(err: unknown): HttpError {
  if (err instanceof HttpError) return err;
  const code = (err as { code?: string }).code;
  if (code === 'LIMIT_FILE_SIZE') {
    return new FileLimitError(413, 'maxUploadBytes', `The file is larger than ${EXAM_FILE_LIMITS.maxUploadBytes / (1024 * 1024)} MB; a day list is far smaller.`);
  }
  return new HttpError(400, 'bad_upload', 'The upload could not be read: send one file as multipart/form-data in the field "file".');
}
