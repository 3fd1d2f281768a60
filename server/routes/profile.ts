import { Router } from 'express';
import type { Knex } from 'knex';
import { passwordChangeSchema } from '../../shared/api/users';
import { currentUser, requireUser } from '../middleware/roles';
import { changeOwnPassword, getAccount } from '../services/users-admin';
import { parseInput } from '../validate';

/** The signed-in user's own account; open to every role, and to a user who must change their password. */
export function profileRoutes(deps: { db: Knex }): Router {
  const router = Router();
  router.use(requireUser);

  router.get('/', async (req, res) => {
    res.json({ user: await getAccount(deps.db, currentUser(req).id) });
  });

  router.put('/password', async (req, res) => {
    const change = parseInput(passwordChangeSchema, req.body, 'password change');
    res.json({ user: await changeOwnPassword(deps.db, currentUser(req).id, change, req.sessionID) });
  });

  return router;
}
