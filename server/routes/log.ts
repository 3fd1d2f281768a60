import { Router, type Request } from 'express';
import type { Knex } from 'knex';
import { z } from 'zod';
import { NOTE_MAX_CHARS } from '../../shared/api/limits';
import type { Clock } from '../clock';
import { currentUser, requireRole } from '../middleware/roles';
import { correctLog, listLog, type LogFilter } from '../services/cleaning-log';
import type { DayEvents } from '../services/day-events';
import { logCsv } from '../services/log-csv';
import { readSettings } from '../services/settings';
import { localIso } from '../services/turnovers';
import { parseInput } from '../validate';
import { publishDayEvent } from './announce';
import { idParam, parseDay } from './params';

const filterSchema = z.object({
  date: z.string().optional(),
  roomId: z.coerce.number().int().positive().optional(),
  user: z.string().min(1).max(64).optional(),
});
const correctionSchema = z.object({ note: z.string().trim().min(1, 'say what was wrong').max(NOTE_MAX_CHARS) });

function filterOf(req: Request): LogFilter {
  const { date, roomId, user } = parseInput(filterSchema, req.query, 'filter');
  // the same day check as every other route (a real calendar day, not just its shape)
  return { day: date === undefined ? undefined : parseDay(date), roomId, username: user };
}

/**
 * The append-only cleaning log: read, export, correct. There is deliberately no route that
 * updates or deletes an entry (and the database refuses it too).
 */
export function logRoutes(deps: { db: Knex; clock: Clock; events: DayEvents }): Router {
  const router = Router();
  const readers = requireRole('tech', 'charge');

  router.get('/log', readers, async (req, res) => {
    res.json({ entries: await listLog(deps.db, filterOf(req)) });
  });

  router.get('/log.csv', readers, async (req, res) => {
    const filter = filterOf(req);
    const name = ['cleaning-log', filter.day, filter.roomId && `room-${filter.roomId}`, filter.username].filter(Boolean).join('-');
    res.type('text/csv; charset=utf-8').attachment(`${name}.csv`).send(logCsv(await listLog(deps.db, filter)));
  });

  router.post('/log/:id/corrections', readers, async (req, res) => {
    const { note } = parseInput(correctionSchema, req.body ?? {}, 'correction');
    const user = currentUser(req);
    const now = deps.clock.now();
    const { timezone } = await readSettings(deps.db);
    const entry = await correctLog(deps.db, idParam(req.params['id'], 'a log entry'), note, user, { at: localIso(now, timezone), atMs: now.getTime() });
    publishDayEvent(deps, entry.day, ['log'], 'correction', user);
    res.status(201).json(entry);
  });

  return router;
}
