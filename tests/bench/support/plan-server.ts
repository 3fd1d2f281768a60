/**
 * A server for the plan benchmark, run as a child process so the load generator does not share
 * its event loop: `tsx plan-server.ts turnwise|bare [plan.json]`. Turnwise mode serves the real
 * app on a temp SQLite file with the demo centre and a busy invented day; bare mode serves a
 * given JSON body from a plain Express 5 app, the yardstick. Prints `READY <port>` when listening.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { AddressInfo } from 'node:net';
import express from 'express';
import { createApp } from '../../../server/app';
import { createDb, migrateToLatest } from '../../../server/db';
import { seedDemo, seedReferenceData } from '../../../server/seeding';

async function main(): Promise<void> {
  const [mode, bodyFile] = process.argv.slice(2);
  let app: express.Express;
  if (mode === 'bare') {
    const body = JSON.parse(fs.readFileSync(bodyFile!, 'utf8'));
    app = express();
    app.get('/api/days/:date/plan', (_req, res) => {
      res.json(body);
    });
  } else {
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'turnwise-bench-plan-'));
    const db = createDb(path.join(dir, 'bench.sqlite'));
    await migrateToLatest(db);
    await seedReferenceData(db);
    await seedDemo(db, new Date(), { day: false });
    app = createApp({ db, sessionSecret: 'bench', demo: true, logError: console.error });
    process.on('exit', () => fs.rmSync(dir, { recursive: true, force: true }));
  }
  const server = app.listen(0, '127.0.0.1', () => {
    console.log(`READY ${(server.address() as AddressInfo).port}`);
  });
  process.on('SIGTERM', () => {
    server.closeAllConnections();
    server.close(() => process.exit(0));
  });
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
