import type { Response } from 'supertest';
import type { Role } from '../../shared/api/auth';
import type { Client, Harness } from './harness';
import { exampleCsv } from '../fixtures/exam-lists';

export interface RouteCase {
  method: 'get' | 'post' | 'put' | 'patch' | 'delete';
  path: string;
  /** Roles the product's role table allows ('signed-in' = every role). admin is always listed. */
  allowed: 'public' | 'signed-in' | Role[];
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
];
