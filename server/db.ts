import path from 'node:path';
import fs from 'node:fs';
import knex, { Knex } from 'knex';
import { types as pgTypes, type Client as PgClient } from 'pg';

export const MIGRATIONS_DIR = path.resolve(__dirname, '..', 'migrations');

/** Migration settings shared by the app, the CLI scripts and the tests. */
export const migrationConfig: Knex.MigratorConfig = {
  directory: MIGRATIONS_DIR,
  loadExtensions: ['.ts', '.js'],
};

/** A `postgres://` or `postgresql://` URL selects PostgreSQL; anything else is an SQLite file. */
export function isPostgresUrl(target: string): boolean {
  return /^postgres(ql)?:\/\//i.test(target);
}

/**
 * Opens the database: PostgreSQL for a `postgres://` URL (DATABASE_URL, the scale-out setup),
 * else the SQLite file (or `:memory:`) with WAL and foreign keys on every pooled connection.
 * The SQLite file's parent folder is created so a fresh clone starts without setup.
 */
export function createDb(target: string): Knex {
  if (isPostgresUrl(target)) return createPostgresDb(target);
  const filename = target;
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

/** PostgreSQL type ids whose text pg would hand over as a string. */
const INT8 = 20;
const NUMERIC = 1700;

/**
 * PostgreSQL through the same Knex code. Counts and sums come back as int8 and averages as
 * numeric, which pg answers as strings (they may exceed 2^53); every such number here is a
 * count of rows or minutes, so they are read as JavaScript numbers, as SQLite answers them.
 * The parsers are this pool's own, not pg's global ones.
 */
function createPostgresDb(connectionString: string): Knex {
  return knex({
    client: 'pg',
    connection: {
      connectionString,
      types: {
        getTypeParser: (oid: number, format?: string) => {
          if (oid === INT8 || oid === NUMERIC) return (value: string) => Number(value);
          return pgTypes.getTypeParser(oid, format === 'binary' ? 'binary' : 'text');
        },
      },
    },
    pool: {
      min: 0,
      max: 10,
      afterCreate(conn: PgClient, done: (err: Error | null, conn: PgClient) => void) {
        oneQueryAtATime(conn);
        done(null, conn);
      },
    },
  });
}

type QueryCallback = (err: Error | null, result?: unknown) => void;

/**
 * A transaction is one connection, and code that reads with `Promise.all` hands it several
 * queries at once (on SQLite they simply run in turn). pg queues them itself but calls that
 * deprecated (gone in pg 9), so each pooled connection here sends the next query only once the
 * one before has answered. Only the form Knex uses (query and callback) waits its turn.
 */
function oneQueryAtATime(conn: PgClient): void {
  const query = conn.query.bind(conn) as (...args: unknown[]) => unknown;
  let turn: Promise<void> = Promise.resolve();
  (conn as unknown as { query: (...args: unknown[]) => unknown }).query = (...args: unknown[]) => {
    const callback = args[1];
    if (args.length !== 2 || typeof callback !== 'function') return query(...args);
    turn = turn.then(
      () =>
        new Promise<void>((answered) => {
          try {
            query(args[0], (err: Error | null, result?: unknown) => {
              answered();
              (callback as QueryCallback)(err, result);
            });
          } catch (err) {
            answered();
            (callback as QueryCallback)(err as Error);
          }
        }),
    );
    return undefined;
  };
}

/** The database a target names, for a log line: the URL without its password, or the file. */
export function describeDatabase(target: string): string {
  if (!isPostgresUrl(target)) return target;
  const url = new URL(target);
  if (url.password) url.password = '***';
  return url.toString();
}

/** The advisory-lock key of the notice sender's pass (any fixed 64-bit number; this is "Tw" 1). */
export const NOTICE_PASS_LOCK = 0x5477_0001;
/** The advisory-lock key the HL7 listener's leader holds (`services/leadership.ts`). */
export const HL7_LISTENER_LOCK = 0x5477_0002;

/**
 * Runs `work` in one server process at a time: on PostgreSQL only the process that takes the
 * transaction-scoped advisory lock `key` runs it (the lock is held until `work` ends, and freed
 * with its connection should the process die); the others skip this turn and answer false.
 * SQLite is served by one process, so there it simply runs.
 */
export async function onceAcrossProcesses(db: Knex, key: number, work: () => Promise<void>): Promise<boolean> {
  if (db.client.config.client !== 'pg') {
    await work();
    return true;
  }
  return db.transaction(async (trx) => {
    const { rows } = (await trx.raw('select pg_try_advisory_xact_lock(?) as locked', [key])) as { rows: { locked: boolean }[] };
    if (!rows[0]?.locked) return false;
    await work();
    return true;
  });
}

export async function migrateToLatest(db: Knex): Promise<void> {
  await db.migrate.latest(migrationConfig);
}
