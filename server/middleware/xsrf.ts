import { createHmac, randomBytes, timingSafeEqual } from 'node:crypto';
import type { Request, RequestHandler, Response } from 'express';
import { HttpError } from '../errors';

const COOKIE = 'XSRF-TOKEN';
const HEADER = 'x-xsrf-token';
const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);
const SIGNED_OUT = 'anonymous';

export interface XsrfTokens {
  /** Issues a token to any request without a valid one and checks every state-changing request. */
  middleware: RequestHandler;
  /** Issues a token bound to the request's current session: call whenever the session changes. */
  issue(req: Request, res: Response): void;
  /** Removes the token cookie (at logout). */
  clear(res: Response): void;
}

function sameText(a: string, b: string): boolean {
  const left = Buffer.from(a);
  const right = Buffer.from(b);
  return left.length === right.length && timingSafeEqual(left, right);
}

/**
 * Angular's double-submit pair, signed: the server sets a readable `XSRF-TOKEN` cookie and every
 * state-changing request must echo it in `X-XSRF-TOKEN`. A cross-site page can make the browser
 * send the cookie but cannot read it to set the header.
 *
 * The token is `nonce.binding.mac`, the mac keyed by the session secret, so a pair the attacker
 * chose (planted in a cookie by a sibling site, say) is refused. For a signed-in request the
 * binding must be this session's, so a token taken from another session is refused too. A
 * signed-out request accepts any token this server signed: the route then answers 401 itself,
 * so a session that expired shows as "sign in again", not as a puzzling 403.
 */
export function xsrfTokens(options: { secret: string; secure: boolean }): XsrfTokens {
  const key = createHmac('sha256', options.secret).update('turnwise xsrf token').digest();
  const mac = (text: string) => createHmac('sha256', key).update(text).digest('base64url');
  // a keyed digest of the session id, never the id itself: the cookie is readable by scripts
  const bindingOf = (req: Request) => (req.user ? mac(`session\n${req.sessionID}`).slice(0, 22) : SIGNED_OUT);
  const cookieOptions = { httpOnly: false, sameSite: 'lax' as const, secure: options.secure, path: '/' };

  const fitsRequest = (token: unknown, req: Request): token is string => {
    if (typeof token !== 'string') return false;
    const [nonce, binding, tag, ...rest] = token.split('.');
    if (!nonce || !binding || !tag || rest.length > 0) return false;
    if (!sameText(tag, mac(`${nonce}.${binding}`))) return false;
    return !req.user || sameText(binding, bindingOf(req));
  };

  // one answer carries at most one XSRF cookie: a later issue or clear replaces an earlier one
  const dropEarlier = (res: Response) => {
    const set = res.getHeader('Set-Cookie');
    if (Array.isArray(set)) res.setHeader('Set-Cookie', set.filter((cookie) => !cookie.startsWith(`${COOKIE}=`)));
    else if (typeof set === 'string' && set.startsWith(`${COOKIE}=`)) res.removeHeader('Set-Cookie');
  };

  const issue = (req: Request, res: Response) => {
    dropEarlier(res);
    const nonce = randomBytes(18).toString('base64url');
    const binding = bindingOf(req);
    res.cookie(COOKIE, `${nonce}.${binding}.${mac(`${nonce}.${binding}`)}`, cookieOptions);
  };

  return {
    issue,
    clear: (res) => {
      dropEarlier(res);
      res.clearCookie(COOKIE, cookieOptions);
    },
    middleware: (req, res, next) => {
      const cookie: unknown = req.cookies?.[COOKIE];
      if (!fitsRequest(cookie, req)) issue(req, res);
      if (SAFE_METHODS.has(req.method)) return next();
      const sent = req.get(HEADER);
      if (!sent || !fitsRequest(cookie, req) || !sameText(sent, cookie)) {
        throw new HttpError(403, 'xsrf_failed', 'The XSRF token is missing or out of date. Reload the page and try again.');
      }
      next();
    },
  };
}
