import { spawn, type ChildProcess } from 'node:child_process';
import http from 'node:http';
import net from 'node:net';
import path from 'node:path';

const ROOT = path.resolve(__dirname, '..', '..');
/** Kept of a server's output, for the message when it does not start. */
const OUTPUT_KEPT = 20_000;

export interface ServerProcess {
  /** `http://127.0.0.1:<port>` */
  readonly url: string;
  /** Its PostgreSQL application_name, to find its connections in pg_stat_activity. */
  readonly appName: string;
  /** The end of what it printed. */
  output(): string;
  /** SIGTERM, then SIGKILL if it has not exited within `graceMs`; answers, once it has exited, which ended it. */
  stop(graceMs?: number): Promise<'exited' | 'killed'>;
}

const running = new Set<ChildProcess>();
// should a test file end without its afterAll, no server outlives the jest worker
process.once('exit', () => running.forEach((child) => child.kill('SIGKILL')));

/** A free loopback port: the system picks one for a moment, and it is handed on. */
export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const probe = net.createServer();
    probe.once('error', reject);
    probe.listen(0, '127.0.0.1', () => {
      const { port } = probe.address() as net.AddressInfo;
      probe.close(() => resolve(port));
    });
  });
}

/**
 * A real Turnwise server process (`node --import tsx server/main.ts`) on `databaseUrl`, on a free
 * port, with the HL7 listener off and no demo seed (the database is expected to hold what the
 * caller needs), resolved once `GET /api/health` answers. Rejects, with the server's output, if it
 * exits first or does not answer within `readyMs`.
 */
export async function startServerProcess(options: { databaseUrl: string; appName: string; sessionSecret: string; env?: Record<string, string>; readyMs?: number }): Promise<ServerProcess> {
  const port = await freePort();
  const url = `http://127.0.0.1:${port}`;
  const env: NodeJS.ProcessEnv = { ...process.env };
  for (const key of Object.keys(env)) if (key.startsWith('SMTP_')) delete env[key];
  Object.assign(env, {
    PORT: String(port),
    DATABASE_URL: options.databaseUrl,
    PGAPPNAME: options.appName,
    SESSION_SECRET: options.sessionSecret,
    TURNWISE_DEMO: 'false',
    HL7_PORT: 'off',
    CLIENT_DIR: path.join(ROOT, 'tests', 'no-client'),
    ...options.env,
  });
  const child = spawn(process.execPath, ['--import', 'tsx', 'server/main.ts'], { cwd: ROOT, env, stdio: ['ignore', 'pipe', 'pipe'] });
  running.add(child);
  let output = '';
  const keep = (chunk: Buffer) => {
    output = (output + chunk.toString('utf8')).slice(-OUTPUT_KEPT);
  };
  child.stdout!.on('data', keep);
  child.stderr!.on('data', keep);
  const exited = new Promise<void>((resolve) => child.once('exit', () => resolve()));
  void exited.then(() => running.delete(child));

  const stop = async (graceMs = 10_000): Promise<'exited' | 'killed'> => {
    if (child.exitCode !== null || child.signalCode !== null) return child.signalCode === 'SIGKILL' ? 'killed' : 'exited';
    child.kill('SIGTERM');
    let timer: NodeJS.Timeout | undefined;
    const late = new Promise<boolean>((resolve) => (timer = setTimeout(() => resolve(true), graceMs)));
    const killed = await Promise.race([exited.then(() => false), late]);
    if (killed) child.kill('SIGKILL');
    clearTimeout(timer);
    await exited;
    return killed ? 'killed' : 'exited';
  };

  const server: ServerProcess = { url, appName: options.appName, output: () => output, stop };
  const deadline = Date.now() + (options.readyMs ?? 60_000);
  let gone = false;
  void exited.then(() => (gone = true));
  for (;;) {
    if (gone) throw new Error(`The server ${options.appName} exited before it answered:\n${output}`);
    if (Date.now() > deadline) {
      await stop(2000);
      throw new Error(`The server ${options.appName} did not answer on ${url} in time:\n${output}`);
    }
    if (await answers(`${url}/api/health`)) return server;
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
}

/** Whether a GET answers 200; on a connection of its own, closed after (nothing kept alive). */
function answers(url: string): Promise<boolean> {
  return new Promise((resolve) => {
    const req = http.get(url, { agent: false }, (res) => {
      res.resume();
      resolve(res.statusCode === 200);
    });
    req.setTimeout(5000, () => req.destroy());
    req.once('error', () => resolve(false));
  });
}
