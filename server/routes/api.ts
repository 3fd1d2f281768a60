import { Router } from 'express';
import type { Knex } from 'knex';
import type { Clock } from '../clock';
import type { DayEvents } from '../services/day-events';
import type { WorkerPool } from '../workers/pool';
import type { FixesPool } from '../workers/fixes-pool';
import type { DayFitPool } from '../workers/day-fit-pool';
import type { Hl7Feed } from '../services/hl7/feed';
import { authRoutes, type AuthDeps } from './auth';
import { dayChangeRoutes } from './day-changes';
import { dayFitRoutes, examPinRoutes } from './day-fit';
import { dayRoutes } from './days';
import { examRoutes } from './exams';
import { boardRoutes } from './board';
import { calendarFeedRoutes, calendarTokenRoutes } from './calendar';
import { examProgressRoutes } from './exam-progress';
import { logRoutes } from './log';
import { shiftTaskRoutes } from './shift-tasks';
import { turnoverRoutes } from './turnovers';
import { auditRoutes } from './audit';
import { equipmentRoutes } from './equipment';
import { hl7Routes } from './hl7';
import { productRoutes } from './products';
import { profileRoutes } from './profile';
import { noticePreferenceRoutes, outboxRoutes, unsubscribeRoutes, type NoticeDeps } from './notices';
import { protocolRoutes, setupRoutes } from './protocols';
import { reportRoutes } from './reports';
import { roomRoutes } from './rooms';
import { roomSetupRoutes } from './room-setup';
import { dayRosterRoutes, weeklyRosterRoutes } from './roster';
import { settingsRoutes } from './settings';
import { userRoutes } from './users';

export interface ApiDeps {
  db: Knex;
  clock: Clock;
  events: DayEvents;
  workers: WorkerPool;
  fixesPool: FixesPool;
  /** The worker thread that makes a day fit. */
  dayFitPool: DayFitPool;
  demo: boolean;
  /** E-mail notices: where they go and what their links need. */
  notices: NoticeDeps;
  /** The HL7 booking feed's listener, when on (its interface log says where it listens). */
  hl7?: Hl7Feed | null;
  /** What sign-in needs from the app (sessions, XSRF, throttling). */
  auth: Omit<AuthDeps, 'db' | 'demo'>;
}

/**
 * Every router of the API, mounted in one place (app.ts adds only the middleware around them):
 * health and sign-in; rooms and settings; days (plan, import, history, fixes, events) and exams
 * (moves, staffing); the day itself: board, arrivals, turnovers, shift tasks and the cleaning
 * log; Setup and each user's own profile.
 */
export function apiRoutes(deps: ApiDeps): Router {
  const router = Router();
  router.get('/health', (_req, res) => {
    res.json({ status: 'ok', demo: deps.demo, time: deps.clock.now().toISOString() });
  });
  router.use('/auth', authRoutes({ ...deps.auth, db: deps.db, demo: deps.demo }));
  router.use('/rooms', roomRoutes(deps));
  router.use('/settings', settingsRoutes(deps));
  router.use('/days', dayRoutes(deps), dayChangeRoutes(deps), dayRosterRoutes(deps), dayFitRoutes(deps));
  router.use('/exams', examRoutes(deps), examProgressRoutes(deps), examPinRoutes(deps));
  // Rooms now, checklists, the cleaning log and shift tasks
  router.use(boardRoutes(deps));
  router.use('/turnovers', turnoverRoutes(deps));
  router.use('/shift-tasks', shiftTaskRoutes(deps));
  router.use(logRoutes(deps));
  router.use('/reports', reportRoutes(deps));
  // Setup (admin) and each user's own profile
  router.use('/rooms', roomSetupRoutes(deps));
  router.use('/equipment', equipmentRoutes(deps));
  router.use('/products', productRoutes(deps));
  router.use('/protocols', protocolRoutes(deps));
  router.use('/setup', setupRoutes(deps));
  router.use('/roster/weekly', weeklyRosterRoutes(deps));
  router.use('/users', userRoutes(deps));
  router.use('/profile/notices', noticePreferenceRoutes(deps));
  router.use('/profile/calendar', calendarTokenRoutes({ ...deps, calendar: deps.notices.context }));
  router.use('/profile', profileRoutes(deps));
  router.use('/audit', auditRoutes(deps));
  // E-mail notices: the Outbox (admin) and the unsubscribe link (no sign-in)
  router.use('/outbox', outboxRoutes(deps));
  router.use('/notices', unsubscribeRoutes(deps));
  // The HL7 booking feed's interface log (admin)
  router.use('/hl7', hl7Routes(deps));
  // Calendar feeds: fetched by calendar apps with the token in the path (no sign-in)
  router.use('/calendar', calendarFeedRoutes({ ...deps, calendar: deps.notices.context }));
  return router;
}
