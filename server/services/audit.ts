import type { Knex } from 'knex';
import type { AuditArea, AuditEntry, AuditPage } from '../../shared/api/audit';

/** Who made a setup change (the signed-in user). */
export interface Actor {
  id: number;
  username: string;
  displayName: string;
}

export interface AuditChange {
  area: AuditArea;
  action: string;
  subject: string;
  before: Record<string, unknown> | null;
  after: Record<string, unknown> | null;
}

/**
 * Records one setup change. Call it inside the change's own transaction, so a change and its
 * row are written together or not at all. Passwords never reach it (a reset is recorded as such).
 */
export async function recordAudit(trx: Knex, by: Actor, change: AuditChange, now: Date): Promise<void> {
  await trx('setup_audit').insert({
    at: now.toISOString(),
    user_id: by.id,
    username: by.username,
    display_name: by.displayName,
    area: change.area,
    action: change.action,
    subject: change.subject,
    before: change.before === null ? null : JSON.stringify(change.before),
    after: change.after === null ? null : JSON.stringify(change.after),
  });
}

/** Only the fields that differ, before and after: a row says what changed, not the whole record. */
export function changedFields<T extends object>(before: T, after: T): { before: Record<string, unknown>; after: Record<string, unknown> } {
  const was: Record<string, unknown> = {};
  const now: Record<string, unknown> = {};
  for (const key of Object.keys(after) as (keyof T & string)[]) {
    if (JSON.stringify(before[key]) !== JSON.stringify(after[key])) {
      was[key] = before[key];
      now[key] = after[key];
    }
  }
  return { before: was, after: now };
}

interface AuditRow {
  id: number;
  at: string;
  username: string;
  display_name: string;
  area: string;
  action: string;
  subject: string;
  before: string | null;
  after: string | null;
}

/** Newest first, a page at a time. */
export async function listAudit(db: Knex, page: { limit: number; offset: number }): Promise<AuditPage> {
  const [rows, [{ n }]] = await Promise.all([
    db<AuditRow>('setup_audit').orderBy('id', 'desc').limit(page.limit).offset(page.offset),
    db('setup_audit').count({ n: '*' }),
  ]);
  const entries: AuditEntry[] = (rows as AuditRow[]).map((row) => ({
    id: row.id,
    at: row.at,
    by: { username: row.username, displayName: row.display_name },
    area: row.area as AuditEntry['area'],
    action: row.action,
    subject: row.subject,
    before: row.before === null ? null : JSON.parse(row.before),
    after: row.after === null ? null : JSON.parse(row.after),
  }));
  return { entries, total: Number(n) };
}
