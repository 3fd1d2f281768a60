import { Router } from 'express';
import type { Knex } from 'knex';
import { newUserSchema, passwordResetSchema, userChangeSchema } from '../../shared/api/users';
import type { Clock } from '../clock';
import { currentUser, requireRole } from '../middleware/roles';
import { changeAccount, createAccount, listAccounts, resetPassword, setActive } from '../services/users-admin';
import { parseInput } from '../validate';
import { idParam } from './params';

/** Setup → Users (admin): accounts, roles, password resets, deactivation. */
export function userRoutes(deps: { db: Knex; clock: Clock }): Router {
  const router = Router();
  router.use(requireRole('admin'));

  router.get('/', async (_req, res) => {
    res.json({ users: await listAccounts(deps.db) });
  });

  router.post('/', async (req, res) => {
    const input = parseInput(newUserSchema, req.body, 'user');
    res.status(201).json({ user: await createAccount(deps.db, input, currentUser(req), deps.clock.now()) });
  });

  router.patch('/:id', async (req, res) => {
    const change = parseInput(userChangeSchema, req.body, 'user');
    res.json({ user: await changeAccount(deps.db, idParam(req.params['id'], 'a user'), change, currentUser(req), deps.clock.now()) });
  });

  router.post('/:id/password', async (req, res) => {
    const { password } = parseInput(passwordResetSchema, req.body, 'password reset');
    res.json({ user: await resetPassword(deps.db, idParam(req.params['id'], 'a user'), password, currentUser(req), deps.clock.now()) });
  });

  router.post('/:id/deactivate', async (req, res) => {
    const id = idParam(req.params['id'], 'a user');
    const user = await setActive(deps.db, id, false, currentUser(req), deps.clock.now());
    // one's own session is gone from the store; do not let this answer write it back
    if (id === currentUser(req).id) req.session.destroy(() => res.json({ user }));
    else res.json({ user });
  });

  router.post('/:id/reactivate', async (req, res) => {
    res.json({ user: await setActive(deps.db, idParam(req.params['id'], 'a user'), true, currentUser(req), deps.clock.now()) });
  });

  return router;
}
