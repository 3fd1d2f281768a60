import { readConfig } from './config';
import { createDb, describeDatabase, migrateToLatest } from './db';

/** `npm run migrate`: brings the database file to the latest schema. */
async function main(): Promise<void> {
  const config = readConfig({ ...process.env, SESSION_SECRET: process.env['SESSION_SECRET'] ?? 'unused-here' });
  const db = createDb(config.databaseUrl ?? config.databaseFile);
  try {
    await migrateToLatest(db);
    console.log(`Migrated ${describeDatabase(config.databaseUrl ?? config.databaseFile)} to the latest schema.`);
  } finally {
    await db.destroy();
  }
}

main().catch((err) => {
  console.error(err instanceof Error ? err.message : err);
  process.exit(1);
});
