import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { createDb, MIGRATIONS_DIR, migrationConfig } from '../../server/db';
import { databaseUrl, testDatabaseUrl } from './pg-databases';

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

  // Run with TEST_DATABASE_URL (npm run test:pg, CI): the same migrations on PostgreSQL.
  (testDatabaseUrl ? it : it.skip)('go up, all the way down, and up again on PostgreSQL, the cleaning log append-only there too', async () => {
    const admin = createDb(testDatabaseUrl!);
    const name = `tw_migrations_${process.pid}`;
    await admin.raw(`drop database if exists ${name}`);
    await admin.raw(`create database ${name} template template0`);
    const db = createDb(databaseUrl(testDatabaseUrl!, name));
    try {
      await db.migrate.latest(migrationConfig);
      const tables = async () =>
        ((await db('information_schema.tables').where({ table_schema: 'public' }).whereNot('table_name', 'like', 'knex_%').orderBy('table_name').select('table_name')) as { table_name: string }[]).map(
          (r) => r.table_name,
        );
      const routines = async () => (await db('information_schema.routines').where({ routine_schema: 'public' }).count({ n: '*' }))[0]!.n;
      const up = await tables();
      expect(up).toEqual(expect.arrayContaining(['users', 'sessions', 'rooms', 'settings', 'exams', 'imports', 'cleaning_log', 'day_versions']));
      expect(Number(await routines())).toBeGreaterThan(0);
      await db.migrate.rollback(migrationConfig, true);
      expect(await tables()).toEqual([]);
      expect(Number(await routines())).toBe(0);
      await db.migrate.latest(migrationConfig);
      expect(await tables()).toEqual(up);
      // the triggers are back after up → down → up: the log refuses a rewrite
      const [{ id: userId }] = await db('users').insert({ username: 'mig', display_name: 'Mig', password_hash: '!', role: 'tech', created_at: '2027-03-10T08:00:00Z' }).returning('id');
      const [{ id: roomId }] = await db('rooms').insert({ name: 'MR 9', modality: 'MR', air_changes_per_hour: 15.3, created_at: '2027-03-10T08:00:00Z' }).returning('id');
      expect((await db('rooms').where({ id: roomId }).first()).air_changes_per_hour).toBe(15.3);
      await db('cleaning_log').insert({ at: '2027-03-10T09:00:00-06:00', at_ms: 1, day: '2027-03-10', room_id: roomId, room_name: 'MR 9', clean_type: 'standard', kind: 'note', user_id: userId, username: 'mig', display_name: 'Mig' });
      await expect(db.raw("update cleaning_log set note = 'rewritten'")).rejects.toThrow(/append-only/);
      await expect(db.raw('delete from cleaning_log')).rejects.toThrow(/append-only/);
      expect(await db('day_versions').where({ day: 'setup' }).first('version')).toEqual({ version: 1 });
    } finally {
      await db.destroy();
      await admin.raw(`drop database if exists ${name} with (force)`);
      await admin.destroy();
    }
  });

  it('name files YYYYMMDDHHmmss_verb-noun.ts', () => {
    const files = fs.readdirSync(MIGRATIONS_DIR);
    for (const f of files) expect(f).toMatch(/^\d{14}_[a-z]+(-[a-z][a-z0-9]*)+\.ts$/); // a standard's name may hold digits (hl7)
  });
});
