import { randomBytes, timingSafeEqual } from 'node:crypto';
import type { RequestHandler } from 'express';
import { HttpError } from '../errors';

const COOKIE = 'XSRF-TOKEN';
const HEADER = 'x-xsrf-token';
const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * Angular's double-submit pair: the server sets a readable `XSRF-TOKEN` cookie and every
 * state-changing request must echo it in `X-XSRF-TOKEN`. A cross-site page can make the browser
 * send the cookie but cannot read it to set the header.
 */
export function xsrf(options: { secure: boolean }): RequestHandler {
  return (req, res, next) => {
    let token: string | undefined = req.cookies?.[COOKIE];
    if (!token) {
      token = randomBytes(24).toString('base64url');
      res.cookie(COOKIE, token, { httpOnly: false, sameSite: 'lax', secure: options.secure, path: '/' });
    }
    if (SAFE_METHODS.has(req.method)) return next();
    const sent = req.get(HEADER);
    const cookie = req.cookies?.[COOKIE];
    if (!sent || !cookie || sent.length !== cookie.length || !timingSafeEqual(Buffer.from(sent), Buffer.from(cookie))) {
      throw new HttpError(403, 'xsrf_failed', 'The request is missing its XSRF token. Reload the page and try again.');
    }
    next();
  };
}
