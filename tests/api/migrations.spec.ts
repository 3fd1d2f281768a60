import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { createDb, MIGRATIONS_DIR, migrationConfig } from '../../server/db';

describe('migrations', () => {
  it('go up, all the way down, and up again on a real SQLite file', async () => {
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'turnwise-mig-'));
    const db = createDb(path.join(dir, 'm.sqlite'));
    try {
      await db.migrate.latest(migrationConfig);
      const tables = async () =>
        (await db.raw("select name from sqlite_master where type='table' and name not like 'knex_%' and name not like 'sqlite_%' order by name")).map(
          (r: { name: string }) => r.name,
        );
      const up = await tables();
      expect(up).toEqual(expect.arrayContaining(['users', 'sessions', 'rooms', 'settings', 'exams', 'imports']));
      await db.migrate.rollback(migrationConfig, true);
      expect(await tables()).toEqual([]);
      await db.migrate.latest(migrationConfig);
      expect(await tables()).toEqual(up);
      const [{ journal_mode }] = await db.raw('pragma journal_mode');
      expect(journal_mode).toBe('wal');
      const [{ foreign_keys }] = await db.raw('pragma foreign_keys');
      expect(foreign_keys).toBe(1);
    } finally {
      await db.destroy();
      fs.rmSync(dir, { recursive: true, force: true });
    }
  });

  it('name files YYYYMMDDHHmmss_verb-noun.ts', () => {
    const files = fs.readdirSync(MIGRATIONS_DIR);
    for (const f of files) expect(f).toMatch(/^\d{14}_[a-z]+(-[a-z][a-z0-9]*)+\.ts$/); // a standard's name may hold digits (hl7)
  });
});
