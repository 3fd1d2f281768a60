import type { Knex } from 'knex';
import { DEFAULT_SETTINGS, type SiteSettings } from '../../shared/api/settings';
import { changedFields, recordAudit, type Actor } from './audit';

export async function readSettings(db: Knex): Promise<SiteSettings> {
  const rows: { key: string; value: string }[] = await db('settings').select('key', 'value');
  const stored = Object.fromEntries(rows.map((r) => [r.key, JSON.parse(r.value)]));
  return { ...DEFAULT_SETTINGS, ...stored };
}

/** `by`: who changed them in Setup (one setup-audit row with what changed); seeds leave it out. */
export async function writeSettings(db: Knex, changes: Partial<SiteSettings>, by?: Actor, now = new Date()): Promise<SiteSettings> {
  await db.transaction(async (trx) => {
    const before = by ? await readSettings(trx) : undefined;
    for (const [key, value] of Object.entries(changes)) {
      if (value === undefined) continue;
      await trx('settings').insert({ key, value: JSON.stringify(value) }).onConflict('key').merge();
    }
    if (by && before) {
      const diff = changedFields(before, await readSettings(trx));
      if (Object.keys(diff.after).length > 0) await recordAudit(trx, by, { area: 'site', action: 'changed', subject: 'Site', ...diff }, now);
    }
  });
  return readSettings(db);
}
