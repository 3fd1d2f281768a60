import http from 'node:http';
import type { AddressInfo } from 'node:net';
import type { Express } from 'express';
import type { Knex } from 'knex';
import request from 'supertest';
import { closeApp, createApp } from '../../server/app';
import { createDb, HL7_LISTENER_LOCK, NOTICE_PASS_LOCK, onceAcrossProcesses } from '../../server/db';
import { PostgresDayEvents } from '../../server/services/day-events-postgres';
import { startHl7Feed, type Hl7Feed } from '../../server/services/hl7/feed';
import { EXAM_LIST_HEADER, toCsv } from '../fixtures/exam-lists';
import { siu } from '../fixtures/siu-messages';
import { MllpClient } from '../support/mllp-client';
import { signedIn, startHarness, type Client, type Harness } from './harness';
import { testDatabaseUrl } from './pg-databases';

const DAY = '2027-03-10'; // America/Chicago, -06:00
const t = (hhmm: string) => `${DAY}T${hhmm}:00-06:00`;
const row = (acc: string, start: string) => [acc, 'MR 1', start, '30', 'MR exam', 'knee', 'none', 'ambulatory', 'no', ''];

/**
 * Two servers on one PostgreSQL database: A is the harness's app, B a second app with its own
 * pool, session store and event bus (its own LISTEN connection), as a second process has; all
 * they share is the database. Runs with TEST_DATABASE_URL (npm run test:pg, CI).
 */
(testDatabaseUrl ? describe : describe.skip)('two servers on one PostgreSQL database', () => {
  let h: Harness;
  let dbB: Knex;
  let eventsA: PostgresDayEvents;
  let eventsB: PostgresDayEvents;
  let appB: Express;
  let scheduler: Client;
  let charge: Client;
  beforeAll(async () => {
    h = await startHarness();
    // A's own bus replaces the harness app's, so this test can wait until it listens
    await closeApp(h.app);
    eventsA = new PostgresDayEvents(h.db, () => {});
    h.app = createApp({ db: h.db, sessionSecret: 'test-secret', clock: h.clock, demo: true, logError: () => {}, events: eventsA });
    dbB = createDb(h.file);
    eventsB = new PostgresDayEvents(dbB, () => {});
    appB = createApp({ db: dbB, sessionSecret: 'test-secret', clock: h.clock, demo: true, logError: () => {}, events: eventsB });
    await Promise.all([eventsA.listening, eventsB.listening]);
    scheduler = await signedIn(h.app, 'scheduler');
    charge = await signedIn(h.app, 'charge');
    const csv = toCsv([EXAM_LIST_HEADER, row('M-1', '08:00'), row('M-2', '09:00')]);
    expect((await scheduler.upload(`/api/days/${DAY}/exams/import`, csv, 'day.csv')).status).toBe(200);
  }, 30_000);
  afterAll(async () => {
    await closeApp(appB);
    await Promise.all([eventsA.close(), eventsB.close()]);
    await dbB.destroy();
    await h.close();
  }, 30_000);

  /** Charge's session cookies (made on A), to send to B. */
  const chargeCookies = async () => (await charge.get('/api/auth/me')).request.cookies as unknown as string;
  const exam = async (accession: string) => (await h.db('exams').where({ day: DAY, accession }).first()) as { id: number; version: number };

  it('accepts on B a session made on A, XSRF token included', async () => {
    const cookies = await chargeCookies();
    const me = await request(appB).get('/api/auth/me').set('Cookie', cookies);
    expect([me.status, me.body.user?.username]).toEqual([200, 'charge']);
    const m1 = await exam('M-1');
    const moved = await request(appB).patch(`/api/exams/${m1.id}`).set('Cookie', cookies).set('X-XSRF-TOKEN', charge.token).send({ start: t('08:10'), version: m1.version, reason: 'drag' });
    expect(moved.status).toBe(200);
    expect((await request(appB).get('/api/auth/me')).status).toBe(401);
  });

  it("streams on B's event stream a move saved on A", async () => {
    const server = http.createServer(appB);
    await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
    const port = (server.address() as AddressInfo).port;
    const cookies = await chargeCookies();
    try {
      let moving: Promise<{ status: number }> | undefined;
      const received = new Promise<string>((resolve, reject) => {
        const req = http.get({ host: '127.0.0.1', port, path: `/api/days/${DAY}/events`, headers: { Cookie: cookies } }, (res) => {
          expect(res.headers['content-type']).toMatch(/text\/event-stream/);
          let buffer = '';
          res.on('data', (chunk) => {
            buffer += chunk;
            if (buffer.includes('event: change')) {
              resolve(buffer);
              req.destroy();
            }
          });
          // once B's stream is open, move a slot on A
          moving = exam('M-2').then((m2) => charge.patch(`/api/exams/${m2.id}`, { start: t('09:20'), version: m2.version, reason: 'drag' }));
        });
        req.on('error', reject);
      });
      const text = await received;
      // The move's own answer too: its plan is read after the event goes out, and a request still
      // running when the suite closes its database waits for a connection that never comes.
      expect((await moving!).status).toBe(200);
      const data = JSON.parse(/data: (.*)/.exec(text.slice(text.indexOf('event: change')))![1]!);
      const mover = (await charge.get('/api/auth/me')).body.user.displayName as string;
      expect(data).toMatchObject({ date: DAY, kind: 'plan', reason: 'drag', by: mover });
    } finally {
      server.closeAllConnections();
      await new Promise((resolve) => server.close(resolve));
    }
  });

  it('runs background work (the notice pass) in one of them at a time; the other skips its turn', async () => {
    let release!: () => void;
    let started!: () => void;
    const isRunning = new Promise<void>((resolve) => (started = resolve));
    const onA = onceAcrossProcesses(h.db, NOTICE_PASS_LOCK, async () => {
      started();
      await new Promise<void>((resolve) => (release = resolve));
    });
    await isRunning;
    let ranOnB = false;
    expect(await onceAcrossProcesses(dbB, NOTICE_PASS_LOCK, async () => void (ranOnB = true))).toBe(false);
    release();
    expect(await onA).toBe(true);
    expect(ranOnB).toBe(false);
    // the lock ends with A's pass: B's next turn runs
    expect(await onceAcrossProcesses(dbB, NOTICE_PASS_LOCK, async () => void (ranOnB = true))).toBe(true);
    expect(ranOnB).toBe(true);
  });

  describe('the HL7 listener', () => {
    const feeds: Hl7Feed[] = [];
    afterAll(() => Promise.all(feeds.map((feed) => feed.close())), 30_000);
    /** A feed as each server starts it, trying to take over every 50 ms (5 s in a server). */
    const feedOn = (db: Knex, events: PostgresDayEvents) => {
      const feed = startHl7Feed({ db, clock: h.clock, events, logError: () => {} }, { port: 0, host: '127.0.0.1', leaderRetryMs: 50 });
      feeds.push(feed);
      return feed;
    };
    /** Waits (within the test's timeout) until one of the feeds listens; answers which. */
    const leaderOf = async (candidates: Hl7Feed[]): Promise<Hl7Feed> => {
      for (;;) {
        for (const feed of candidates) if (await feed.address()) return feed;
        await new Promise((resolve) => setTimeout(resolve, 20));
      }
    };
    const acceptsMessages = async (feed: Hl7Feed, control: string) => {
      const client = await MllpClient.connect((await feed.address())!.port);
      try {
        return await client.send(siu('S12', { control, accession: `HL7-${control}`, start: '20270311090000-0600', minutes: 30, room: 'MR 1' }));
      } finally {
        await client.close();
      }
    };

    it('listens in one server only; when the leader stops or loses its database session, the other takes over', async () => {
      const onA = feedOn(h.db, eventsA);
      expect(await onA.address()).not.toBeNull();
      const onB = feedOn(dbB, eventsB);
      expect(await onB.address()).toBeNull();
      // what each one's Interface log shows: where A listens, and, on B, the port every process is given
      expect(await onA.served()).toEqual({ host: '127.0.0.1', port: (await onA.address())!.port });
      expect(await onB.served()).toEqual({ host: '127.0.0.1', port: 0 });
      expect(await acceptsMessages(onA, 'A-1')).toContain('MSA|AA|');

      // the leader's session ends as when its process dies: it stops listening, and one of them leads again
      const first = (await onA.address())!.port;
      const ended = await h.db.raw(
        "select pg_terminate_backend(pid) from pg_locks where locktype = 'advisory' and objid = ? and granted and database = (select oid from pg_database where datname = current_database())",
        [HL7_LISTENER_LOCK],
      );
      expect(ended.rows).toHaveLength(1);
      while ((await onA.address())?.port === first) await new Promise((resolve) => setTimeout(resolve, 20));
      const next = await leaderOf([onA, onB]);
      const other = next === onA ? onB : onA;
      expect(await other.address()).toBeNull();
      expect(await acceptsMessages(next, 'N-1')).toContain('MSA|AA|');

      // the leader closes (a server stopping): the other takes over
      await next.close();
      expect(await next.address()).toBeNull();
      expect(await leaderOf([other])).toBe(other);
      expect(await acceptsMessages(other, 'O-1')).toContain('MSA|AA|');
    });
  });

  it('lets exactly one of two moves of one slot from the same version win, one from A and one from B', async () => {
    const cookies = await chargeCookies();
    const m2 = await exam('M-2');
    const answers = await Promise.all([
      charge.patch(`/api/exams/${m2.id}`, { start: t('10:00'), version: m2.version, reason: 'drag' }),
      request(appB).patch(`/api/exams/${m2.id}`).set('Cookie', cookies).set('X-XSRF-TOKEN', charge.token).send({ start: t('11:00'), version: m2.version, reason: 'drag' }),
    ]);
    expect(answers.map((a) => a.status).sort()).toEqual([200, 409]);
    expect((await exam('M-2')).version).toBe(m2.version + 1);
  });
});
