import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { Express } from 'express';
import type { Knex } from 'knex';
import request from 'supertest';
import type { CookieAccessInfo, CookieJar } from 'cookiejar';
import { closeApp, createApp, type AppDeps } from '../../server/app';
import { fixedClock } from '../../server/clock';
import { createDb, migrateToLatest } from '../../server/db';
import { seedDemo, seedReferenceData } from '../../server/seeding';
import { DEMO_PASSWORD } from '../../seeds/support/demo-accounts';
import type { Role } from '../../shared/api/auth';
import { copyDatabase, templateDatabase, testDatabaseUrl } from './pg-databases';

export { DEMO_PASSWORD };

export interface Harness {
  db: Knex;
  app: Express;
  /** The SQLite file, or the PostgreSQL URL in the PostgreSQL mode. */
  file: string;
  clock: ReturnType<typeof fixedClock>;
  /** A fresh app on the same database file, as after a server restart. */
  restart(): Promise<void>;
  close(): Promise<void>;
}

/**
 * A real SQLite file in a temp folder, migrated to latest and seeded with the demo centre (or,
 * `bare`, with the reference data only).
 * Migrating and seeding run once per test process and clock (into a template file); each harness
 * starts from a copy, so a suite's setup stays quick on a busy machine. With TEST_DATABASE_URL
 * set, the same on PostgreSQL: a template database per run and clock, a fresh copy per harness,
 * dropped at close.
 */
export async function startHarness(options: Partial<AppDeps> & HarnessSeed & { now?: string } = {}): Promise<Harness> {
  const clock = fixedClock(options.now ?? '2027-03-10T14:00:00Z');
  const seed: Required<HarnessSeed> = { seedDay: options.seedDay ?? false, bare: options.bare ?? false };
  let dir: string | null = null;
  let dropDatabase = async () => {};
  let file: string;
  if (testDatabaseUrl) {
    const copy = await copyDatabase(testDatabaseUrl, await templateDatabase(testDatabaseUrl, templateKey(clock.now(), seed), (db) => migrateAndSeed(db, clock.now(), seed)));
    file = copy.url;
    dropDatabase = copy.drop;
  } else {
    dir = fs.mkdtempSync(path.join(os.tmpdir(), 'turnwise-test-'));
    file = path.join(dir, 'test.sqlite');
    fs.copyFileSync(await templateFile(clock.now(), seed), file);
  }
  let db = createDb(file);
  const build = () => createApp({ db, sessionSecret: 'test-secret', clock, demo: true, logError: () => {}, ...options });
  const harness: Harness = {
    db,
    app: build(),
    file,
    clock,
    async restart() {
      await closeApp(harness.app);
      await db.destroy();
      db = createDb(file);
      harness.db = db;
      harness.app = build();
    },
    async close() {
      await closeApp(harness.app);
      await db.destroy();
      await dropDatabase();
      if (dir) fs.rmSync(dir, { recursive: true, force: true });
    },
  };
  return harness;
}

/** What a harness database holds besides the schema and the reference data. */
export interface HarnessSeed {
  /** The demo day's exams too. */
  seedDay?: boolean;
  /** Nothing else: no demo centre, no accounts, as a production boot leaves it. */
  bare?: boolean;
}

const templates = new Map<string, Promise<string>>();

/** A migrated, seeded database file for this clock, made once per test process. */
function templateFile(now: Date, seed: Required<HarnessSeed>): Promise<string> {
  const key = templateKey(now, seed);
  let made = templates.get(key);
  if (!made) {
    made = (async () => {
      const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'turnwise-template-'));
      process.once('exit', () => fs.rmSync(dir, { recursive: true, force: true }));
      const file = path.join(dir, 'template.sqlite');
      const db = createDb(file);
      try {
        await migrateAndSeed(db, now, seed);
        // Everything into the main file, so one file copy is the whole database.
        await db.raw('pragma wal_checkpoint(TRUNCATE)');
      } finally {
        await db.destroy();
      }
      return file;
    })();
    templates.set(key, made);
  }
  return made;
}

function templateKey(now: Date, seed: Required<HarnessSeed>): string {
  return seed.bare ? `${now.toISOString()}|bare` : `${now.toISOString()}|${seed.seedDay}`;
}

async function migrateAndSeed(db: Knex, now: Date, seed: Required<HarnessSeed>): Promise<void> {
  await migrateToLatest(db);
  await seedReferenceData(db);
  if (!seed.bare) await seedDemo(db, now, { day: seed.seedDay });
}

/** What the agent's jar sends with a sign-in call: supertest's host, the auth path, plain HTTP. */
const API_REQUEST = { domain: '127.0.0.1', path: '/api/auth/login', secure: false, script: false } as CookieAccessInfo;

/**
 * A cookie-keeping client (of an app, or of a server's base URL) that sends its current XSRF
 * token on every call. The server re-issues the token when the session changes (sign-in), so it
 * is read from the cookie jar each time, as the Angular client reads the cookie before each request.
 */
export async function client(app: Express | string) {
  const agent = request.agent(app);
  await agent.get('/api/health');
  const jar = (agent as unknown as { jar: CookieJar }).jar;
  /** The raw value of a cookie the agent holds (as the server set it), or undefined. */
  const cookie = (name: string): string | undefined => jar.getCookie(name, API_REQUEST)?.value;
  const token = () => decodeURIComponent(cookie('XSRF-TOKEN') ?? '');
  const withToken = <T extends request.Test>(t: T) => t.set('X-XSRF-TOKEN', token());
  return {
    agent,
    cookie,
    /** The XSRF token the client would send now. */
    get token() {
      return token();
    },
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

/** A client signed in as the demo account of that role (on an app, or a server's base URL). */
export async function signedIn(app: Express | string, role: Role): Promise<Client> {
  const c = await client(app);
  const res = await c.post('/api/auth/login', { username: role, password: DEMO_PASSWORD });
  if (res.status !== 200) throw new Error(`login as ${role} failed: ${res.status} ${JSON.stringify(res.body)}`);
  return c;
}
