import { Router } from 'express';
import type { Knex } from 'knex';
import type { Passport } from 'passport';
import { rateLimit } from 'express-rate-limit';
import { z } from 'zod';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from '../../seeds/support/demo-accounts';
import { HttpError, NotFoundError, UnauthorizedError } from '../errors';
import { requireUser } from '../middleware/roles';
import { parseInput } from '../validate';
import type { UserRecord } from '../services/users';

const loginSchema = z.object({ username: z.string().trim().min(1).max(64), password: z.string().min(1).max(200) });

function publicUser(user: UserRecord) {
  return { username: user.username, role: user.role, displayName: user.displayName };
}

export function authRoutes(deps: { db: Knex; passport: InstanceType<typeof Passport>; demo: boolean; loginAttempts: number }): Router {
  const router = Router();
  const throttle = rateLimit({
    windowMs: 15 * 60 * 1000,
    limit: deps.loginAttempts,
    skipSuccessfulRequests: true,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: (_req, _res, next) =>
      next(new HttpError(429, 'too_many_attempts', 'Too many failed sign-ins from this address. Wait 15 minutes and try again, or ask an admin.')),
  });

  router.post('/login', throttle, async (req, res, next) => {
    const credentials = parseInput(loginSchema, req.body, 'sign-in');
    req.body = credentials;
    deps.passport.authenticate('local', (err: unknown, user: UserRecord | false) => {
      if (err) return next(err);
      if (!user) return next(new UnauthorizedError('Wrong username or password.'));
      // passport ≥ 0.6 regenerates the session here, so a fixed session id cannot be reused
      req.login(user, (loginErr) => (loginErr ? next(loginErr) : res.json({ user: publicUser(user) })));
    })(req, res, next);
  });

  router.post('/logout', (req, res, next) => {
    req.logout((err) => {
      if (err) return next(err);
      req.session.destroy(() => res.status(204).end());
    });
  });

  router.get('/me', requireUser, (req, res) => {
    res.json({ user: publicUser(req.user!) });
  });

  router.get('/demo-accounts', (_req, res) => {
    if (!deps.demo) throw new NotFoundError('Demo accounts exist only in demo mode.');
    res.json({ password: DEMO_PASSWORD, accounts: DEMO_ACCOUNTS.map(({ username, role }) => ({ username, role })) });
  });

  return router;
}
