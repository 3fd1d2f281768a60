import path from 'node:path';
import fs from 'node:fs';
import knex, { Knex } from 'knex';

export const MIGRATIONS_DIR = path.resolve(__dirname, '..', 'migrations');

/** Migration settings shared by the app, the CLI scripts and the tests. */
export const migrationConfig: Knex.MigratorConfig = {
  directory: MIGRATIONS_DIR,
  loadExtensions: ['.ts', '.js'],
};

/**
 * Opens the SQLite file (or `:memory:`) with WAL and foreign keys on every pooled connection.
 * The parent folder is created so a fresh clone starts without setup.
 */
export function createDb(filename: string): Knex {
  if (filename !== ':memory:') fs.mkdirSync(path.dirname(path.resolve(filename)), { recursive: true });
  return knex({
    client: 'better-sqlite3',
    connection: { filename },
    useNullAsDefault: true,
    pool: {
      afterCreate(conn: { pragma(sql: string): unknown }, done: (err: Error | null, conn: unknown) => void) {
        if (filename !== ':memory:') conn.pragma('journal_mode = WAL');
        conn.pragma('foreign_keys = ON');
        conn.pragma('busy_timeout = 5000');
        done(null, conn);
      },
    },
  });
}

export async function migrateToLatest(db: Knex): Promise<void> {
  await db.migrate.latest(migrationConfig);
}
