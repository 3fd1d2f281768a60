import http from 'node:http';
import { createDb } from '../../server/db';
import { databaseUrl, testDatabaseUrl } from '../api/pg-databases';
import { EXAM_LIST_HEADER } from '../fixtures/exam-lists';
import { startServerProcess, type ServerProcess } from '../support/server-process';
import { hhmm, importDayList, seedDemoCentre, signIn, type Session } from './support/http-session';
import { percentile } from './support/stats';

const DAY = '2027-03-10';
const ROOMS = ['MR 1', 'MR 2', 'MR 3', 'CT 1'];
const EXAMS_PER_ROOM = 16;
const LATENCY_MOVES = 200;
const THROUGHPUT_MOVES = 400;
const AT_ONCE = 8;

interface PlanExam {
  id: number;
  start: string;
  version: number;
}
interface BenchExam extends PlanExam {
  moves: number;
}

/**
 * Two server processes on one PostgreSQL database (TEST_DATABASE_URL, the maintenance database
 * of a test cluster, as `npm run test:pg` makes one): slot moves per second sent to both, 8 at a
 * time, and the time from a move sent to process A to its event on an open stream of process B
 * (NOTIFY, B's LISTEN connection, its SSE stream). Without TEST_DATABASE_URL it says it skipped.
 */
export async function benchPgProcesses(): Promise<string[]> {
  if (!testDatabaseUrl) {
    return ['pg two processes: skipped (set TEST_DATABASE_URL=postgres://… to a test cluster, as npm run test:pg makes, to measure moves across two server processes)'];
  }
  const admin = createDb(testDatabaseUrl);
  const name = `tw_bench_${process.pid}`;
  const url = databaseUrl(testDatabaseUrl, name);
  const servers: ServerProcess[] = [];
  let stream: http.ClientRequest | undefined;
  try {
    await admin.raw(`create database ${name} template template0 encoding 'UTF8' lc_collate 'C' lc_ctype 'C'`);
    await seedDemoCentre(url);
    servers.push(...(await Promise.all(['bench-a', 'bench-b'].map((appName) => startServerProcess({ databaseUrl: url, appName, sessionSecret: 'bench' })))));
    const [a, b] = servers as [ServerProcess, ServerProcess];
    const session = await signIn(a.url);
    const exams = await importDay(a.url, session);

    // B passes on A's events once its LISTEN connection is up
    while ((await admin.raw("select 1 from pg_stat_activity where datname = ? and application_name = ? and query ilike 'listen %'", [name, b.appName])).rows.length === 0) {
      await new Promise((resolve) => setTimeout(resolve, 50));
    }
    const heard: (() => void)[] = [];
    await new Promise<void>((ready, fail) => {
      stream = http.get(`${b.url}/api/days/${DAY}/events`, { agent: false, headers: { Cookie: session.cookie } }, (res) => {
        res.setEncoding('utf8');
        res.on('data', (text: string) => {
          if (text.includes('retry:')) ready();
          for (let n = text.split('event: change').length - 1; n > 0; n--) heard.shift()?.();
        });
      });
      stream.on('error', fail);
    });

    const times: number[] = [];
    for (let m = 0; m < LATENCY_MOVES; m++) {
      const event = new Promise<void>((resolve) => heard.push(resolve));
      const t0 = performance.now();
      await move(a.url, session, exams[m % exams.length]!);
      await event;
      times.push(performance.now() - t0);
    }
    const at = (p: number) => percentile(times, p).toFixed(1);

    // the stream is closed first: throughput is the moves alone
    stream?.destroy();
    stream = undefined;
    let sent = 0;
    let refused = 0;
    const started = performance.now();
    await Promise.all(
      Array.from({ length: AT_ONCE }, async (_, worker) => {
        const mine = exams.filter((_, i) => i % AT_ONCE === worker);
        for (let m = 0; sent < THROUGHPUT_MOVES; m++) {
          sent++;
          if (!(await move(m % 2 === 0 ? a.url : b.url, session, mine[m % mine.length]!))) refused++;
        }
      }),
    );
    const seconds = (performance.now() - started) / 1000;
    return [
      `pg two processes: ${sent} slot moves (${AT_ONCE} at a time, to A and B in turn, ${exams.length}-exam day) in ${seconds.toFixed(2)} s: ${(sent / seconds).toFixed(0)} moves/s (${refused} refused)`,
      `pg two processes: move sent to A → its event on B's stream: p50 ${at(50)} ms, p99 ${at(99)} ms (${LATENCY_MOVES} moves one after another, request included)`,
    ];
  } finally {
    stream?.destroy();
    await Promise.all(servers.map((server) => server.stop(10_000)));
    await admin.raw(`drop database if exists ${name} with (force)`).catch(() => {});
    await admin.destroy();
  }
}

/** An invented day: the four demo rooms, 16 exams each, 30 minutes apart. Answers its exams. */
async function importDay(base: string, session: Session): Promise<BenchExam[]> {
  const table = [EXAM_LIST_HEADER];
  ROOMS.forEach((room, r) => {
    for (let i = 0; i < EXAMS_PER_ROOM; i++) {
      table.push([`PGB-${r}-${i}`, room, hhmm(7 * 60 + i * 30), '20', 'Invented procedure', 'knee', 'none', 'ambulatory', 'no', '']);
    }
  });
  await importDayList(base, session, DAY, table);
  const plan = await fetch(`${base}/api/days/${DAY}/plan`, { headers: { Cookie: session.cookie } });
  return ((await plan.json()) as { rooms: { exams: PlanExam[] }[] }).rooms.flatMap((room) => room.exams.map(({ id, start, version }) => ({ id, start, version, moves: 0 })));
}

/** Moves an exam 5 minutes later, then back, at the version last seen; keeps its new version. Answers whether it was taken. */
async function move(base: string, session: Session, exam: BenchExam): Promise<boolean> {
  const start = new Date(Date.parse(exam.start) + (exam.moves++ % 2 === 0 ? 5 : -5) * 60_000).toISOString();
  const res = await fetch(`${base}/api/exams/${exam.id}`, {
    method: 'PATCH',
    headers: { 'Content-Type': 'application/json', Cookie: session.cookie, 'X-XSRF-TOKEN': session.token },
    body: JSON.stringify({ start, version: exam.version, reason: 'drag' }),
  });
  if (res.status !== 200) {
    await res.text();
    return false;
  }
  // only the moved exam's entry: another move's answer may be older than this exam's own
  const plan = (await res.json()) as { rooms: { exams: PlanExam[] }[] };
  const seen = plan.rooms.flatMap((room) => room.exams).find((e) => e.id === exam.id)!;
  Object.assign(exam, { start: seen.start, version: seen.version });
  return true;
}
