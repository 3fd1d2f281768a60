import { Router } from 'express';
import type { Knex } from 'knex';
import { roomInputSchema } from '../../shared/api/rooms';
import { roomStaffingSchema } from '../../shared/api/changes';
import type { DayEvents } from '../services/day-events';
import { setRoomStaffing } from '../services/staffing';
import { requireRole, requireUser } from '../middleware/roles';
import { createRoom, listRooms } from '../services/rooms';
import type { Clock } from '../clock';
import { parseInput } from '../validate';
import { publishDayEvent } from './announce';
import { idParam } from './params';

export function roomRoutes(deps: { db: Knex; clock: Clock; events: DayEvents }): Router {
  const router = Router();

  router.get('/', requireUser, async (_req, res) => {
    res.json({ rooms: await listRooms(deps.db) });
  });

  router.post('/', requireRole('admin'), async (req, res) => {
    const input = parseInput(roomInputSchema, req.body, 'room');
    res.status(201).json({ room: await createRoom(deps.db, input, deps.clock.now(), req.user!) });
  });

  /** The room's usual people on a turnover; every open day plan recomputes. */
  router.patch('/:id/staffing', requireRole('charge'), async (req, res) => {
    const id = idParam(req.params['id'], 'a room');
    const { staff } = parseInput(roomStaffingSchema, req.body, 'staffing');
    await setRoomStaffing(deps.db, id, staff);
    publishDayEvent(deps, '*', 'plan', 'staffing', req.user!);
    res.json({ rooms: await listRooms(deps.db) });
  });

  return router;
}
