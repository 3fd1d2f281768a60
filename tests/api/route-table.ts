import type { Response } from 'supertest';
import type { Role } from '../../shared/api/auth';
import type { Client, Harness } from './harness';
import { exampleCsv } from '../fixtures/exam-lists';

export interface RouteCase {
  method: 'get' | 'post' | 'put' | 'patch' | 'delete';
  path: string;
  /** Roles the product's role table allows ('signed-in' = every role). admin is always listed. */
  allowed: 'public' | 'signed-in' | Role[];
  /** Statuses that count as "allowed" besides 2xx (e.g. 409 when there is nothing to undo). */
  alsoOk?: number[];
  prepare?: (h: Harness) => Promise<unknown>;
  send: (c: Client, prepared: unknown) => Promise<Response>;
}

let counter = 0;
const unique = () => `Matrix room ${++counter}`;

export const ROUTE_TABLE: RouteCase[] = [
  { method: 'get', path: '/api/health', allowed: 'public', send: (c) => c.get('/api/health') },
  { method: 'get', path: '/api/auth/demo-accounts', allowed: 'public', send: (c) => c.get('/api/auth/demo-accounts') },
  { method: 'get', path: '/api/auth/me', allowed: 'signed-in', send: (c) => c.get('/api/auth/me') },
  { method: 'get', path: '/api/rooms', allowed: 'signed-in', send: (c) => c.get('/api/rooms') },
  {
    method: 'post',
    path: '/api/rooms',
    allowed: ['admin'],
    send: (c) => c.post('/api/rooms', { name: unique(), modality: 'MR', airChangesPerHour: 10, staff: 1 }),
  },
  { method: 'get', path: '/api/settings', allowed: 'signed-in', send: (c) => c.get('/api/settings') },
  {
    method: 'put',
    path: '/api/settings',
    allowed: ['admin'],
    send: (c) => c.put('/api/settings', { timezone: 'America/Chicago', snugMarginMinutes: 3 }),
  },

  { method: 'get', path: '/api/days/:date/plan', allowed: 'signed-in', send: (c) => c.get('/api/days/2027-03-10/plan') },
  {
    method: 'post',
    path: '/api/days/:date/exams/import?dryRun=true',
    allowed: ['scheduler', 'charge', 'admin'],
    send: (c) => c.upload('/api/days/2027-03-10/exams/import?dryRun=true', exampleCsv('2027-03-10'), 'day.csv'),
  },
  {
    method: 'post',
    path: '/api/days/:date/exams/import',
    allowed: ['scheduler', 'charge', 'admin'],
    send: (c) => c.upload('/api/days/2027-03-11/exams/import', exampleCsv('2027-03-11'), 'day.csv'),
  },

  {
    method: 'patch',
    path: '/api/exams/:id',
    allowed: ['scheduler', 'charge', 'admin'],
    prepare: firstExam,
    send: (c, e) => c.patch(`/api/exams/${(e as Exam).id}`, { start: (e as Exam).start, version: (e as Exam).version }),
  },
  {
    method: 'put',
    path: '/api/exams/:id/staffing',
    allowed: ['charge', 'admin'],
    prepare: firstExam,
    send: (c, e) => c.put(`/api/exams/${(e as Exam).id}/staffing`, { staff: 2 }),
  },
  { method: 'patch', path: '/api/rooms/:id/staffing', allowed: ['charge', 'admin'], send: (c) => c.patch('/api/rooms/1/staffing', { staff: 1 }) },
  { method: 'get', path: '/api/days/:date/history', allowed: 'signed-in', send: (c) => c.get('/api/days/2027-03-10/history') },
  { method: 'post', path: '/api/days/:date/undo', allowed: ['scheduler', 'charge', 'admin'], alsoOk: [409], send: (c) => c.post('/api/days/2027-03-10/undo') },
  { method: 'post', path: '/api/days/:date/redo', allowed: ['scheduler', 'charge', 'admin'], alsoOk: [409], send: (c) => c.post('/api/days/2027-03-10/redo') },
  { method: 'get', path: '/api/days/:date/fixes', allowed: 'signed-in', send: (c) => c.get('/api/days/2027-03-10/fixes') },
  {
    method: 'post',
    path: '/api/days/:date/fixes/apply',
    allowed: ['charge', 'admin'],
    alsoOk: [409, 422],
    send: (c) => c.post('/api/days/2027-03-10/fixes/apply', { fixId: 'add-helper:0' }),
  },
  {
    method: 'get',
    path: '/api/days/:date/events',
    allowed: 'signed-in',
    // the stream never ends: read its first bytes, then hang up
    send: (c) =>
      c.get('/api/days/2027-03-10/events').buffer(true).parse((res, done) => {
        res.once('data', () => {
          done(null, null);
          (res as unknown as { destroy(): void }).destroy();
        });
        res.once('end', () => done(null, null));
      }),
  },
];

interface Exam {
  id: number;
  start: string;
  version: number;
}

/** The seeded day's first exam as it is now (its version changes with every move). */
async function firstExam(h: Harness): Promise<Exam> {
  const exam = await h.db('exams').where({ day: '2027-03-10' }).orderBy('id').first();
  return { id: exam.id, start: exam.start_at, version: exam.version };
}
