import fs from 'node:fs';
import path from 'node:path';
import { randomBytes } from 'node:crypto';

export interface ServerConfig {
  port: number;
  databaseFile: string;
  /** DATABASE_URL (`postgres://…`): PostgreSQL, for more than one server process; null: the SQLite file. */
  databaseUrl: string | null;
  sessionSecret: string;
  production: boolean;
  demo: boolean;
  clientDir: string;
  /**
   * Proxies whose X-Forwarded-For is believed (addresses, subnets or Express's names such as
   * `loopback`); empty trusts none, so the sign-in throttle keys on the connecting address.
   */
  trustProxy: string[];
  /**
   * The HL7 booking feed's MLLP listener (HL7_PORT, HL7_HOST); null: off. Off by default, on in
   * demo mode at 127.0.0.1:2575; HL7_PORT=off turns it off there too.
   */
  hl7: { port: number; host: string } | null;
}

/**
 * Reads configuration from the environment. Demo mode (the default outside production) keeps a
 * generated session secret next to the database so sessions survive restarts; production must
 * set SESSION_SECRET.
 */
export function readConfig(env: NodeJS.ProcessEnv = process.env): ServerConfig {
  const production = env['NODE_ENV'] === 'production';
  const demo = env['TURNWISE_DEMO'] ? env['TURNWISE_DEMO'] === 'true' : !production;
  const databaseFile = env['DATABASE_FILE'] ?? 'data/turnwise.sqlite';
  let sessionSecret = env['SESSION_SECRET'];
  if (!sessionSecret) {
    if (production) throw new Error('SESSION_SECRET must be set when NODE_ENV=production.');
    sessionSecret = storedDemoSecret(path.join(path.dirname(path.resolve(databaseFile)), 'session-secret'));
  }
  return {
    port: Number(env['PORT'] ?? 3000),
    databaseFile,
    databaseUrl: databaseUrl(env),
    sessionSecret,
    production,
    demo,
    clientDir: env['CLIENT_DIR'] ?? path.resolve(__dirname, '..', 'dist', 'turnwise', 'browser'),
    trustProxy: (env['TRUST_PROXY'] ?? '').split(',').map((entry) => entry.trim()).filter(Boolean),
    hl7: hl7Listener(env, demo),
  };
}

function databaseUrl(env: NodeJS.ProcessEnv): string | null {
  const url = env['DATABASE_URL']?.trim();
  if (!url) return null;
  if (!/^postgres(ql)?:\/\//i.test(url)) throw new Error('DATABASE_URL must be a postgres:// URL; leave it unset to use the SQLite file (DATABASE_FILE).');
  return url;
}

function hl7Listener(env: NodeJS.ProcessEnv, demo: boolean): ServerConfig['hl7'] {
  const port = env['HL7_PORT']?.trim();
  const host = env['HL7_HOST']?.trim() || (demo ? '127.0.0.1' : '0.0.0.0');
  if (port === 'off') return null;
  if (!port) return demo ? { port: 2575, host } : null;
  const n = Number(port);
  if (!Number.isInteger(n) || n < 0 || n > 65535) throw new Error(`HL7_PORT must be a port number (0–65535) or off, not "${port}".`);
  return { port: n, host };
}

function storedDemoSecret(file: string): string {
  if (fs.existsSync(file)) return fs.readFileSync(file, 'utf8').trim();
  fs.mkdirSync(path.dirname(file), { recursive: true });
  const secret = randomBytes(32).toString('hex');
  fs.writeFileSync(file, secret, { mode: 0o600 });
  return secret;
}
