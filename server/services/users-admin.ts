import type { Knex } from 'knex';
import type { NewUser, UserAccount, UserChange } from '../../shared/api/users';
import { NotFoundError, ValidationError } from '../errors';
import { LastAdminError } from '../setup-errors';
import { changedFields, recordAudit, type Actor } from './audit';
import { hashPassword, verifyPassword } from './passwords';
import { createUser, type UserRow } from './users';

function toAccount(row: UserRow): UserAccount {
  return {
    id: row.id,
    username: row.username,
    displayName: row.display_name,
    email: row.email,
    role: row.role as UserAccount['role'],
    active: Boolean(row.active),
    mustChangePassword: Boolean(row.must_change_password),
    createdAt: row.created_at,
  };
}

/** What an audit row keeps of an account (never the password hash). */
function audited(user: UserAccount) {
  return { username: user.username, displayName: user.displayName, email: user.email, role: user.role, active: user.active };
}

export async function listAccounts(db: Knex): Promise<UserAccount[]> {
  const rows: UserRow[] = await db('users').orderBy([{ column: 'active', order: 'desc' }, { column: 'username' }]);
  return rows.map(toAccount);
}

export async function getAccount(db: Knex, id: number): Promise<UserAccount> {
  const row: UserRow | undefined = await db('users').where({ id }).first();
  if (!row) throw new NotFoundError(`No user ${id}.`);
  return toAccount(row);
}

/**
 * Ends every session of a user at once (deactivation, a reset), except `keepSid` (one's own,
 * after changing one's own password). connect-session-knex keeps the passport user id in `sess`.
 */
export async function endSessions(db: Knex, userId: number, keepSid?: string): Promise<number> {
  // Read in code, not by a JSON path in SQL: `sess` is text on SQLite and json on PostgreSQL,
  // and ending sessions is rare (deactivation, a password reset).
  const query = db('sessions').select('sid', 'sess');
  if (keepSid) query.whereNot({ sid: keepSid });
  const sids = ((await query) as { sid: string; sess: unknown }[])
    .filter((row) => sessionUser(row.sess) === userId)
    .map((row) => row.sid);
  let ended = 0;
  for (let i = 0; i < sids.length; i += 500) ended += await db('sessions').whereIn('sid', sids.slice(i, i + 500)).del();
  return ended;
}

function sessionUser(sess: unknown): unknown {
  const value = (typeof sess === 'string' ? JSON.parse(sess) : sess) as { passport?: { user?: unknown } } | null;
  return value?.passport?.user;
}

/** Refuses when the change would leave no active admin (a department could no longer set itself up). */
async function keepAnAdmin(trx: Knex, leaving: UserAccount): Promise<void> {
  if (leaving.role !== 'admin' || !leaving.active) return;
  const [{ n }] = await trx('users').where({ role: 'admin', active: true }).whereNot({ id: leaving.id }).count({ n: '*' });
  if (Number(n) === 0) {
    throw new LastAdminError(`${leaving.displayName || leaving.username} is the last active admin: make another admin first.`);
  }
}

export async function createAccount(db: Knex, input: NewUser, by: Actor, now: Date): Promise<UserAccount> {
  const clash = await db('users').whereRaw('lower(username) = lower(?)', [input.username]).first('id');
  if (clash) throw new ValidationError(`The username "${input.username}" is taken.`, { problems: [{ field: 'username', message: 'already taken' }] });
  return db.transaction(async (trx) => {
    // the admin picked this password, so the user chooses their own at first sign-in
    const id = await createUser(trx, { ...input, mustChangePassword: true }, now);
    const account = await getAccount(trx, id);
    await recordAudit(trx, by, { area: 'user', action: 'created', subject: account.username, before: null, after: audited(account) }, now);
    return account;
  });
}

export async function changeAccount(db: Knex, id: number, change: UserChange, by: Actor, now: Date): Promise<UserAccount> {
  return db.transaction(async (trx) => {
    const before = await getAccount(trx, id);
    if (change.role !== undefined && change.role !== 'admin') await keepAnAdmin(trx, before);
    const patch: Record<string, unknown> = {};
    if (change.displayName !== undefined) patch['display_name'] = change.displayName;
    if (change.email !== undefined) patch['email'] = change.email;
    if (change.role !== undefined) patch['role'] = change.role;
    await trx('users').where({ id }).update(patch);
    const after = await getAccount(trx, id);
    const diff = changedFields(audited(before), audited(after));
    if (Object.keys(diff.after).length > 0) {
      const action = diff.after['role'] !== undefined ? 'role changed' : 'changed';
      await recordAudit(trx, by, { area: 'user', action, subject: after.username, ...diff }, now);
    }
    return after;
  });
}

/** A new password from the admin; the user's sessions end and they must change it at next sign-in. */
export async function resetPassword(db: Knex, id: number, password: string, by: Actor, now: Date): Promise<UserAccount> {
  const hash = await hashPassword(password);
  return db.transaction(async (trx) => {
    const account = await getAccount(trx, id);
    await trx('users').where({ id }).update({ password_hash: hash, must_change_password: true });
    await endSessions(trx, id);
    await recordAudit(trx, by, { area: 'user', action: 'password reset', subject: account.username, before: null, after: { mustChangePassword: true } }, now);
    return getAccount(trx, id);
  });
}

/** Deactivated: cannot sign in, and every session ends now (the next request answers 401). */
export async function setActive(db: Knex, id: number, active: boolean, by: Actor, now: Date): Promise<UserAccount> {
  return db.transaction(async (trx) => {
    const before = await getAccount(trx, id);
    if (before.active === active) return before;
    if (!active) await keepAnAdmin(trx, before);
    await trx('users').where({ id }).update({ active });
    if (!active) await endSessions(trx, id);
    const after = await getAccount(trx, id);
    await recordAudit(trx, by, { area: 'user', action: active ? 'reactivated' : 'deactivated', subject: after.username, before: { active: before.active }, after: { active } }, now);
    return after;
  });
}

/**
 * One's own password: the current one is required (a session left open must not be enough to
 * take the account over). The other sessions of the user end; this one stays.
 */
export async function changeOwnPassword(
  db: Knex,
  id: number,
  change: { currentPassword: string; newPassword: string },
  keepSid: string,
): Promise<UserAccount> {
  const row: UserRow | undefined = await db('users').where({ id, active: true }).first();
  if (!row) throw new NotFoundError(`No user ${id}.`);
  if (!(await verifyPassword(change.currentPassword, row.password_hash))) {
    throw new ValidationError('The current password is not right.', { problems: [{ field: 'currentPassword', message: 'does not match your current password' }] });
  }
  if (change.newPassword === change.currentPassword) {
    throw new ValidationError('Choose a new password, not the current one.', { problems: [{ field: 'newPassword', message: 'must differ from the current password' }] });
  }
  const hash = await hashPassword(change.newPassword);
  await db.transaction(async (trx) => {
    await trx('users').where({ id }).update({ password_hash: hash, must_change_password: false });
    await endSessions(trx, id, keepSid);
  });
  return getAccount(db, id);
}
