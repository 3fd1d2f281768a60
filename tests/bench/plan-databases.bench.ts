import { spawn } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import autocannon from 'autocannon';
import { createDb } from '../../server/db';
import { databaseUrl, testDatabaseUrl } from '../api/pg-databases';
import { startServerProcess, type ServerProcess } from '../support/server-process';
import { busyDayTable, importDayList, seedDemoCentre, signIn, type Session } from './support/http-session';

const DAY = '2027-03-10';
const PLAN = `/api/days/${DAY}/plan`;
/** Load before each setup's rows, at the most connections, not counted. */
const WARM_UP_SECONDS = 4;
const MEASURED_SECONDS = 8;
const CONNECTIONS = [20, 100];
interface Row {
  setup: string;
  connections: number;
  result: autocannon.Result;
}

/**
 * `GET /api/days/:date/plan` from real server processes (`server/main.ts`), side by side: one on
 * SQLite, one on PostgreSQL (straight, then through the proxy alone, for the hop's cost), and two
 * on PostgreSQL behind a round-robin proxy (http-proxy, its own process), each database seeded
 * alike (demo centre, the same invented day) and read with one signed-in session's cookie;
 * autocannon at 20 and 100 connections, 8 s each after a 4 s warm-up (about 2 minutes in all).
 * One table; nothing asserted. PostgreSQL comes from TEST_DATABASE_URL (a fresh database, dropped
 * after); without it only the SQLite rows, and a line saying why.
 */
export async function benchPlanDatabases(): Promise<string[]> {
  const load = os.loadavg()[0]!;
  const rows: Row[] = [];
  const notes: string[] = [];
  let body = '';

  // SQLite ×1: a seeded file in a temp folder; DATABASE_URL emptied so the process opens DATABASE_FILE
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'turnwise-bench-databases-'));
  let sqlite: ServerProcess | undefined;
  try {
    const file = path.join(dir, 'bench.sqlite');
    await seedDemoCentre(file);
    sqlite = await startServerProcess({ databaseUrl: '', appName: 'bench-sqlite', sessionSecret: 'bench', env: { DATABASE_FILE: file } });
    const session = await signIn(sqlite.url);
    body = await importDay(sqlite.url, session);
    rows.push(...(await measure('SQLite ×1', sqlite.url, session)));
  } finally {
    await sqlite?.stop(10_000);
    fs.rmSync(dir, { recursive: true, force: true });
  }

  if (!testDatabaseUrl) {
    notes.push('PostgreSQL ×1 and ×2: skipped (set TEST_DATABASE_URL=postgres://… to a test cluster, as npm run test:pg makes, to measure them)');
  } else {
    const admin = createDb(testDatabaseUrl);
    const name = `tw_bench_plan_${process.pid}`;
    const url = databaseUrl(testDatabaseUrl, name);
    const servers: ServerProcess[] = [];
    const proxies: Proxy[] = [];
    try {
      await admin.raw(`create database ${name} template template0 encoding 'UTF8' lc_collate 'C' lc_ctype 'C'`);
      await seedDemoCentre(url);
      // both start now; B idles (no requests) through the one-process rows
      servers.push(...(await Promise.all(['bench-plan-a', 'bench-plan-b'].map((appName) => startServerProcess({ databaseUrl: url, appName, sessionSecret: 'bench' })))));
      const [a, b] = servers as [ServerProcess, ServerProcess];
      const session = await signIn(a.url);
      await importDay(a.url, session);
      rows.push(...(await measure('PostgreSQL ×1', a.url, session)));

      // the proxy over A alone: what the extra hop costs, apart from what a second process gives
      const single = await startProxy([a.url]);
      proxies.push(single);
      rows.push(...(await measure('PostgreSQL ×1, proxy', single.url, session)));
      await single.stop();

      const pair = await startProxy([a.url, b.url]);
      proxies.push(pair);
      rows.push(...(await measure('PostgreSQL ×2, proxy', pair.url, session)));
      const served = await pair.stop();
      notes.push(`PostgreSQL ×2: the proxy sent ${served.join(' / ')} requests to A / B (round robin, warm-up included)`);
    } finally {
      await Promise.all(proxies.map((proxy) => proxy.stop()));
      await Promise.all(servers.map((server) => server.stop(10_000)));
      await admin.raw(`drop database if exists ${name} with (force)`).catch(() => {});
      await admin.destroy();
    }
  }

  const exams = JSON.parse(body).rooms.reduce((n: number, r: { exams: unknown[] }) => n + r.exams.length, 0);
  const table = [
    ['setup', 'conns', 'req/s', 'p50 ms', 'p99 ms', 'non-2xx', 'errors'],
    ...rows.map((r) => [r.setup, String(r.connections), r.result.requests.average.toFixed(0), String(r.result.latency.p50), String(r.result.latency.p99), String(r.result.non2xx), String(r.result.errors)]),
  ];
  const widths = table[0]!.map((_, c) => Math.max(...table.map((cells) => cells[c]!.length)));
  return [
    `plan by database: GET ${PLAN} (${(body.length / 1024).toFixed(1)} kB, ${exams} exams), real server processes, autocannon ${WARM_UP_SECONDS} s warm-up then ${MEASURED_SECONDS} s per row; ${os.cpus().length} CPUs, load average ${load.toFixed(2)} at start, ${os.loadavg()[0]!.toFixed(2)} at end`,
    ...table.map((cells) => `  ${cells.map((cell, c) => (c === 0 ? cell.padEnd(widths[c]!) : cell.padStart(widths[c]!))).join('  ')}`),
    ...notes.map((note) => `  ${note}`),
  ];
}

/** A warm-up (not kept), then one row per number of connections. */
async function measure(setup: string, base: string, session: Session): Promise<Row[]> {
  await run(base, Math.max(...CONNECTIONS), WARM_UP_SECONDS, session);
  const rows: Row[] = [];
  for (const connections of CONNECTIONS) rows.push({ setup, connections, result: await run(base, connections, MEASURED_SECONDS, session) });
  return rows;
}

function run(base: string, connections: number, duration: number, session: Session): Promise<autocannon.Result> {
  return autocannon({ url: `${base}${PLAN}`, connections, duration, headers: { Cookie: session.cookie } });
}

/** Imports the invented busy day of plan.bench.ts (40 exams, a plan body of about 85 kB, a full demo day); answers its plan's body. */
async function importDay(base: string, session: Session): Promise<string> {
  await importDayList(base, session, DAY, busyDayTable());
  const plan = await fetch(`${base}${PLAN}`, { headers: { Cookie: session.cookie } });
  if (plan.status !== 200) throw new Error(`bench plan failed: ${plan.status}`);
  return plan.text();
}

interface Proxy {
  url: string;
  /** SIGTERM (SIGKILL after 5 s); answers the requests it sent to each target. */
  stop(): Promise<number[]>;
}

/** `support/round-robin-proxy.ts` in a child process over the targets; resolved once it listens. */
function startProxy(targets: string[]): Promise<Proxy> {
  const child = spawn(process.execPath, ['--import', 'tsx', path.join(__dirname, 'support', 'round-robin-proxy.ts'), ...targets], { stdio: ['ignore', 'pipe', 'inherit'] });
  const kill = () => child.kill('SIGKILL');
  process.once('exit', kill);
  let output = '';
  const exited = new Promise<void>((resolve) => child.once('exit', () => resolve()));
  const stop = async (): Promise<number[]> => {
    if (child.exitCode === null && child.signalCode === null) {
      child.kill('SIGTERM');
      const timer = setTimeout(kill, 5000);
      await exited;
      clearTimeout(timer);
    }
    process.removeListener('exit', kill);
    return (/SERVED ([\d ]+)/.exec(output)?.[1] ?? '').trim().split(' ').filter(Boolean).map(Number);
  };
  return new Promise((resolve, reject) => {
    void exited.then(() => reject(new Error(`round-robin proxy exited before it listened:\n${output}`)));
    child.stdout!.on('data', (chunk: Buffer) => {
      output += chunk.toString('utf8');
      const port = /READY (\d+)/.exec(output)?.[1];
      if (port) resolve({ url: `http://127.0.0.1:${port}`, stop });
    });
  });
}
