import { createHmac, randomBytes, timingSafeEqual } from 'node:crypto';
import { Router, type Request, type Response } from 'express';
import type { Knex } from 'knex';
import type { Passport } from 'passport';
import { rateLimit } from 'express-rate-limit';
import { z } from 'zod';
import { HttpError, NotFoundError, UnauthorizedError } from '../errors';
import type { XsrfTokens } from '../middleware/xsrf';
import { requireUser } from '../middleware/roles';
import { parseInput } from '../validate';
import type { UserRecord } from '../services/users';
import { listDemoAccounts } from '../services/demo-accounts';

const loginSchema = z.object({ username: z.string().trim().min(1).max(64), password: z.string().min(1).max(200) });

const WINDOW_MS = 15 * 60 * 1000;
const KNOWN_DEVICE_MS = 90 * 24 * 60 * 60 * 1000;

/** Failed sign-ins allowed per 15 minutes (README, Security). */
export interface SignInLimits {
  /** Per account, or per account on one known device. */
  perAccount: number;
  /** Per client address, over all accounts (password spraying). */
  perAddress: number;
}

export interface AuthDeps {
  db: Knex;
  passport: InstanceType<typeof Passport>;
  demo: boolean;
  limits: SignInLimits;
  secret: string;
  secure: boolean;
  xsrf: XsrfTokens;
  sessionCookie: string;
}

function publicUser(user: UserRecord) {
  return { username: user.username, role: user.role, displayName: user.displayName, mustChangePassword: user.mustChangePassword };
}

/** Usernames match case-insensitively at sign-in, so they are throttled that way too. */
const accountOf = (req: Request) => String(req.body.username).toLowerCase();

/**
 * A known device is one where this account signed in before: an httpOnly cookie per account,
 * `deviceId.mac` with the mac binding the username, sent only to the sign-in routes. Its
 * failures count against that device alone, so guessing elsewhere cannot lock the user out of it.
 */
function knownDevices(secret: string, secure: boolean) {
  const key = createHmac('sha256', secret).update('turnwise known device').digest();
  const mac = (text: string) => createHmac('sha256', key).update(text).digest('base64url');
  const cookieName = (account: string) => `turnwise.device.${mac(`name\n${account}`).slice(0, 16)}`;
  const options = { httpOnly: true, sameSite: 'lax' as const, secure, path: '/api/auth', maxAge: KNOWN_DEVICE_MS };

  const deviceOf = (req: Request, account: string): string | undefined => {
    const value: unknown = req.cookies?.[cookieName(account)];
    if (typeof value !== 'string') return undefined;
    const [id, tag, ...rest] = value.split('.');
    if (!id || !tag || rest.length > 0) return undefined;
    const expected = Buffer.from(mac(`device\n${id}\n${account}`));
    const sent = Buffer.from(tag);
    return sent.length === expected.length && timingSafeEqual(sent, expected) ? id : undefined;
  };

  return {
    deviceOf,
    /** Renews the cookie at each successful sign-in, keeping the device's id. */
    remember(req: Request, res: Response, account: string) {
      const id = deviceOf(req, account) ?? randomBytes(16).toString('base64url');
      res.cookie(cookieName(account), `${id}.${mac(`device\n${id}\n${account}`)}`, options);
    },
  };
}

function throttled(where: string) {
  return (_req: Request, _res: Response, next: (err: unknown) => void) =>
    next(new HttpError(429, 'too_many_attempts', `Too many failed sign-ins ${where}. Wait 15 minutes and try again, or ask an admin.`));
}

export function authRoutes(deps: AuthDeps): Router {
  const router = Router();
  const devices = knownDevices(deps.secret, deps.secure);
  const knownDevice = (res: Response): string | undefined => res.locals['knownDevice'];
  const common = { windowMs: WINDOW_MS, skipSuccessfulRequests: true, standardHeaders: 'draft-8', legacyHeaders: false } as const;

  // Keyed on req.ip, which believes X-Forwarded-For only from the proxies in TRUST_PROXY.
  // A known device skips it: a shared ward address must not lock out staff who signed in there before.
  const perAddress = rateLimit({
    ...common,
    identifier: 'address',
    limit: deps.limits.perAddress,
    skip: (_req, res) => knownDevice(res) !== undefined,
    // an unexpected X-Forwarded-For is reported once at startup (main.ts), not with a stack per app
    validate: { xForwardedForHeader: false },
    handler: throttled('from this address'),
  });
  const perAccount = rateLimit({
    ...common,
    identifier: 'account',
    limit: deps.limits.perAccount,
    keyGenerator: (req, res) => {
      const device = knownDevice(res);
      return device ? `device\n${accountOf(req)}\n${device}` : `account\n${accountOf(req)}`;
    },
    handler: (req, res, next) => throttled(knownDevice(res) ? 'for this account on this device' : 'for this account')(req, res, next),
  });

  router.post(
    '/login',
    (req, res, next) => {
      req.body = parseInput(loginSchema, req.body, 'sign-in');
      res.locals['knownDevice'] = devices.deviceOf(req, accountOf(req));
      next();
    },
    perAddress,
    perAccount,
    (req, res, next) => {
      deps.passport.authenticate('local', (err: unknown, user: UserRecord | false) => {
        if (err) return next(err);
        if (!user) return next(new UnauthorizedError('Wrong username or password.'));
        // passport ≥ 0.6 regenerates the session here, so a fixed session id cannot be reused;
        // the XSRF token was bound to the old session, so the client gets one for the new
        req.login(user, (loginErr) => {
          if (loginErr) return next(loginErr);
          deps.xsrf.issue(req, res);
          devices.remember(req, res, accountOf(req));
          res.json({ user: publicUser(user) });
        });
      })(req, res, next);
    },
  );

  router.post('/logout', (req, res, next) => {
    req.logout((err) => {
      if (err) return next(err);
      req.session.destroy(() => {
        // a shared workstation keeps nothing of the session; the next page load gets a fresh token
        res.clearCookie(deps.sessionCookie, { httpOnly: true, sameSite: 'lax', secure: deps.secure, path: '/' });
        deps.xsrf.clear(res);
        res.status(204).end();
      });
    });
  });

  router.get('/me', requireUser, (req, res) => {
    res.json({ user: publicUser(req.user!) });
  });

  // Outside demo mode there are none: 204, so a production sign-in page logs no failed request.
  router.get('/demo-accounts', async (_req, res) => {
    const demo = deps.demo ? await listDemoAccounts(deps.db) : null;
    if (!demo) {
      res.status(204).end();
      return;
    }
    res.json(demo);
  });

  return router;
}
