import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { readConfig } from './config';

describe('readConfig', () => {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'turnwise-config-'));
  afterAll(() => fs.rmSync(dir, { recursive: true, force: true }));

  it('returns the documented defaults in demo mode', () => {
    const config = readConfig({ DATABASE_FILE: path.join(dir, 'a', 'db.sqlite') });
    expect(config).toMatchObject({ port: 3000, production: false, demo: true });
  });

  it('generates a session secret once in demo mode and keeps it next to the database', () => {
    const env = { DATABASE_FILE: path.join(dir, 'b', 'db.sqlite') };
    const first = readConfig(env).sessionSecret;
    expect(first).toMatch(/^[0-9a-f]{64}$/);
    expect(readConfig(env).sessionSecret).toBe(first);
  });

  it('refuses to start in production without SESSION_SECRET, and seeds no demo there', () => {
    expect(() => readConfig({ NODE_ENV: 'production' })).toThrow(/SESSION_SECRET/);
    expect(readConfig({ NODE_ENV: 'production', SESSION_SECRET: 'x'.repeat(32) })).toMatchObject({ production: true, demo: false });
  });

  it('trusts no proxy unless TRUST_PROXY lists them, comma-separated', () => {
    const base = { DATABASE_FILE: path.join(dir, 'c', 'db.sqlite') };
    expect(readConfig(base).trustProxy).toEqual([]);
    expect(readConfig({ ...base, TRUST_PROXY: '' }).trustProxy).toEqual([]);
    expect(readConfig({ ...base, TRUST_PROXY: ' 10.0.0.5, 192.168.0.0/16 ,loopback,' }).trustProxy).toEqual(['10.0.0.5', '192.168.0.0/16', 'loopback']);
  });
});
