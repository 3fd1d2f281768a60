import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { AddressInfo } from 'node:net';
import type { Knex } from 'knex';
import { closeApp, createApp } from '../../../server/app';
import { fixedClock, systemClock } from '../../../server/clock';
import { createDb, migrateToLatest } from '../../../server/db';
import { seedDemo, seedReferenceData } from '../../../server/seeding';
import { createUser } from '../../../server/services/users';

/**
 * The production build `npm run build` writes; the browser tests drive exactly what ships.
 * `E2E_CLIENT_DIR` points at another build (e.g. `ng build --output-path /tmp/mine` → `/tmp/mine/browser`)
 * so two people can build and run browser tests in one checkout without overwriting each other.
 */
export const CLIENT_DIR =
  process.env['E2E_CLIENT_DIR'] ?? path.resolve(__dirname, '..', '..', '..', 'dist', 'turnwise', 'browser');

export interface TestServer {
  /** e.g. `http://127.0.0.1:41234`, no trailing slash. */
  baseUrl: string;
  db: Knex;
  /** The server's clock when started with `now`: tests move it on (a surface dries); absent on real time. */
  clock?: ReturnType<typeof fixedClock>;
  close(): Promise<void>;
}

export interface TestServerOptions {
  /** Freezes the server's clock; without it the server runs on real time. */
  now?: Date;
  /** Seed today's demo day list as well as the demo centre (default true). */
  seedDay?: boolean;
  /**
   * false: a production-like install from nothing: reference data only (no demo centre, rules or
   * accounts), demo mode off, and one admin (`firstAdmin`) as `npm run create-admin` makes it.
   */
  demo?: boolean;
  firstAdmin?: { username: string; password: string };
}

/**
 * The real server on a random local port: a temp SQLite file, migrated, seeded with the
 * reference data and the invented demo centre, serving the built client in demo mode (or, with
 * `demo: false`, a new department with nothing but its first admin).
 */
export async function startTestServer(options: TestServerOptions = {}): Promise<TestServer> {
  if (!fs.existsSync(path.join(CLIENT_DIR, 'index.html'))) {
    // Without the build the SPA fallback is never mounted and every page would 404 confusingly.
    throw new Error(`No client build in ${CLIENT_DIR}; run \`npm run build\` first.`);
  }
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'turnwise-e2e-'));
  const db = createDb(path.join(dir, 'e2e.sqlite'));
  const settable = options.now ? fixedClock(options.now) : undefined;
  const clock = settable ?? systemClock;
  await migrateToLatest(db);
  await seedReferenceData(db);
  const demo = options.demo ?? true;
  if (demo) await seedDemo(db, clock.now(), { day: options.seedDay ?? true });
  else if (options.firstAdmin) await createUser(db, { ...options.firstAdmin, role: 'admin', displayName: 'Administrator' }, clock.now());

  const app = createApp({
    db,
    clock,
    clientDir: CLIENT_DIR,
    demo,
    sessionSecret: 'e2e',
    logError: console.error,
  });
  const server = app.listen(0, '127.0.0.1');
  await new Promise<void>((resolve, reject) => {
    server.once('listening', resolve);
    server.once('error', reject);
  });
  const { port } = server.address() as AddressInfo;

  return {
    baseUrl: `http://127.0.0.1:${port}`,
    db,
    clock: settable,
    async close() {
      // Chromium keeps idle keep-alive sockets open, which would hold server.close() forever.
      server.closeAllConnections();
      await new Promise<void>((resolve) => server.close(() => resolve()));
      await closeApp(app);
      await db.destroy();
      fs.rmSync(dir, { recursive: true, force: true });
    },
  };
}
