import { Router } from 'express';
import type { Knex } from 'knex';
import { hl7LogQuerySchema, type Hl7LogPage } from '../../shared/api/hl7';
import { hl7MappingSchema } from '../../shared/api/hl7-mapping';
import type { Clock } from '../clock';
import { requireRole } from '../middleware/roles';
import { listHl7Messages, readHl7Message } from '../services/hl7/hl7-log';
import { readHl7Mapping, writeHl7Mapping } from '../services/hl7/hl7-mapping-setup';
import type { Hl7Feed } from '../services/hl7/feed';
import { parseInput } from '../validate';
import { idParam } from './params';

/** The HL7 booking feed (admin): the interface log (messages received, their ACKs and what they changed) and the site's mapping. */
export function hl7Routes(deps: { db: Knex; clock: Clock; hl7?: Hl7Feed | null }): Router {
  const router = Router();
  router.use(requireRole('admin'));
  router.get('/messages', async (req, res) => {
    const query = parseInput(hl7LogQuerySchema, req.query, 'interface log query');
    // on PostgreSQL another server process may be the one listening
    const listener = deps.hl7 ? await deps.hl7.served() : null;
    const page: Hl7LogPage = { ...(await listHl7Messages(deps.db, query)), listener };
    res.json(page);
  });
  router.get('/messages/:id', async (req, res) => {
    res.json(await readHl7Message(deps.db, idParam(req.params['id'], 'a message')));
  });
  router.get('/mapping', async (_req, res) => {
    res.json({ mapping: await readHl7Mapping(deps.db) });
  });
  router.put('/mapping', async (req, res) => {
    const mapping = parseInput(hl7MappingSchema, req.body, 'booking-feed mapping');
    res.json({ mapping: await writeHl7Mapping(deps.db, mapping, req.user!, deps.clock.now()) });
  });
  return router;
}
