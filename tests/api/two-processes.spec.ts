import http from 'node:http';
import request from 'supertest';
import { EXAM_LIST_HEADER, toCsv } from '../fixtures/exam-lists';
import { startServerProcess, type ServerProcess } from '../support/server-process';
import { signedIn, startHarness, type Client, type Harness } from './harness';
import { testDatabaseUrl } from './pg-databases';

const DAY = '2027-03-10'; // America/Chicago, -06:00
const t = (hhmm: string) => `${DAY}T${hhmm}:00-06:00`;
const row = (acc: string, start: string) => [acc, 'MR 1', start, '30', 'MR exam', 'knee', 'none', 'ambulatory', 'no', ''];

/**
 * Two real server processes (`server/main.ts`, as `npm run serve` starts it) on one PostgreSQL
 * database, which the harness made (migrated, demo accounts and rooms); all they share is the
 * database and the session secret. Runs with TEST_DATABASE_URL (npm run test:pg, CI).
 */
(testDatabaseUrl ? describe : describe.skip)('two server processes on one PostgreSQL database', () => {
  let h: Harness;
  const servers: ServerProcess[] = [];
  let a: ServerProcess;
  let b: ServerProcess;
  let charge: Client;
  beforeAll(async () => {
    h = await startHarness();
    const started = await Promise.allSettled(['turnwise-a', 'turnwise-b'].map((appName) => startServerProcess({ databaseUrl: h.file, appName, sessionSecret: 'two-processes-secret' })));
    for (const s of started) if (s.status === 'fulfilled') servers.push(s.value);
    for (const s of started) if (s.status === 'rejected') throw s.reason;
    [a, b] = servers as [ServerProcess, ServerProcess];
    const scheduler = await signedIn(a.url, 'scheduler');
    const csv = toCsv([EXAM_LIST_HEADER, row('P-1', '08:00'), row('P-2', '09:00')]);
    expect((await scheduler.upload(`/api/days/${DAY}/exams/import`, csv, 'day.csv')).status).toBe(200);
    charge = await signedIn(a.url, 'charge');
  }, 120_000);
  afterAll(async () => {
    await Promise.all(servers.map((server) => server.stop(10_000)));
    await h?.close();
  }, 60_000);

  /** The cookies charge's browser holds from A, sent as they are to B. */
  const chargeCookies = () => ['turnwise.sid', 'XSRF-TOKEN'].map((name) => `${name}=${charge.cookie(name)}`).join('; ');
  const exam = async (accession: string) => (await h.db('exams').where({ day: DAY, accession }).first()) as { id: number; version: number };
  const moveOnB = (id: number, body: object) => request(b.url).patch(`/api/exams/${id}`).set('Cookie', chargeCookies()).set('X-XSRF-TOKEN', charge.token).send(body);

  it('accepts on B a session made on A, XSRF token included', async () => {
    const me = await request(b.url).get('/api/auth/me').set('Cookie', chargeCookies());
    expect([me.status, me.body.user?.username]).toEqual([200, 'charge']);
    const p1 = await exam('P-1');
    expect((await moveOnB(p1.id, { start: t('08:10'), version: p1.version, reason: 'drag' })).status).toBe(200);
    expect((await request(b.url).get('/api/auth/me')).status).toBe(401);
  });

  it("streams on B's event stream a move saved on A", async () => {
    // B passes on other processes' events once its LISTEN connection is up: wait for it
    const listening = () => h.db.raw("select 1 from pg_stat_activity where datname = current_database() and application_name = ? and query ilike 'listen %'", [b.appName]);
    while ((await listening()).rows.length === 0) await new Promise((resolve) => setTimeout(resolve, 50));
    let stream: http.ClientRequest | undefined;
    try {
      const text = await new Promise<string>((resolve, reject) => {
        stream = http.get(`${b.url}/api/days/${DAY}/events`, { agent: false, headers: { Cookie: chargeCookies() } }, (res) => {
          expect(res.headers['content-type']).toMatch(/text\/event-stream/);
          res.setEncoding('utf8');
          let buffer = '';
          let moved = false;
          res.on('data', (chunk: string) => {
            buffer += chunk;
            if (!moved && buffer.includes('retry:')) {
              // B's stream is open: move a slot on A
              moved = true;
              exam('P-2')
                .then((p2) => charge.patch(`/api/exams/${p2.id}`, { start: t('09:20'), version: p2.version, reason: 'drag' }))
                .then((res) => (res.status === 200 ? undefined : reject(new Error(`the move on A answered ${res.status}`))), reject);
            }
            if (buffer.includes('event: change')) resolve(buffer.slice(buffer.indexOf('event: change')));
          });
        });
        stream.on('error', reject);
      });
      const data = JSON.parse(/data: (.*)/.exec(text)![1]!);
      const mover = (await charge.get('/api/auth/me')).body.user.displayName as string;
      expect(data).toMatchObject({ date: DAY, kind: 'plan', reason: 'drag', by: mover });
    } finally {
      stream?.destroy();
    }
  });

  it('lets exactly one of two moves of one slot from the same version win, one on A and one on B', async () => {
    const p2 = await exam('P-2');
    const answers = await Promise.all([
      charge.patch(`/api/exams/${p2.id}`, { start: t('10:00'), version: p2.version, reason: 'drag' }),
      moveOnB(p2.id, { start: t('11:00'), version: p2.version, reason: 'drag' }),
    ]);
    expect(answers.map((answer) => answer.status).sort()).toEqual([200, 409]);
    expect((await exam('P-2')).version).toBe(p2.version + 1);
  });

  it('stops on SIGTERM with an event stream open: the stream is ended after a grace, and the process exits', async () => {
    const stream = await new Promise<http.IncomingMessage>((resolve, reject) => {
      http.get(`${b.url}/api/days/${DAY}/events`, { agent: false, headers: { Cookie: chargeCookies() } }, (res) => res.once('data', () => resolve(res))).once('error', reject);
    });
    const closed = new Promise((resolve) => stream.once('close', resolve));
    stream.resume();
    // without an end to the stream the server would wait for it forever, and be killed here
    expect(await b.stop(30_000)).toBe('exited');
    await closed;
  }, 60_000);
});
