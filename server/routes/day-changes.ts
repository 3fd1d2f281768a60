import { Router } from 'express';
import type { Knex } from 'knex';
import { z } from 'zod';
import type { Clock } from '../clock';
import { Refusal } from '../errors';
import { currentUser, requireRole, requireUser } from '../middleware/roles';
import type { DayEvents } from '../services/day-events';
import { loadDayPlan } from '../services/day-plan';
import { applyFix, dayFixesPage, gapFixes } from '../services/fixes';
import { dayHistory, undoOrRedo } from '../services/plan-changes';
import { parseInput } from '../validate';
import type { FixesPool } from '../workers/fixes-pool';
import { MAX_FIX_GAPS_PER_CALL } from '../../shared/fixes/model';
import { publishDayEvent } from './announce';
import { parseDay } from './params';

const examId = z.coerce.number().int().positive().max(Number.MAX_SAFE_INTEGER);
/** `?gap=` (one gap's fixes) alone, or a page: `?limit=` problem gaps (at most 20) `&after=` a page's `next`. */
const fixesQuerySchema = z
  .object({
    gap: examId.optional(),
    after: examId.optional(),
    limit: z.coerce.number().int().min(1).max(MAX_FIX_GAPS_PER_CALL).optional(),
  })
  .refine((q) => q.gap === undefined || (q.after === undefined && q.limit === undefined), { message: 'gap gives one gap\'s fixes: send it without after or limit', path: ['gap'] });
const applySchema = z.object({ fixId: z.string().min(1).max(80), acceptNewProblems: z.boolean().default(false) });

/** History, undo/redo, suggested fixes and the live event stream of a day. */
export function dayChangeRoutes(deps: { db: Knex; clock: Clock; events: DayEvents; fixesPool: FixesPool }): Router {
  const router = Router();

  router.get('/:date/history', requireUser, async (req, res) => {
    res.json(await dayHistory(deps.db, parseDay(req.params['date']), currentUser(req).id));
  });

  for (const mode of ['undo', 'redo'] as const) {
    router.post(`/:date/${mode}`, requireRole('scheduler', 'charge'), async (req, res) => {
      const day = parseDay(req.params['date']);
      const user = currentUser(req);
      const done = await undoOrRedo(deps.db, day, user.id, mode, deps.clock.now());
      if (!done) throw mode === 'undo' ? new Refusal('nothing_to_undo', 'You have nothing to undo on this day.', undefined) : new Refusal('nothing_to_redo', 'You have nothing to redo on this day.', undefined);
      publishDayEvent(deps, day, 'plan', mode, user);
      res.json(await loadDayPlan(deps.db, day));
    });
  }

  router.get('/:date/fixes', requireUser, async (req, res) => {
    const day = parseDay(req.params['date']);
    const query = parseInput(fixesQuerySchema, req.query, 'query');
    if (query.gap !== undefined) res.json({ fixes: await gapFixes(deps.db, deps.fixesPool, day, query.gap, deps.clock.now()) });
    else res.type('json').send(await dayFixesPage(deps.db, deps.fixesPool, day, query, deps.clock.now()));
  });

  router.post('/:date/fixes/apply', requireRole('charge'), async (req, res) => {
    const day = parseDay(req.params['date']);
    const { fixId, acceptNewProblems } = parseInput(applySchema, req.body, 'fix');
    const user = currentUser(req);
    const fix = await applyFix(deps.db, deps.fixesPool, day, fixId, acceptNewProblems, user.id, deps.clock.now());
    publishDayEvent(deps, day, 'plan', 'suggestion', user);
    res.json({ applied: fix, plan: await loadDayPlan(deps.db, day) });
  });

  /** Server-sent events: one `change` event per import, move or staffing change of the day. */
  router.get('/:date/events', requireUser, (req, res) => {
    const day = parseDay(req.params['date']);
    res.writeHead(200, { 'Content-Type': 'text/event-stream', 'Cache-Control': 'no-cache, no-transform', Connection: 'keep-alive' });
    res.write('retry: 2000\n\n');
    const unsubscribe = deps.events.subscribe(day, (event) => res.write(`event: change\ndata: ${JSON.stringify(event)}\n\n`));
    const heartbeat = setInterval(() => res.write(': keep-alive\n\n'), 25_000);
    heartbeat.unref();
    req.on('close', () => {
      clearInterval(heartbeat);
      unsubscribe();
    });
  });

  return router;
}
