/**
 * Set-up the HTTP benches share: a database seeded as the demo centre, a signed-in session made
 * with plain fetch (cookie jar and XSRF token), and an invented day list imported through the real path.
 */
import { createDb, migrateToLatest } from '../../../server/db';
import { seedDemo, seedReferenceData } from '../../../server/seeding';
import { DEMO_PASSWORD } from '../../../seeds/support/demo-accounts';
import { EXAM_LIST_HEADER, toCsv } from '../../fixtures/exam-lists';

/** A signed-in session: the `Cookie` header to send and the `X-XSRF-TOKEN` for state-changing calls. */
export interface Session {
  cookie: string;
  token: string;
}

/** The demo centre's rooms (invented), the busy day's rooms. */
const ROOMS = ['MR 1', 'MR 2', 'MR 3', 'CT 1'];

/** Minutes after midnight as `HH:MM`. */
export const hhmm = (minute: number) => `${String(Math.floor(minute / 60)).padStart(2, '0')}:${String(minute % 60).padStart(2, '0')}`;

/** Migrates and seeds a database (an SQLite file or a postgres:// URL): reference data and the demo centre, no demo day. */
export async function seedDemoCentre(target: string): Promise<void> {
  const db = createDb(target);
  try {
    await migrateToLatest(db);
    await seedReferenceData(db);
    await seedDemo(db, new Date(), { day: false });
  } finally {
    await db.destroy();
  }
}

/** Signs in as the demo `charge` account through `POST /api/auth/login`, after a first request for the XSRF cookie. */
export async function signIn(base: string): Promise<Session> {
  const jar = new Map<string, string>();
  const keep = (res: Response) => {
    for (const c of res.headers.getSetCookie()) {
      const [pair] = c.split(';');
      const at = pair!.indexOf('=');
      jar.set(pair!.slice(0, at), pair!.slice(at + 1));
    }
  };
  const cookie = () => [...jar].map(([k, v]) => `${k}=${v}`).join('; ');
  keep(await fetch(`${base}/api/health`));
  const login = await fetch(`${base}/api/auth/login`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json', Cookie: cookie(), 'X-XSRF-TOKEN': decodeURIComponent(jar.get('XSRF-TOKEN') ?? '') },
    body: JSON.stringify({ username: 'charge', password: DEMO_PASSWORD }),
  });
  if (login.status !== 200) throw new Error(`bench sign-in failed: ${login.status}`);
  keep(login);
  return { cookie: cookie(), token: decodeURIComponent(jar.get('XSRF-TOKEN') ?? '') };
}

/** Imports a table (header first) as the list of `day` through `POST /api/days/:date/exams/import`; throws on a refusal. */
export async function importDayList(base: string, session: Session, day: string, table: string[][]): Promise<void> {
  const form = new FormData();
  form.append('file', new Blob([toCsv(table)], { type: 'text/csv' }), 'bench.csv');
  const res = await fetch(`${base}/api/days/${day}/exams/import`, { method: 'POST', headers: { Cookie: session.cookie, 'X-XSRF-TOKEN': session.token }, body: form });
  if (res.status !== 200) throw new Error(`bench import failed: ${res.status} ${await res.text()}`);
}

/**
 * The invented busy day of the plan benches: the four demo rooms, ten exams each, some gaps tight
 * (40 exams give a plan body of about 85 kB, the size of a full demo day).
 */
export function busyDayTable(): string[][] {
  const table = [EXAM_LIST_HEADER];
  ROOMS.forEach((room, r) => {
    for (let i = 0; i < 10; i++) {
      const minute = 7 * 60 + i * (room === 'CT 1' ? 20 : 28) + (i % 3);
      table.push([`BENCH-${r}-${i}`, room, hhmm(minute), room === 'CT 1' ? '10' : '20', 'Invented procedure', 'knee', i === 7 ? 'contact' : 'none', 'ambulatory', 'no', '']);
    }
  });
  return table;
}
