import { Router } from 'express';
import type { Knex } from 'knex';
import { roomInputSchema } from '../../shared/api/rooms';
import { requireRole, requireUser } from '../middleware/roles';
import { createRoom, listRooms } from '../services/rooms';
import type { Clock } from '../clock';
import { parseInput } from '../validate';

export function roomRoutes(deps: { db: Knex; clock: Clock }): Router {
  const router = Router();

  router.get('/', requireUser, async (_req, res) => {
    res.json({ rooms: await listRooms(deps.db) });
  });

  router.post('/', requireRole('admin'), async (req, res) => {
    const input = parseInput(roomInputSchema, req.body, 'room');
    res.status(201).json({ room: await createRoom(deps.db, input, deps.clock.now()) });
  });

  return router;
}
