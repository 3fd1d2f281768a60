import type { Knex } from 'knex';
import { createDb, isPostgresUrl } from '../../server/db';

/**
 * The API suite's PostgreSQL mode. `TEST_DATABASE_URL` names a maintenance database on a test
 * cluster (e.g. `postgres://postgres@127.0.0.1:54329/postgres`); unset, the suite runs on SQLite.
 */
export const testDatabaseUrl: string | null = (() => {
  const url = process.env['TEST_DATABASE_URL']?.trim();
  if (!url) return null;
  if (!isPostgresUrl(url)) throw new Error('TEST_DATABASE_URL must be a postgres:// URL.');
  return url;
})();

/** The same server, another database on it. */
export function databaseUrl(admin: string, name: string): string {
  const url = new URL(admin);
  url.pathname = `/${name}`;
  return url.toString();
}

/**
 * One run of jest: its workers are children of one process, so the parent's id names the run's
 * templates and every worker shares them (in band, the parent is the npx or npm that started it).
 */
const runId = process.ppid;
let made = 0;

async function withAdmin<T>(admin: string, work: (db: Knex) => Promise<T>): Promise<T> {
  const db = createDb(admin);
  try {
    return await work(db);
  } finally {
    await db.destroy();
  }
}

/**
 * The run's template for one key (clock and seed options), made once: the first worker to ask
 * migrates and seeds it while holding an advisory lock, the others wait and find it made.
 * Nothing may stay connected to it, since PostgreSQL copies only an idle template.
 */
export async function templateDatabase(admin: string, key: string, build: (db: Knex) => Promise<void>): Promise<string> {
  const name = `tw_tpl_${runId}_${hash(key)}`;
  await withAdmin(admin, async (db) => {
    await db.transaction(async (trx) => {
      await trx.raw('select pg_advisory_xact_lock(?)', [hashNumber(name)]);
      const found = await trx('pg_database').where({ datname: name }).first('datname');
      if (found) return;
      // C collation: text sorts by code point, as SQLite's BINARY does
      await db.raw(`create database ${name} template template0 encoding 'UTF8' lc_collate 'C' lc_ctype 'C'`);
      const target = createDb(databaseUrl(admin, name));
      try {
        await build(target);
      } catch (err) {
        await target.destroy();
        await db.raw(`drop database if exists ${name} with (force)`);
        throw err;
      } finally {
        await target.destroy();
      }
    });
  });
  return name;
}

/** A fresh database copied from the template; `drop()` removes it, after its pool is closed. */
export async function copyDatabase(admin: string, template: string): Promise<{ url: string; drop(): Promise<void> }> {
  const name = `tw_${runId}_${process.pid}_${++made}`;
  await withAdmin(admin, (db) => db.raw(`create database ${name} template ${template}`));
  return {
    url: databaseUrl(admin, name),
    drop: () => withAdmin(admin, (db) => db.raw(`drop database if exists ${name} with (force)`)).then(() => undefined),
  };
}

function hashNumber(text: string): number {
  let h = 0;
  for (const ch of text) h = (Math.imul(h, 31) + ch.charCodeAt(0)) | 0;
  return h;
}

function hash(text: string): string {
  return (hashNumber(text) >>> 0).toString(36);
}
