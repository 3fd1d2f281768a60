import { Router } from 'express';
import type { Knex } from 'knex';
import { equipmentInputSchema } from '../../shared/api/equipment';
import type { Clock } from '../clock';
import { currentUser, requireRole } from '../middleware/roles';
import { createEquipment, listEquipment, retireEquipment, updateEquipment } from '../services/equipment';
import { parseInput } from '../validate';
import { idParam } from './params';

/** Setup → Equipment (admin): coils, cushions and cleaning equipment with their ASTM F2503 marking. */
export function equipmentRoutes(deps: { db: Knex; clock: Clock }): Router {
  const router = Router();
  router.use(requireRole('admin'));

  router.get('/', async (_req, res) => {
    res.json({ equipment: await listEquipment(deps.db) });
  });

  router.post('/', async (req, res) => {
    const input = parseInput(equipmentInputSchema, req.body, 'equipment');
    res.status(201).json({ item: await createEquipment(deps.db, input, currentUser(req), deps.clock.now()) });
  });

  router.put('/:id', async (req, res) => {
    const input = parseInput(equipmentInputSchema, req.body, 'equipment');
    res.json({ item: await updateEquipment(deps.db, idParam(req.params['id'], 'an equipment'), input, currentUser(req), deps.clock.now()) });
  });

  router.post('/:id/retire', async (req, res) => {
    res.json({ item: await retireEquipment(deps.db, idParam(req.params['id'], 'an equipment'), currentUser(req), deps.clock.now()) });
  });

  return router;
}
