import { spawn, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import http from 'node:http';
import os from 'node:os';
import path from 'node:path';
import autocannon from 'autocannon';
import { busyDayTable, importDayList, signIn, type Session } from './support/http-session';

const DAY = '2027-03-10';
const SECONDS = 5;
const STREAMS = 200;
const MOVES = 5;

/**
 * The day plan served by Turnwise against a bare Express 5 app serving the same body, side by
 * side at 10 and 100 connections (target: ≥ 50 % of the bare throughput, p99 < 50 ms, no
 * errors), then how long a move takes to reach 200 open event streams.
 */
export async function benchPlan(): Promise<string[]> {
  const lines: string[] = [];
  const turnwise = await startChild(['turnwise']);
  let bare: Child | undefined;
  const bodyFile = path.join(fs.mkdtempSync(path.join(os.tmpdir(), 'turnwise-bench-body-')), 'plan.json');
  try {
    const session = await signIn(turnwise.base);
    await importDayList(turnwise.base, session, DAY, busyDayTable());
    const plan = await get(turnwise.base, `/api/days/${DAY}/plan`, session.cookie);
    fs.writeFileSync(bodyFile, plan.body);
    lines.push(`plan: ${(plan.body.length / 1024).toFixed(1)} kB body, ${JSON.parse(plan.body).rooms.reduce((n: number, r: { exams: unknown[] }) => n + r.exams.length, 0)} exams`);
    bare = await startChild(['bare', bodyFile]);

    for (const connections of [10, 100]) {
      const ours = await load(turnwise.base, connections, session.cookie);
      const theirs = await load(bare.base, connections);
      const share = (100 * ours.requests.average) / theirs.requests.average;
      lines.push(
        `plan @${connections} connections: Turnwise ${ours.requests.average.toFixed(0)} req/s (p99 ${ours.latency.p99} ms, ${ours.errors + ours.timeouts + ours.non2xx} errors) ` +
          `vs bare Express ${theirs.requests.average.toFixed(0)} req/s (p99 ${theirs.latency.p99} ms) = ${share.toFixed(0)} %` +
          ` (target ≥ 50 %, p99 < 50 ms${share >= 50 && ours.latency.p99 < 50 && ours.errors + ours.non2xx === 0 ? '' : ', OFF TARGET'})`,
      );
    }
    const revalidate = await load(turnwise.base, 10, session.cookie, { 'If-None-Match': plan.etag });
    lines.push(`plan revalidation (304) @10 connections: ${revalidate.requests.average.toFixed(0)} req/s, p99 ${revalidate.latency.p99} ms`);
    lines.push(...(await streams(turnwise.base, session)));
  } finally {
    await turnwise.stop();
    await bare?.stop();
    fs.rmSync(path.dirname(bodyFile), { recursive: true, force: true });
  }
  return lines;
}

interface Child {
  base: string;
  stop(): Promise<void>;
}

function startChild(args: string[]): Promise<Child> {
  const child: ChildProcess = spawn(process.execPath, ['--import', 'tsx', path.join(__dirname, 'support', 'plan-server.ts'), ...args], {
    stdio: ['ignore', 'pipe', 'inherit'],
  });
  return new Promise((resolve, reject) => {
    child.once('exit', (code) => reject(new Error(`bench server exited with ${code}`)));
    child.stdout!.on('data', (chunk: Buffer) => {
      const port = /READY (\d+)/.exec(chunk.toString())?.[1];
      if (!port) return;
      resolve({
        base: `http://127.0.0.1:${port}`,
        stop: () =>
          new Promise((done) => {
            child.removeAllListeners('exit');
            child.once('exit', () => done());
            child.kill('SIGTERM');
          }),
      });
    });
  });
}

async function get(base: string, url: string, cookie: string): Promise<{ body: string; etag: string }> {
  const res = await fetch(`${base}${url}`, { headers: { Cookie: cookie } });
  return { body: await res.text(), etag: res.headers.get('etag') ?? '' };
}

function load(base: string, connections: number, cookie?: string, headers: Record<string, string> = {}): Promise<autocannon.Result> {
  return autocannon({
    url: `${base}/api/days/${DAY}/plan`,
    connections,
    duration: SECONDS,
    headers: { ...(cookie ? { Cookie: cookie } : {}), ...headers },
  });
}

/** Opens 200 event streams, moves a slot, and times until every stream has heard of it. */
async function streams(base: string, session: Session): Promise<string[]> {
  const agent = new http.Agent({ keepAlive: true, maxSockets: STREAMS + 10 });
  const open: http.ClientRequest[] = [];
  const waiting = new Set<() => void>();
  try {
    await Promise.all(
      Array.from({ length: STREAMS }, () =>
        new Promise<void>((ready, fail) => {
          const req = http.get(`${base}/api/days/${DAY}/events`, { agent, headers: { Cookie: session.cookie } }, (res) => {
            res.setEncoding('utf8');
            res.on('data', (text: string) => {
              if (text.includes('event: change')) for (const hear of [...waiting]) hear === undefined || hear();
              if (text.includes('retry:')) ready();
            });
          });
          req.on('error', fail);
          open.push(req);
        }),
      ),
    );
    const times: number[] = [];
    for (let m = 0; m < MOVES; m++) {
      const plan = JSON.parse((await get(base, `/api/days/${DAY}/plan`, session.cookie)).body);
      const exam = plan.rooms[0].exams.at(-1);
      const heard = new Promise<void>((all) => {
        let count = 0;
        const hear = () => {
          count += 1;
          if (count === STREAMS) {
            waiting.delete(hear);
            all();
          }
        };
        waiting.add(hear);
      });
      const t0 = performance.now();
      const start = new Date(Date.parse(exam.start) + (m % 2 === 0 ? 5 : -5) * 60_000).toISOString();
      const res = await fetch(`${base}/api/exams/${exam.id}`, {
        method: 'PATCH',
        headers: { 'Content-Type': 'application/json', Cookie: session.cookie, 'X-XSRF-TOKEN': session.token },
        body: JSON.stringify({ start, version: exam.version, reason: 'drag' }),
      });
      if (res.status !== 200) throw new Error(`bench move failed: ${res.status} ${await res.text()}`);
      await heard;
      times.push(performance.now() - t0);
    }
    times.sort((a, b) => a - b);
    return [`event streams: a move reaches all ${STREAMS} open streams in ${times[Math.floor(times.length / 2)]!.toFixed(0)} ms (median of ${MOVES}; max ${times.at(-1)!.toFixed(0)} ms), request included`];
  } finally {
    for (const req of open) req.destroy();
    agent.destroy();
  }
}
