import { ROLES, type Role } from '../../../shared/api/auth';
import { client, signedIn, startHarness, type Client, type Harness } from '../harness';
import type { KnownIds } from './route-shapes';

export const DAY = '2027-03-10';

/** One app and database for a fuzz describe, a client per role (each signed in once) and one anonymous. */
export interface FuzzApp {
  h: Harness;
  clients: Map<Role | 'anonymous', Client>;
  /** The last unexpected error the server logged (what a 500 hid), shown when a property fails. */
  lastError(): string;
  close(): Promise<void>;
}

/** The demo centre with its demo day, every role signed in, one exam finished (so a turnover and log entries exist). */
export async function startFuzzApp(): Promise<FuzzApp> {
  let last: unknown;
  const h = await startHarness({ seedDay: true, now: '2027-03-10T14:00:00Z', logError: (err) => (last = err) });
  const clients = new Map<Role | 'anonymous', Client>();
  for (const role of ROLES) clients.set(role, await signedIn(h.app, role));
  clients.set('anonymous', await client(h.app));
  const first = await h.db('exams').where({ day: DAY }).orderBy('id').first('id');
  const finished = await clients.get('tech')!.post(`/api/exams/${first.id}/finished`, { earlyReason: 'Fuzz setup' });
  if (finished.status !== 201) throw new Error(`setup: finishing exam ${first.id} answered ${finished.status}`);
  return {
    h,
    clients,
    lastError: () => (last instanceof Error ? (last.stack ?? last.message) : String(last ?? 'none')),
    // the harness ends the app's worker pools (closeApp) and removes the database
    close: () => h.close(),
  };
}

/** Ids that exist now, so part of the fuzz reaches the services behind the checks. */
export async function knownIds(h: Harness): Promise<KnownIds> {
  const ids = async (table: string) => (await h.db(table).orderBy('id').limit(50).pluck('id')) as number[];
  return {
    exams: (await h.db('exams').where({ day: DAY }).orderBy('id').pluck('id')) as number[],
    rooms: await ids('rooms'),
    turnovers: await ids('turnovers'),
    logEntries: await ids('cleaning_log'),
    shiftTasks: await ids('shift_tasks'),
    equipment: await ids('equipment'),
    otherUsers: (await h.db('users').whereNotIn('username', [...ROLES]).orderBy('id').pluck('id')) as number[],
  };
}
