import { createHmac, timingSafeEqual } from 'node:crypto';
import { NOTICE_KINDS, type NoticeKind } from '../../../shared/api/notices';

/**
 * A link that turns one kind of notice off for one user without signing in: `userId.kind.mac`,
 * the mac keyed by the session secret (so only this server makes them). It never expires: an
 * old e-mail's link still works, and all it can do is turn a notice off.
 */
export function unsubscribeToken(secret: string, userId: number, kind: NoticeKind): string {
  return `${userId}.${kind}.${mac(secret, userId, kind)}`;
}

export function readUnsubscribeToken(secret: string, token: string): { userId: number; kind: NoticeKind } | null {
  const [id, kind, tag, ...rest] = token.split('.');
  if (!id || !kind || !tag || rest.length > 0 || !/^\d{1,9}$/.test(id)) return null;
  if (!(NOTICE_KINDS as readonly string[]).includes(kind)) return null;
  const userId = Number(id);
  const expected = Buffer.from(mac(secret, userId, kind as NoticeKind));
  const given = Buffer.from(tag);
  if (expected.length !== given.length || !timingSafeEqual(expected, given)) return null;
  return { userId, kind: kind as NoticeKind };
}

function mac(secret: string, userId: number, kind: NoticeKind): string {
  const key = createHmac('sha256', secret).update('turnwise unsubscribe').digest();
  return createHmac('sha256', key).update(`${userId}\n${kind}`).digest('base64url').slice(0, 32);
}
