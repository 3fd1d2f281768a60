import { Router, type Request, type Response } from 'express';
import { rateLimit } from 'express-rate-limit';
import type { Knex } from 'knex';
import type { CalendarFeedAddresses } from '../../shared/api/calendar';
import type { Clock } from '../clock';
import { NotFoundError, Refusal } from '../errors';
import { currentUser, requireUser } from '../middleware/roles';
import { roomFeed, userFeed, type FeedContext } from '../services/calendar/feeds';
import { listRooms } from '../services/rooms';
import { feedStatus, revokeFeedToken, rotateFeedToken, userOfFeedToken } from '../services/calendar/tokens';
import { idParam } from './params';

const WINDOW_MS = 15 * 60_000;
/**
 * Unknown or revoked tokens one address may ask for per window before 429 (a real token is never
 * counted). Generous: a ward behind one address may have a few stale subscriptions polling.
 */
export const FEED_MISSES_PER_WINDOW = 100;
/** New addresses one user may make per window. */
export const FEED_ROTATIONS_PER_WINDOW = 10;

interface CalendarDeps {
  db: Knex;
  clock: Clock;
  calendar: FeedContext;
}

const tooMany = (what: string) => (_req: Request, _res: Response, next: (err: unknown) => void) =>
  next(new Refusal('too_many_attempts', `Too many ${what}. Wait a few minutes and try again.`, undefined));

/**
 * One's own feed addresses (signed in): whether they are on, a new one (rotating: the old one
 * answers 404 from then on), or none (revoking). The token is shown once, in the rotate answer.
 */
export function calendarTokenRoutes(deps: CalendarDeps): Router {
  const router = Router();
  router.use(requireUser);
  const rotations = rateLimit({
    windowMs: WINDOW_MS,
    limit: FEED_ROTATIONS_PER_WINDOW,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    keyGenerator: (req) => `user\n${currentUser(req).id}`,
    handler: tooMany('new calendar addresses'),
  });

  router.get('/', async (req, res) => {
    res.json(await feedStatus(deps.db, currentUser(req).id));
  });

  router.post('/rotate', rotations, async (req, res) => {
    const user = currentUser(req);
    const token = await rotateFeedToken(deps.db, user.id, deps.clock.now());
    const rooms = await listRooms(deps.db);
    const base = `${deps.calendar.publicUrl}/api/calendar/${token}`;
    const answer: CalendarFeedAddresses = {
      ...(await feedStatus(deps.db, user.id)),
      feeds: [{ label: 'My shift tasks and rooms', url: `${base}/mine.ics` }, ...rooms.map((r) => ({ label: r.name, url: `${base}/rooms/${r.id}.ics` }))],
    };
    res.json(answer);
  });

  router.delete('/', async (req, res) => {
    await revokeFeedToken(deps.db, currentUser(req).id);
    res.status(204).end();
  });

  return router;
}

/**
 * The feeds themselves, fetched by calendar apps without a session: the token in the path is
 * the key. An unknown or revoked token is a 404, and an address that keeps trying unknown
 * tokens is throttled (429), since each guess is a lookup.
 */
export function calendarFeedRoutes(deps: CalendarDeps): Router {
  const router = Router();
  const misses = rateLimit({
    windowMs: WINDOW_MS,
    limit: FEED_MISSES_PER_WINDOW,
    skipSuccessfulRequests: true,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    validate: { xForwardedForHeader: false },
    handler: tooMany('calendar addresses that do not exist'),
  });

  const send = (res: Response, body: string) => {
    res.set('Cache-Control', 'private, no-cache');
    res.type('text/calendar; charset=utf-8').send(body);
  };
  const userOf = async (req: Request) => {
    const user = await userOfFeedToken(deps.db, String(req.params['token']), deps.clock.now());
    if (!user) throw new NotFoundError('No calendar feed at this address.');
    return user;
  };

  router.get('/:token/mine.ics', misses, async (req, res) => {
    const user = await userOf(req);
    send(res, await userFeed(deps.db, deps.calendar, user, deps.clock.now()));
  });

  router.get('/:token/rooms/:roomId.ics', misses, async (req, res) => {
    await userOf(req);
    send(res, await roomFeed(deps.db, deps.calendar, idParam(req.params['roomId'], 'a room'), deps.clock.now()));
  });

  return router;
}
