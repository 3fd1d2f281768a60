import type { RequestHandler } from 'express';
import type { Role } from '../../shared/api/auth';
import { ForbiddenError, UnauthorizedError } from '../errors';
import type { UserRecord } from '../services/users';

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    // passport's `req.user` is our user record
    interface User extends UserRecord {}
  }
}

/** Signed in, whatever the role. */
export const requireUser: RequestHandler = (req, _res, next) => {
  if (!req.user) throw new UnauthorizedError();
  next();
};

/** Signed in with one of these roles; `admin` may always. */
export function requireRole(...roles: Role[]): RequestHandler {
  return (req, _res, next) => {
    if (!req.user) throw new UnauthorizedError();
    if (req.user.role !== 'admin' && !roles.includes(req.user.role)) throw new ForbiddenError();
    next();
  };
}

/** The signed-in user; only call behind requireUser/requireRole. */
export function currentUser(req: Express.Request): UserRecord {
  if (!req.user) throw new UnauthorizedError();
  return req.user;
}
