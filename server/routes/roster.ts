import { Router, type RequestHandler } from 'express';
import multer from 'multer';
import { z } from 'zod';
import type { Knex } from 'knex';
import type { Clock } from '../clock';
import { HttpError, ValidationError } from '../errors';
import { parseInput } from '../validate';
import { currentUser, requireRole, requireUser } from '../middleware/roles';
import type { DayEvents } from '../services/day-events';
import { clearDayRoster, importRosterFile, parseRosterRows, readDayRoster, ROSTER_FILE_MAX_BYTES, readWeeklyRoster, saveDayRoster, saveWeeklyRoster } from '../services/roster';
import { publishDayEvent } from './announce';
import { parseDay } from './params';

type Deps = { db: Knex; clock: Clock; events: DayEvents };

const dryRunQuery = z.object({ dryRun: z.enum(['true', 'false']).optional() });

/**
 * A day's roster (mounted under /days): everyone signed in reads it, a charge technologist (or an
 * admin) saves it or returns the day to its weekday's default. A change is a change of the day:
 * its version rises (trigger), it goes into the day's history (undoable) and open screens refetch.
 */
export function dayRosterRoutes(deps: Deps): Router {
  const router = Router();
  const multipart = multer({
    storage: multer.memoryStorage(),
    limits: { fileSize: ROSTER_FILE_MAX_BYTES, files: 1, fields: 5, parts: 6, headerPairs: 50 },
  }).single('file');
  // A truncated body, a broken boundary or a file over the limit: the client's fault, never a 500.
  const upload: RequestHandler = (req, res, next) =>
    multipart(req, res, (err?: unknown) => {
      if (!err) return next();
      if ((err as { code?: string }).code === 'LIMIT_FILE_SIZE') return next(new HttpError(413, 'file_limit_exceeded', `A roster file is at most ${ROSTER_FILE_MAX_BYTES / 1024} KB.`, { limit: 'bytes', max: ROSTER_FILE_MAX_BYTES }));
      next(new HttpError(400, 'bad_upload', 'The upload could not be read: send one file as multipart/form-data in the field "file".'));
    });

  router.get('/:date/roster', requireUser, async (req, res) => {
    res.json({ roster: await readDayRoster(deps.db, parseDay(req.params['date'])) });
  });

  router.put('/:date/roster', requireRole('charge'), async (req, res) => {
    const day = parseDay(req.params['date']);
    const rows = await parseRosterRows(deps.db, req.body);
    const user = currentUser(req);
    const roster = await saveDayRoster(deps.db, day, rows, user.id, deps.clock.now());
    publishDayEvent(deps, day, 'plan', 'roster', user);
    res.json({ roster });
  });

  /** A roster file (CSV or .xlsx): `?dryRun=true` previews its rows; else they become the day's roster. */
  router.post('/:date/roster/import', requireRole('charge'), upload, async (req, res) => {
    const day = parseDay(req.params['date']);
    const { dryRun } = parseInput(dryRunQuery, req.query, 'import');
    if (!req.file) throw new ValidationError('Choose a roster file to import (multipart field "file").');
    const user = currentUser(req);
    const answer = await importRosterFile(deps.db, { day, file: req.file, userId: user.id, dryRun: dryRun === 'true', now: deps.clock.now() });
    if (!answer.dryRun) publishDayEvent(deps, day, 'plan', 'roster', user);
    res.json(answer);
  });

  router.delete('/:date/roster', requireRole('charge'), async (req, res) => {
    const day = parseDay(req.params['date']);
    const user = currentUser(req);
    const roster = await clearDayRoster(deps.db, day, user.id, deps.clock.now());
    publishDayEvent(deps, day, 'plan', 'roster', user);
    res.json({ roster });
  });

  return router;
}

/** The weekly default roster (mounted at /roster/weekly): read by anyone signed in, set in Setup by an admin. */
export function weeklyRosterRoutes(deps: Deps): Router {
  const router = Router();

  router.get('/', requireUser, async (_req, res) => {
    res.json({ weekly: await readWeeklyRoster(deps.db) });
  });

  router.put('/:weekday', requireRole('admin'), async (req, res) => {
    const weekday = Number(req.params['weekday']);
    if (!Number.isInteger(weekday) || weekday < 1 || weekday > 7) {
      throw new ValidationError('A weekday is 1 (Monday) to 7 (Sunday).', { problems: [{ field: 'weekday', message: 'a weekday is 1 (Monday) to 7 (Sunday)' }] });
    }
    const rows = await parseRosterRows(deps.db, req.body);
    const user = currentUser(req);
    const weekly = await saveWeeklyRoster(deps.db, weekday, rows, user, deps.clock.now());
    // every day without a roster of its own may plan differently: open screens refetch
    publishDayEvent(deps, '*', 'plan', 'roster', user);
    res.json({ weekly });
  });

  return router;
}
