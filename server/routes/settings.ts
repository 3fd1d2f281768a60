import { Router } from 'express';
import type { Knex } from 'knex';
import { IANAZone } from 'luxon';
import { settingsInputSchema } from '../../shared/api/settings';
import { requireRole, requireUser } from '../middleware/roles';
import { readSettings, writeSettings } from '../services/settings';
import { parseInput } from '../validate';
import type { Clock } from '../clock';

const schema = settingsInputSchema((zone) => IANAZone.isValidZone(zone));

export function settingsRoutes(deps: { db: Knex; clock: Clock }): Router {
  const router = Router();

  router.get('/', requireUser, async (_req, res) => {
    res.json({ settings: await readSettings(deps.db) });
  });

  router.put('/', requireRole('admin'), async (req, res) => {
    const input = parseInput(schema, req.body, 'settings');
    res.json({ settings: await writeSettings(deps.db, input, req.user!, deps.clock.now()) });
  });

  return router;
}
