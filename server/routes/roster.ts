import { Router } from 'express';
import type { Knex } from 'knex';
import type { Clock } from '../clock';
import { ValidationError } from '../errors';
import { currentUser, requireRole, requireUser } from '../middleware/roles';
import type { DayEvents } from '../services/day-events';
import { clearDayRoster, parseRosterRows, readDayRoster, readWeeklyRoster, saveDayRoster, saveWeeklyRoster } from '../services/roster';
import { publishDayEvent } from './announce';
import { parseDay } from './params';

type Deps = { db: Knex; clock: Clock; events: DayEvents };

/**
 * A day's roster (mounted under /days): everyone signed in reads it, a charge technologist (or an
 * admin) saves it or returns the day to its weekday's default. A change is a change of the day:
 * its version rises (trigger), it goes into the day's history (undoable) and open screens refetch.
 */
export function dayRosterRoutes(deps: Deps): Router {
  const router = Router();

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
