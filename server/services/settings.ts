import type { Knex } from 'knex';
import { DEFAULT_SETTINGS, type SiteSettings } from '../../shared/api/settings';

export async function readSettings(db: Knex): Promise<SiteSettings> {
  const rows: { key: string; value: string }[] = await db('settings').select('key', 'value');
  const stored = Object.fromEntries(rows.map((r) => [r.key, JSON.parse(r.value)]));
  return { ...DEFAULT_SETTINGS, ...stored };
}

export async function writeSettings(db: Knex, changes: Partial<SiteSettings>): Promise<SiteSettings> {
  await db.transaction(async (trx) => {
    for (const [key, value] of Object.entries(changes)) {
      if (value === undefined) continue;
      await trx('settings').insert({ key, value: JSON.stringify(value) }).onConflict('key').merge();
    }
  });
  return readSettings(db);
}
