import { Router } from 'express';
import type { Knex } from 'knex';
import { roomInputSchema } from '../../shared/api/rooms';
import { roomStaffingSchema } from '../../shared/api/changes';
import { ValidationError } from '../errors';
import type { DayEvents } from '../services/day-events';
import { setRoomStaffing } from '../services/staffing';
import { requireRole, requireUser } from '../middleware/roles';
import { createRoom, listRooms } from '../services/rooms';
import type { Clock } from '../clock';
import { parseInput } from '../validate';

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
    const id = Number(req.params['id']);
    if (!Number.isInteger(id) || id <= 0) throw new ValidationError(`"${String(req.params['id'])}" is not a room id.`);
    const { staff } = parseInput(roomStaffingSchema, req.body, 'staffing');
    await setRoomStaffing(deps.db, id, staff);
    deps.events.publish({ date: '*', kind: 'plan', reason: 'staffing', by: req.user!.displayName || req.user!.username, at: deps.clock.now().toISOString() });
    res.json({ rooms: await listRooms(deps.db) });
  });

  return router;
}
