import { createHash, randomBytes } from 'node:crypto';
import type { Knex } from 'knex';
import type { CalendarFeedStatus } from '../../../shared/api/calendar';
import { findActiveUser, type UserRecord } from '../users';

/** 32 random bytes, base64url: not guessable, so a feed needs no session. */
const TOKEN_BYTES = 32;
const TOKEN_SHAPE = /^[A-Za-z0-9_-]{43}$/;

const hashOf = (token: string) => createHash('sha256').update(token).digest('hex');

export async function feedStatus(db: Knex, userId: number): Promise<CalendarFeedStatus> {
  const row = await db('calendar_tokens').where({ user_id: userId }).first('created_at', 'last_used_at');
  return { active: Boolean(row), createdAt: row?.created_at ?? null, lastUsedAt: row?.last_used_at ?? null };
}

/**
 * Makes the user's feed token, replacing any older one (which stops working at once). Returns
 * the token itself: the only time it exists outside the caller's calendar app.
 */
export async function rotateFeedToken(db: Knex, userId: number, now: Date): Promise<string> {
  const token = randomBytes(TOKEN_BYTES).toString('base64url');
  await db('calendar_tokens')
    .insert({ user_id: userId, token_hash: hashOf(token), created_at: now.toISOString(), last_used_at: null })
    .onConflict('user_id')
    .merge();
  return token;
}

/** Revokes the user's feeds; their addresses answer 404 from now on. */
export async function revokeFeedToken(db: Knex, userId: number): Promise<void> {
  await db('calendar_tokens').where({ user_id: userId }).delete();
}

/** The active user a feed token belongs to, or null (unknown, revoked, or its user deactivated). */
export async function userOfFeedToken(db: Knex, token: string, now: Date): Promise<UserRecord | null> {
  if (!TOKEN_SHAPE.test(token)) return null;
  const row = await db('calendar_tokens').where({ token_hash: hashOf(token) }).first('user_id');
  if (!row) return null;
  const user = await findActiveUser(db, row.user_id);
  if (!user) return null;
  await db('calendar_tokens').where({ user_id: row.user_id }).update({ last_used_at: now.toISOString() });
  return user;
}
