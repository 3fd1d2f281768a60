import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { Express } from 'express';
import type { Knex } from 'knex';
import request from 'supertest';
import { createApp, type AppDeps } from '../../server/app';
import { fixedClock } from '../../server/clock';
import { createDb, migrateToLatest } from '../../server/db';
import { seedDemo, seedReferenceData } from '../../server/seeding';
import { DEMO_PASSWORD } from '../../seeds/support/demo-accounts';
import type { Role } from '../../shared/api/auth';

export { DEMO_PASSWORD };

export interface Harness {
  db: Knex;
  app: Express;
  file: string;
  clock: ReturnType<typeof fixedClock>;
  /** A fresh app on the same database file, as after a server restart. */
  restart(): Promise<void>;
  close(): Promise<void>;
}

/** A real SQLite file in a temp folder, migrated to latest and seeded with the demo centre. */
export async function startHarness(options: Partial<AppDeps> & { now?: string; seedDay?: boolean } = {}): Promise<Harness> {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'turnwise-test-'));
  const file = path.join(dir, 'test.sqlite');
  const clock = fixedClock(options.now ?? '2027-03-10T14:00:00Z');
  let db = createDb(file);
  await migrateToLatest(db);
  await seedReferenceData(db);
  await seedDemo(db, clock.now(), { day: options.seedDay ?? false });
  const build = () => createApp({ db, sessionSecret: 'test-secret', clock, demo: true, logError: () => {}, ...options });
  const harness: Harness = {
    db,
    app: build(),
    file,
    clock,
    async restart() {
      await db.destroy();
      db = createDb(file);
      harness.db = db;
      harness.app = build();
    },
    async close() {
      await db.destroy();
      fs.rmSync(dir, { recursive: true, force: true });
    },
  };
  return harness;
}

/** A cookie-keeping client that has its XSRF token and sends it on every call. */
export async function client(app: Express) {
  const agent = request.agent(app);
  const res = await agent.get('/api/health');
  const cookie = (res.headers['set-cookie'] as unknown as string[] | undefined)?.find((c) => c.startsWith('XSRF-TOKEN='));
  const token = decodeURIComponent(cookie?.split(';')[0]?.split('=')[1] ?? '');
  const withToken = <T extends request.Test>(t: T) => t.set('X-XSRF-TOKEN', token);
  return {
    agent,
    token,
    get: (url: string) => agent.get(url),
    post: (url: string, body?: object) => withToken(agent.post(url)).send(body),
    put: (url: string, body?: object) => withToken(agent.put(url)).send(body),
    patch: (url: string, body?: object) => withToken(agent.patch(url)).send(body),
    delete: (url: string) => withToken(agent.delete(url)),
    upload: (url: string, content: Buffer | string, filename: string) =>
      withToken(agent.post(url)).attach('file', Buffer.isBuffer(content) ? content : Buffer.from(content), filename),
  };
}

export type Client = Awaited<ReturnType<typeof client>>;

/** A client signed in as the demo account of that role. */
export async function signedIn(app: Express, role: Role): Promise<Client> {
  const c = await client(app);
  const res = await c.post('/api/auth/login', { username: role, password: DEMO_PASSWORD });
  if (res.status !== 200) throw new Error(`login as ${role} failed: ${res.status} ${JSON.stringify(res.body)}`);
  return c;
}
