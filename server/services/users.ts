import type { Knex } from 'knex';
import { ROLES, type Role } from '../../shared/api/auth';
import { decoyPasswordHash, hashPassword, verifyPassword } from './passwords';

export interface UserRecord {
  id: number;
  username: string;
  displayName: string;
  role: Role;
  /** A reset password: the user must choose their own before any other call (password gate). */
  mustChangePassword?: boolean;
}

export interface UserRow {
  id: number;
  username: string;
  display_name: string;
  password_hash: string;
  role: string;
  active: number | boolean;
  email: string | null;
  must_change_password: number | boolean;
  created_at: string;
}

function toUser(row: UserRow): UserRecord {
  return { id: row.id, username: row.username, displayName: row.display_name, role: row.role as Role, mustChangePassword: Boolean(row.must_change_password) };
}

export async function findActiveUser(db: Knex, id: number): Promise<UserRecord | undefined> {
  const row = await db<UserRow>('users').where({ id, active: true }).first();
  return row ? toUser(row) : undefined;
}

/** Checks a username and password; unknown users and wrong passwords take the same path. */
export async function authenticate(db: Knex, username: string, password: string): Promise<UserRecord | undefined> {
  const row = await db<UserRow>('users').whereRaw('lower(username) = lower(?)', [username]).andWhere({ active: true }).first();
  const ok = await verifyPassword(password, row?.password_hash ?? (await decoyPasswordHash()));
  return row && ok ? toUser(row) : undefined;
}

export async function createUser(
  db: Knex,
  user: { username: string; password: string; role: Role; displayName?: string; email?: string | null; mustChangePassword?: boolean },
  now: Date,
): Promise<number> {
  if (!ROLES.includes(user.role)) throw new Error(`Unknown role ${user.role}`);
  const [{ id }] = await db('users').insert({
    username: user.username,
    display_name: user.displayName ?? '',
    password_hash: await hashPassword(user.password),
    role: user.role,
    active: true,
    email: user.email ?? null,
    must_change_password: user.mustChangePassword ?? false,
    created_at: now.toISOString(),
  }).returning('id');
  return id as number;
}
