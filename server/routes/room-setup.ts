import { Router } from 'express';
import type { Knex } from 'knex';
import { kitInputSchema } from '../../shared/api/equipment';
import { roomInputSchema } from '../../shared/api/rooms';
import type { Clock } from '../clock';
import type { DayEvents } from '../services/day-events';
import { currentUser, requireRole, requireUser } from '../middleware/roles';
import { roomKit, setRoomKit } from '../services/equipment';
import { getSetupRoom, listSetupRooms, restoreRoom, retireRoom, updateRoom } from '../services/room-setup';
import { parseInput } from '../validate';
import { publishDayEvent } from './announce';
import { dayOrToday, idParam } from './params';

/** Setup → Rooms (admin): edit, retire, restore, and each room's cleaning kit. */
export function roomSetupRoutes(deps: { db: Knex; clock: Clock; events: DayEvents }): Router {
  const router = Router();
  // rooms shape every day's plan and the board: open screens refetch
  const replanned = (user: { displayName: string; username: string }) => publishDayEvent(deps, '*', 'plan', 'setup', user);

  router.get('/setup', requireRole('admin'), async (_req, res) => {
    res.json({ rooms: await listSetupRooms(deps.db) });
  });

  router.put('/:id', requireRole('admin'), async (req, res) => {
    const input = parseInput(roomInputSchema, req.body, 'room');
    const room = await updateRoom(deps.db, idParam(req.params['id'], 'a room'), input, currentUser(req), deps.clock.now());
    replanned(currentUser(req));
    res.json({ room });
  });

  router.post('/:id/retire', requireRole('admin'), async (req, res) => {
    const now = deps.clock.now();
    const today = await dayOrToday(deps.db, undefined, now);
    const room = await retireRoom(deps.db, idParam(req.params['id'], 'a room'), today, currentUser(req), now);
    replanned(currentUser(req));
    res.json({ room });
  });

  router.post('/:id/restore', requireRole('admin'), async (req, res) => {
    const room = await restoreRoom(deps.db, idParam(req.params['id'], 'a room'), currentUser(req), deps.clock.now());
    replanned(currentUser(req));
    res.json({ room });
  });

  /** The room's cleaning kit and, for an MR room, its zone layout: the Turnover screen lists both with the Zone IV caution. */
  router.get('/:id/kit', requireUser, async (req, res) => {
    const id = idParam(req.params['id'], 'a room');
    const kit = await roomKit(deps.db, id);
    const room = await getSetupRoom(deps.db, id);
    res.json({ kit, mrZones: room.mrZones });
  });

  router.put('/:id/kit', requireRole('admin'), async (req, res) => {
    const { equipmentIds } = parseInput(kitInputSchema, req.body, 'kit');
    res.json({ kit: await setRoomKit(deps.db, idParam(req.params['id'], 'a room'), equipmentIds, currentUser(req), deps.clock.now()) });
  });

  return router;
}
