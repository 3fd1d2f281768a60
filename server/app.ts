import path from 'node:path';
import fs from 'node:fs';
import express, { type Express } from 'express';
import session from 'express-session';
import cookieParser from 'cookie-parser';
import compression from 'compression';
import helmet from 'helmet';
import { Passport } from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import type { Knex } from 'knex';
import { pinoHttp } from 'pino-http';
import type { Clock } from './clock';
import { systemClock } from './clock';
import { NotFoundError } from './errors';
import { errorHandler } from './middleware/error-handler';
import { xsrfTokens } from './middleware/xsrf';
import { passwordGate } from './middleware/password-gate';
import { authenticate, findActiveUser } from './services/users';
import type { SignInLimits } from './routes/auth';
import { apiRoutes } from './routes/api';
import { DayEvents } from './services/day-events';
import { dayEventsFor } from './services/day-events-postgres';
import { SessionStore } from './services/session-store';
import { createWorkerPool, type WorkerPool } from './workers/pool';
import { createFixesPool, type FixesPool } from './workers/fixes-pool';
import { createDayFitPool, type DayFitPool } from './workers/day-fit-pool';
import { createMailer, type Mailer } from './services/mail/mailer';
import type { SmtpSettings } from './services/mail/smtp-settings';
import { startNoticeLoop } from './services/notices/loop';
import type { AddressInfo } from 'node:net';
import { startHl7Feed, type Hl7FeedOptions } from './services/hl7/feed';
import type { MllpListener } from './services/hl7/mllp-listener';

export interface AppDeps {
  db: Knex;
  sessionSecret: string;
  clock?: Clock;
  /** Live-update fan-out; one per app unless a test shares one. */
  events?: DayEvents;
  /** Worker threads for work that grows with its input (reading uploaded files); made per app if omitted. */
  workers?: WorkerPool;
  /** Worker threads for suggested fixes; made per app if omitted. */
  fixesPool?: FixesPool;
  /** The worker thread that makes a day fit; made per app if omitted. */
  dayFitPool?: DayFitPool;
  /** Demo mode lists the demo accounts on the sign-in page. */
  demo?: boolean;
  /** Production: Secure cookies behind a TLS-terminating proxy. */
  production?: boolean;
  /** Failed sign-ins allowed per 15 minutes; default 10 per account, 30 per address. */
  signInLimits?: Partial<SignInLimits>;
  /** Proxies whose X-Forwarded-For is believed (TRUST_PROXY); none by default. */
  trustProxy?: string[];
  /** Folder of the built client; omitted in API-only tests. */
  clientDir?: string;
  /** Request logging; off in tests. */
  logRequests?: boolean;
  logError?: (err: unknown) => void;
  /**
   * E-mail notices go to this SMTP host. Without one, demo mode, development and tests start the
   * local demo mail server (on first send); production sends nothing.
   */
  smtp?: SmtpSettings | null;
  /** The address people open Turnwise at, for links in notices (PUBLIC_URL). */
  publicUrl?: string;
  /** Run the notice sender loop (main.ts); tests drive `sendDue` / `runNotices` themselves. */
  sendNotices?: boolean;
  /** The HL7 booking feed's MLLP listener (HL7_PORT); off when omitted. Port 0 picks a free one. */
  hl7?: Hl7FeedOptions | null;
}

/** Builds the Express app without listening, so tests drive it with supertest. */
export function createApp(deps: AppDeps): Express {
  const clock = deps.clock ?? systemClock;
  const logError = deps.logError ?? ((err: unknown) => console.error(err));
  const ownEvents = deps.events ? null : dayEventsFor(deps.db, logError);
  const events = deps.events ?? ownEvents!;
  const workers = deps.workers ?? createWorkerPool();
  const fixesPool = deps.fixesPool ?? createFixesPool();
  const dayFitPool = deps.dayFitPool ?? createDayFitPool();
  const production = deps.production ?? false;
  const mailer: Mailer = createMailer({ db: deps.db, smtp: deps.smtp ?? null, demoServer: !production || Boolean(deps.demo), now: () => clock.now() });
  const noticeContext = { publicUrl: (deps.publicUrl ?? 'http://localhost:3000').replace(/\/+$/, ''), secret: deps.sessionSecret };
  const stopNotices = deps.sendNotices ? startNoticeLoop(deps.db, mailer, noticeContext, clock, logError) : async () => {};
  const hl7 = deps.hl7 ? startHl7Feed({ db: deps.db, clock, events, logError }, deps.hl7) : null;
  const app = express();
  app.locals['mailer'] = mailer;
  app.locals['hl7'] = hl7;
  app.disable('x-powered-by');
  // req.ip (and so the sign-in throttle) believes X-Forwarded-For only from these proxies
  app.set('trust proxy', deps.trustProxy?.length ? deps.trustProxy : false);

  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          // Angular Material sets inline styles; nothing else inline is allowed.
          'style-src': ["'self'", "'unsafe-inline'"],
          'img-src': ["'self'", 'data:'],
          'font-src': ["'self'"],
          'connect-src': ["'self'"],
          'upgrade-insecure-requests': production ? [] : null,
        },
      },
      hsts: production,
    }),
  );
  // Event streams must reach the browser at once, so they are never buffered by gzip.
  app.use(compression({ filter: (req, res) => !String(res.getHeader('Content-Type') ?? '').startsWith('text/event-stream') && compression.filter(req, res) }));
  if (deps.logRequests) {
    // One short line per API call; headers are left out so session cookies never reach the log.
    app.use(
      pinoHttp({
        autoLogging: { ignore: (req) => !req.url?.startsWith('/api') },
        serializers: {
          req: (req: { method: string; url: string }) => ({ method: req.method, url: req.url }),
          res: (res: { statusCode: number }) => ({ status: res.statusCode }),
        },
      }),
    );
  }

  const passport = new Passport();
  passport.use(
    new LocalStrategy((username, password, done) => {
      authenticate(deps.db, username, password).then((user) => done(null, user ?? false), done);
    }),
  );
  passport.serializeUser<number>((user, done) => done(null, user.id));
  passport.deserializeUser<number>((id, done) => {
    findActiveUser(deps.db, id).then((user) => done(null, user ?? false), done);
  });

  const SESSION_COOKIE = 'turnwise.sid';
  const xsrf = xsrfTokens({ secret: deps.sessionSecret, secure: production });
  // Expired sessions are swept in production only; closeApp stops the sweep before the database closes.
  const sessionStore = new SessionStore({ knex: deps.db, createTable: false, cleanupInterval: production ? 60_000 : 0 });
  const api = express.Router();
  // set first so that a route (the plan, with its ETag) can replace it
  api.use((_req, res, next) => {
    res.set('Cache-Control', 'no-store');
    next();
  });
  api.use(express.json({ limit: '100kb' }));
  api.use(cookieParser());
  api.use(
    session({
      name: SESSION_COOKIE,
      secret: deps.sessionSecret,
      store: sessionStore,
      resave: false,
      saveUninitialized: false,
      rolling: true,
      cookie: { httpOnly: true, sameSite: 'lax', secure: production, maxAge: 12 * 60 * 60 * 1000 },
    }),
  );
  api.use(passport.initialize());
  api.use(passport.session());
  api.use(xsrf.middleware);
  api.use(passwordGate);

  api.use(
    apiRoutes({
      db: deps.db,
      clock,
      events,
      workers,
      fixesPool,
      dayFitPool,
      demo: Boolean(deps.demo),
      notices: { mailer, context: noticeContext },
      hl7,
      auth: {
        passport,
        limits: { perAccount: 10, perAddress: 30, ...deps.signInLimits },
        secret: deps.sessionSecret,
        secure: production,
        xsrf,
        sessionCookie: SESSION_COOKIE,
      },
    }),
  );
  api.use(() => {
    throw new NotFoundError('No such API route.');
  });
  app.use('/api', api);

  if (deps.clientDir && fs.existsSync(path.join(deps.clientDir, 'index.html'))) {
    const clientDir = deps.clientDir;
    app.use(express.static(clientDir, { index: false, maxAge: '1h' }));
    app.get('/{*splat}', (_req, res) => res.sendFile(path.join(clientDir, 'index.html')));
  }

  app.use(errorHandler(logError));
  // Whoever ends the app (main.ts on a signal, a test's afterAll) closes its worker threads.
  app.locals['close'] = async () => {
    await sessionStore.close();
    await stopNotices();
    await Promise.all([workers.close(), fixesPool.close(), dayFitPool.close(), mailer.close(), hl7?.close(), ownEvents?.close?.()]);
  };
  return app;
}

/** The app's e-mail way out (tests send through it, or read the demo mail server's port). */
export function appMailer(app: Express): Mailer {
  return app.locals['mailer'] as Mailer;
}

/** Where the app's HL7 booking feed listens; null when it is off or could not bind. */
export function appHl7Address(app: Express): Promise<AddressInfo | null> {
  const hl7 = app.locals['hl7'] as MllpListener | null;
  return hl7 ? hl7.address() : Promise.resolve(null);
}

/** Ends what an app started besides its routes (worker threads, the notice loop, the demo mail server, the HL7 listener); the caller closes the server and database. */
export function closeApp(app: Express): Promise<void> {
  const close = app.locals['close'] as (() => Promise<void>) | undefined;
  return close ? close() : Promise.resolve();
}
