import type { Knex } from 'knex';
import type { Role } from '../../../shared/api/auth';
import { NOTICE_KINDS, type NoticeKind, type NoticePreferences } from '../../../shared/api/notices';
import { NotFoundError } from '../../errors';

/** Someone a notice can go to: active, with an address, the kind on. */
export interface Recipient {
  id: number;
  email: string;
  displayName: string;
  role: Role;
}

export async function readPreferences(db: Knex, userId: number): Promise<NoticePreferences> {
  const user = await db('users').where({ id: userId }).first('email');
  if (!user) throw new NotFoundError(`No user ${userId}.`);
  const rows: { kind: string; enabled: number | boolean }[] = await db('notice_settings').where({ user_id: userId }).select('kind', 'enabled');
  const off = new Set(rows.filter((r) => !r.enabled).map((r) => r.kind));
  return { email: user.email ?? null, kinds: Object.fromEntries(NOTICE_KINDS.map((k) => [k, !off.has(k)])) as Record<NoticeKind, boolean> };
}

/** One's own address and choices (a kind left out keeps its setting), in one transaction. */
export async function writePreferences(db: Knex, userId: number, prefs: { email: string | null; kinds: Partial<Record<NoticeKind, boolean>> }): Promise<NoticePreferences> {
  await db.transaction(async (trx) => {
    await trx('users').where({ id: userId }).update({ email: prefs.email || null });
    for (const kind of NOTICE_KINDS) {
      const enabled = prefs.kinds[kind];
      if (enabled !== undefined) await setKind(trx, userId, kind, enabled);
    }
  });
  return readPreferences(db, userId);
}

export async function setKind(db: Knex, userId: number, kind: NoticeKind, enabled: boolean): Promise<void> {
  await db('notice_settings').insert({ user_id: userId, kind, enabled }).onConflict(['user_id', 'kind']).merge();
}

/**
 * Active users with an address and this notice on (no row counts as on), limited to the given
 * roles and/or ids.
 */
export async function recipients(db: Knex, kind: NoticeKind, who: { roles?: Role[]; ids?: number[] }): Promise<Recipient[]> {
  const rows = await db('users')
    .leftJoin('notice_settings', (j) => j.on('notice_settings.user_id', '=', 'users.id').andOnVal('notice_settings.kind', '=', kind))
    .where('users.active', true)
    .whereNotNull('users.email')
    .andWhere('users.email', '<>', '')
    .andWhere((q) => q.whereNull('notice_settings.enabled').orWhere('notice_settings.enabled', true))
    .andWhere((q) => {
      if (who.roles?.length) q.orWhereIn('users.role', who.roles);
      if (who.ids?.length) q.orWhereIn('users.id', who.ids);
      if (!who.roles?.length && !who.ids?.length) q.whereRaw('0 = 1');
    })
    .orderBy('users.id')
    .select('users.id', 'users.email', 'users.display_name', 'users.role');
  return rows.map((r) => ({ id: r.id, email: r.email, displayName: r.display_name || '', role: r.role }));
}
