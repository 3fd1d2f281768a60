import { Router } from 'express';
import type { Knex } from 'knex';
import { productInputSchema } from '../../shared/api/protocols';
import type { Clock } from '../clock';
import { currentUser, requireRole } from '../middleware/roles';
import type { DayEvents } from '../services/day-events';
import { createProduct, listProducts, retireProduct, updateProduct } from '../services/products';
import { previewProduct } from '../services/setup-preview';
import { parseInput } from '../validate';
import { publishDayEvent } from './announce';
import { idParam } from './params';

/** Setup → Products (admin): the site's disinfectants, their label contact and stays-wet times. */
export function productRoutes(deps: { db: Knex; clock: Clock; events: DayEvents }): Router {
  const router = Router();
  router.use(requireRole('admin'));
  // every plan computes from the products: open screens fetch theirs again
  const replanned = (user: { displayName: string; username: string }) => publishDayEvent(deps, '*', ['plan', 'board'], 'setup', user);

  router.get('/', async (_req, res) => {
    res.json({ products: await listProducts(deps.db, deps.clock.now()) });
  });

  router.post('/', async (req, res) => {
    const input = parseInput(productInputSchema, req.body, 'product');
    const answer = await createProduct(deps.db, input, currentUser(req), deps.clock.now());
    replanned(currentUser(req));
    res.status(201).json(answer);
  });

  router.put('/:id', async (req, res) => {
    const id = idParam(req.params['id'], 'a product');
    const input = parseInput(productInputSchema, req.body, 'product');
    const answer = await updateProduct(deps.db, id, input, currentUser(req), deps.clock.now());
    replanned(currentUser(req));
    res.json(answer);
  });

  router.post('/:id/retire', async (req, res) => {
    const answer = await retireProduct(deps.db, idParam(req.params['id'], 'a product'), currentUser(req), deps.clock.now());
    replanned(currentUser(req));
    res.json(answer);
  });

  router.post('/:id/preview', async (req, res) => {
    const id = idParam(req.params['id'], 'a product');
    const input = parseInput(productInputSchema, req.body, 'product');
    res.json(await previewProduct(deps.db, id, input, deps.clock.now()));
  });

  return router;
}
