import { createInterface } from 'node:readline/promises';
import { readConfig } from './config';
import { createDb, describeDatabase, migrateToLatest } from './db';
import { seedReferenceData } from './seeding';
import { createUser } from './services/users';

/** `npm run create-admin -- <username>`: makes the first admin of a production install. */
async function main(): Promise<void> {
  const username = process.argv[2] ?? 'admin';
  const config = readConfig({ ...process.env, SESSION_SECRET: process.env['SESSION_SECRET'] ?? 'unused-here' });
  const db = createDb(config.databaseUrl ?? config.databaseFile);
  try {
    await migrateToLatest(db);
    await seedReferenceData(db);
    const password = process.env['ADMIN_PASSWORD'] ?? (await ask(`Password for ${username} (12+ characters): `));
    if (password.length < 12) throw new Error('Use a password of at least 12 characters.');
    await createUser(db, { username, password, role: 'admin', displayName: 'Administrator' }, new Date());
    console.log(`Admin "${username}" created in ${describeDatabase(config.databaseUrl ?? config.databaseFile)}.`);
  } finally {
    await db.destroy();
  }
}

async function ask(question: string): Promise<string> {
  const rl = createInterface({ input: process.stdin, output: process.stdout });
  try {
    return (await rl.question(question)).trim();
  } finally {
    rl.close();
  }
}

main().catch((err) => {
  console.error(err instanceof Error ? err.message : err);
  process.exit(1);
});
