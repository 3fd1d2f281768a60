import { appHl7Address, appMailer, closeApp, createApp } from './app';
import { readConfig } from './config';
import { createDb, describeDatabase, migrateToLatest } from './db';
import { seedDemo, seedReferenceData } from './seeding';
import { systemClock } from './clock';
import { listDemoAccounts } from './services/demo-accounts';
import { smtpFromEnv } from './services/mail/smtp-settings';

/** How long a stopping server lets running requests finish. */
const STOP_GRACE_MS = 5000;

async function main(): Promise<void> {
  const config = readConfig();
  const db = createDb(config.databaseUrl ?? config.databaseFile);
  await migrateToLatest(db);
  await seedReferenceData(db);
  // the demo day is played forward to now, so the board and log start from a believable state
  if (config.demo) await seedDemo(db, systemClock.now(), { history: true });

  const app = createApp({
    db,
    sessionSecret: config.sessionSecret,
    demo: config.demo,
    production: config.production,
    trustProxy: config.trustProxy,
    clientDir: config.clientDir,
    logRequests: true,
    smtp: smtpFromEnv(),
    publicUrl: process.env['PUBLIC_URL'] || `http://localhost:${config.port}`,
    sendNotices: true,
    hl7: config.hl7,
  });
  const delivery = appMailer(app).delivery;
  if (delivery === 'off') console.warn('E-mail notices are off: no SMTP_URL or SMTP_HOST is set, so nothing is sent (README, E-mail notices).');
  else if (delivery === 'demo-server') console.log('E-mail notices go to the local demo mail server; admins read them in the Outbox.');
  if (config.production && config.trustProxy.length === 0) {
    console.warn('TRUST_PROXY is unset: X-Forwarded-For is ignored. Behind a TLS-terminating proxy, set it to the proxy address (README, Security).');
  }
  if (config.hl7) {
    void appHl7Address(app).then((at) => {
      if (at) console.log(`HL7 booking feed (MLLP) listening on ${at.address}:${at.port}`);
      // on PostgreSQL one process listens (README, Running more than one server)
      else if (config.databaseUrl) console.log('HL7 booking feed: another server process listens; this one takes over within seconds should it stop.');
    });
  }
  const demoAccounts = config.demo ? await listDemoAccounts(db) : null;
  const server = app.listen(config.port, () => {
    console.log(`Turnwise is ready at http://localhost:${config.port} (${config.demo ? 'demo mode' : 'production'}; database ${describeDatabase(config.databaseUrl ?? config.databaseFile)})`);
    if (demoAccounts) {
      console.log(`Demo accounts (password "${demoAccounts.password}"): ${demoAccounts.accounts.map((a) => `${a.username} (${a.role})`).join(', ')}`);
    }
  });
  const stop = () => {
    // the pool closes after the app: a notice pass under way still needs it to finish
    server.close(() => closeApp(app).then(() => db.destroy()).then(() => process.exit(0)));
    // open event streams never end by themselves: cut them (and any request still running) after
    // a grace; browsers reconnect, behind a proxy to another server process
    setTimeout(() => server.closeAllConnections(), STOP_GRACE_MS).unref();
  };
  process.on('SIGINT', stop);
  process.on('SIGTERM', stop);
}

main().catch((err) => {
  console.error(err instanceof Error ? err.message : err);
  process.exit(1);
});
