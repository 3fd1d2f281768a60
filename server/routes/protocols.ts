import { Router } from 'express';
import type { Knex } from 'knex';
import { modalitySchema, newProtocolVersionSchema, protocolPreviewSchema } from '../../shared/api/protocols';
import type { Clock } from '../clock';
import { currentUser, requireRole } from '../middleware/roles';
import type { DayEvents } from '../services/day-events';
import { createProtocolVersion, getProtocolVersion, listProtocols } from '../services/protocols';
import { setupChecklist } from '../services/setup-checklist';
import { previewProtocol } from '../services/setup-preview';
import { parseInput } from '../validate';
import { publishDayEvent } from './announce';
import { idParam } from './params';

/** Setup → Protocols (admin): versioned turnover protocols per DICOM modality, `*` the fallback. */
export function protocolRoutes(deps: { db: Knex; clock: Clock; events: DayEvents }): Router {
  const router = Router();
  router.use(requireRole('admin'));

  router.get('/', async (_req, res) => {
    res.json(await listProtocols(deps.db, deps.clock.now()));
  });

  router.post('/preview', async (req, res) => {
    const input = parseInput(protocolPreviewSchema, req.body, 'protocol');
    res.json(await previewProtocol(deps.db, input.modality, input.body, deps.clock.now()));
  });

  router.get('/:modality/versions/:version', async (req, res) => {
    const modality = parseInput(modalitySchema, req.params['modality'], 'modality');
    const version = await getProtocolVersion(deps.db, modality, idParam(req.params['version'], 'a version'));
    res.json({ protocol: version, warnings: [] });
  });

  router.post('/', async (req, res) => {
    const input = parseInput(newProtocolVersionSchema, req.body, 'protocol');
    const answer = await createProtocolVersion(deps.db, input, currentUser(req), deps.clock.now());
    // the plans of the days it applies to change: open screens fetch theirs again
    publishDayEvent(deps, '*', ['plan', 'board'], 'setup', currentUser(req));
    res.status(201).json(answer);
  });

  return router;
}

/** `GET /api/setup/checklist` (admin): what a new department still has to set up. */
export function setupRoutes(deps: { db: Knex; clock: Clock }): Router {
  const router = Router();
  router.get('/checklist', requireRole('admin'), async (_req, res) => {
    res.json(await setupChecklist(deps.db, deps.clock.now()));
  });
  return router;
}
