import type { RequestHandler } from 'express';
import { PasswordChangeRequiredError } from '../setup-errors';

/** What a user whose password was reset may still call: who am I, sign out, and the profile. */
const OPEN = [
  { method: 'GET', path: '/health' },
  { method: 'GET', path: '/auth/me' },
  { method: 'POST', path: '/auth/login' },
  { method: 'POST', path: '/auth/logout' },
  { method: 'GET', path: '/auth/demo-accounts' },
  { method: 'GET', path: '/settings' },
  { method: 'GET', path: '/profile' },
  { method: 'PUT', path: '/profile/password' },
];

/**
 * After a reset the admin knows the password, so until the user picks their own every other
 * call is refused with 403 `password_change_required` (the client sends them to the profile).
 * Mounted on the API router, after passport has read the session.
 */
export const passwordGate: RequestHandler = (req, _res, next) => {
  if (!req.user?.mustChangePassword) return next();
  if (OPEN.some((open) => open.method === req.method && open.path === req.path)) return next();
  throw new PasswordChangeRequiredError();
};
