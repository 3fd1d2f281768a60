import type { Response } from 'supertest';
import type { Role } from '../../shared/api/auth';
import type { Client, Harness } from './harness';
import { exampleCsv } from '../fixtures/exam-lists';
import { loadChecklist } from '../../server/services/checklist';
import { finishExam } from '../../server/services/turnovers';
import { createRoom } from '../../server/services/rooms';
import { createUser } from '../../server/services/users';
import { roomInputSchema } from '../../shared/api/rooms';
import { DEFAULT_HL7_MAPPING } from '../../shared/api/hl7-mapping';
import { DEMO_PASSWORD } from '../../seeds/support/demo-accounts';
import { queueNotices } from '../../server/services/notices/queue';
import { unsubscribeToken } from '../../server/services/notices/unsubscribe';
import { rotateFeedToken } from '../../server/services/calendar/tokens';

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

/** A roster row for the roster routes: two aides in MR 1 (an invented shift). */
const MATRIX_ROSTER_ROW = { name: null, role: 'aide', count: 2, start: '07:00', end: '15:00', breaks: [], roomIds: [1] };

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
    method: 'post',
    path: '/api/days/:date/exams',
    allowed: ['scheduler', 'charge', 'admin'],
    send: (c) => c.post('/api/days/2027-03-10/exams', { accession: `MATRIX-${++counter}`, room: 'MR 1', start: '19:00', duration_min: 20, procedure: 'MR knee' }),
  },
  {
    method: 'put',
    path: '/api/exams/:id',
    allowed: ['scheduler', 'charge', 'admin'],
    prepare: firstExamFields,
    send: (c, e) => c.put(`/api/exams/${(e as ExamForm).id}`, (e as ExamForm).body),
  },
  {
    method: 'delete',
    path: '/api/exams/:id?version=',
    allowed: ['scheduler', 'charge', 'admin'],
    prepare: spareExam,
    send: (c, e) => c.delete(`/api/exams/${(e as Exam).id}?version=${(e as Exam).version}`),
  },
  {
    method: 'put',
    path: '/api/exams/:id/staffing',
    allowed: ['charge', 'admin'],
    prepare: firstExam,
    send: (c, e) => c.put(`/api/exams/${(e as Exam).id}/staffing`, { staff: 2 }),
  },
  { method: 'patch', path: '/api/rooms/:id/staffing', allowed: ['charge', 'admin'], send: (c) => c.patch('/api/rooms/1/staffing', { staff: 1 }) },
  { method: 'get', path: '/api/days/:date/roster', allowed: 'signed-in', send: (c) => c.get('/api/days/2027-03-10/roster') },
  { method: 'put', path: '/api/days/:date/roster', allowed: ['charge', 'admin'], send: (c) => c.put('/api/days/2027-03-12/roster', { rows: [MATRIX_ROSTER_ROW] }) },
  { method: 'delete', path: '/api/days/:date/roster', allowed: ['charge', 'admin'], send: (c) => c.delete('/api/days/2027-03-12/roster') },
  {
    method: 'post',
    path: '/api/days/:date/roster/import?dryRun=true',
    allowed: ['charge', 'admin'],
    send: (c) => c.upload('/api/days/2027-03-12/roster/import?dryRun=true', 'role,count,start,end,rooms\naide,2,07:00,15:00,MR 1\n', 'roster.csv'),
  },
  { method: 'get', path: '/api/roster/weekly', allowed: 'signed-in', send: (c) => c.get('/api/roster/weekly') },
  { method: 'put', path: '/api/roster/weekly/:weekday', allowed: ['admin'], send: (c) => c.put('/api/roster/weekly/7', { rows: [MATRIX_ROSTER_ROW] }) },
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
  { method: 'post', path: '/api/days/:date/fit', allowed: ['charge', 'admin'], send: (c) => c.post('/api/days/2027-03-10/fit') },
  {
    method: 'post',
    path: '/api/days/:date/fit/apply',
    allowed: ['charge', 'admin'],
    alsoOk: [409, 422],
    send: (c) => c.post('/api/days/2027-03-10/fit/apply', { dayVersion: 0, changes: [{ type: 'staffing', toExamId: 1, accession: 'x', from: null, to: 2 }] }),
  },
  { method: 'put', path: '/api/exams/:id/pin', allowed: ['scheduler', 'charge', 'admin'], alsoOk: [404], send: (c) => c.put('/api/exams/1/pin', { pinned: false }) },
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
  // Rooms now, arrivals, turnover checklists, the cleaning log and shift tasks
  { method: 'get', path: '/api/days/:date/board', allowed: 'signed-in', send: (c) => c.get('/api/days/2027-03-10/board') },
  {
    method: 'post',
    path: '/api/exams/:id/arrived',
    allowed: ['frontdesk', 'charge', 'tech', 'admin'],
    prepare: firstExam,
    send: (c, e) => c.post(`/api/exams/${(e as Exam).id}/arrived`, {}),
  },
  {
    method: 'delete',
    path: '/api/exams/:id/arrived',
    allowed: ['frontdesk', 'charge', 'tech', 'admin'],
    prepare: firstExam,
    send: (c, e) => c.delete(`/api/exams/${(e as Exam).id}/arrived`),
  },
  { method: 'get', path: '/api/rooms/:id/turnover', allowed: 'signed-in', send: (c) => c.get('/api/rooms/1/turnover?date=2027-03-10') },
  {
    method: 'post',
    path: '/api/exams/:id/finished',
    allowed: ['tech', 'charge', 'admin'],
    prepare: unfinishedExam,
    // the seeded exam may not have started at the matrix's clock: a reason lets any role allowed record it
    send: (c, id) => c.post(`/api/exams/${id as number}/finished`, { earlyReason: 'Role matrix check' }),
  },
  {
    method: 'post',
    path: '/api/turnovers/:id/steps/:key/done',
    allowed: ['tech', 'charge', 'admin'],
    prepare: openTurnover,
    send: (c, t) => c.post(`/api/turnovers/${(t as OpenTurnover).id}/steps/${(t as OpenTurnover).firstStep}/done`, {}),
  },
  {
    method: 'post',
    path: '/api/turnovers/:id/complete',
    allowed: ['tech', 'charge', 'admin'],
    alsoOk: [422], // steps left: the role was let through
    prepare: openTurnover,
    send: (c, t) => c.post(`/api/turnovers/${(t as OpenTurnover).id}/complete`, {}),
  },
  { method: 'get', path: '/api/log', allowed: ['tech', 'charge', 'admin'], send: (c) => c.get('/api/log?date=2027-03-10') },
  { method: 'get', path: '/api/log.csv', allowed: ['tech', 'charge', 'admin'], send: (c) => c.get('/api/log.csv?date=2027-03-10') },
  { method: 'get', path: '/api/reports', allowed: ['charge', 'admin'], send: (c) => c.get('/api/reports?from=2027-03-01&to=2027-03-10') },
  {
    method: 'post',
    path: '/api/log/:id/corrections',
    allowed: ['tech', 'charge', 'admin'],
    prepare: async (h) => (await openTurnover(h)) && (await h.db('cleaning_log').max({ id: 'id' }))[0]!.id,
    send: (c, id) => c.post(`/api/log/${id as number}/corrections`, { note: 'Role matrix check' }),
  },
  { method: 'get', path: '/api/rooms/:id/tasks', allowed: 'signed-in', send: (c) => c.get('/api/rooms/1/tasks?date=2027-03-10') },
  {
    method: 'post',
    path: '/api/shift-tasks/:taskId/done',
    allowed: ['tech', 'charge', 'admin'],
    alsoOk: [409], // the occurrence was ticked by a role before
    prepare: async (h) => (await h.db('shift_tasks').where({ room_id: 1, key: 'wipe-start' }).first('id')).id,
    send: (c, id) => c.post(`/api/shift-tasks/${id as number}/done`, { due: '2027-03-10T07:00:00-06:00' }),
  },
  { method: 'get', path: '/api/shift-tasks', allowed: ['admin'], send: (c) => c.get('/api/shift-tasks') },
  {
    method: 'post',
    path: '/api/shift-tasks',
    allowed: ['admin'],
    send: (c) => c.post('/api/shift-tasks', { roomId: 1, label: 'Matrix task', rrule: 'DTSTART:20270310T120000\nRRULE:FREQ=DAILY', durationMinutes: 5 }),
  },
  {
    method: 'put',
    path: '/api/shift-tasks/:taskId',
    allowed: ['admin'],
    prepare: async (h) => (await h.db('shift_tasks').where({ room_id: 1, key: 'deep-clean' }).first()) as Record<string, unknown>,
    // the task as it is: the role is checked, nothing changes
    send: (c, t) => {
      const row = t as { id: number; label: string; rrule: string; duration_minutes: number };
      return c.put(`/api/shift-tasks/${row.id}`, { label: row.label, rrule: row.rrule, durationMinutes: row.duration_minutes });
    },
  },
  { method: 'post', path: '/api/shift-tasks/:taskId/retire', allowed: ['admin'], prepare: freshShiftTask, send: (c, id) => c.post(`/api/shift-tasks/${id as number}/retire`, {}) },
  // Setup (admin) and the profile (every role)
  { method: 'get', path: '/api/rooms/setup', allowed: ['admin'], send: (c) => c.get('/api/rooms/setup') },
  {
    method: 'put',
    path: '/api/rooms/:id',
    allowed: ['admin'],
    prepare: async (h) => (await h.db('rooms').where({ id: 1 }).first()) as Record<string, unknown>,
    // the room as it is: the role is checked, nothing changes
    send: (c, r) => {
      const row = r as { name: string; modality: string; air_changes_per_hour: number; staff: number; opens_at: string; closes_at: string };
      return c.put('/api/rooms/1', { name: row.name, modality: row.modality, airChangesPerHour: row.air_changes_per_hour, staff: row.staff, opensAt: row.opens_at, closesAt: row.closes_at });
    },
  },
  { method: 'post', path: '/api/rooms/:id/retire', allowed: ['admin'], prepare: freshRoom, send: (c, id) => c.post(`/api/rooms/${id as number}/retire`, {}) },
  { method: 'post', path: '/api/rooms/:id/restore', allowed: ['admin'], prepare: freshRoom, send: (c, id) => c.post(`/api/rooms/${id as number}/restore`, {}) },
  { method: 'get', path: '/api/rooms/:id/kit', allowed: 'signed-in', send: (c) => c.get('/api/rooms/1/kit') },
  { method: 'put', path: '/api/rooms/:id/kit', allowed: ['admin'], prepare: freshRoom, send: (c, id) => c.put(`/api/rooms/${id as number}/kit`, { equipmentIds: [] }) },
  { method: 'get', path: '/api/equipment', allowed: ['admin'], send: (c) => c.get('/api/equipment') },
  { method: 'post', path: '/api/equipment', allowed: ['admin'], send: (c) => c.post('/api/equipment', { name: 'Matrix mop', kind: 'mop', marking: 'mr-safe' }) },
  { method: 'put', path: '/api/equipment/:id', allowed: ['admin'], prepare: freshItem, send: (c, id) => c.put(`/api/equipment/${id as number}`, { name: 'Matrix bucket', kind: 'bucket', marking: 'mr-safe' }) },
  { method: 'post', path: '/api/equipment/:id/retire', allowed: ['admin'], prepare: freshItem, send: (c, id) => c.post(`/api/equipment/${id as number}/retire`, {}) },
  { method: 'get', path: '/api/products', allowed: ['admin'], send: (c) => c.get('/api/products') },
  { method: 'post', path: '/api/products', allowed: ['admin'], send: (c) => c.post('/api/products', { name: `Matrix wipe ${++counter}`, kind: 'standard', contactMinutes: 2 }) },
  { method: 'put', path: '/api/products/:id', allowed: ['admin'], prepare: freshProduct, send: (c, id) => c.put(`/api/products/${id as number}`, { name: `Matrix wipe ${++counter}`, kind: 'other', contactMinutes: 3 }) },
  { method: 'post', path: '/api/products/:id/retire', allowed: ['admin'], prepare: freshProduct, send: (c, id) => c.post(`/api/products/${id as number}/retire`, {}) },
  { method: 'post', path: '/api/products/:id/preview', allowed: ['admin'], prepare: freshProduct, send: (c, id) => c.post(`/api/products/${id as number}/preview`, { name: 'Matrix draft', kind: 'standard', contactMinutes: 5 }) },
  { method: 'get', path: '/api/protocols', allowed: ['admin'], send: (c) => c.get('/api/protocols') },
  { method: 'get', path: '/api/protocols/:modality/versions/:version', allowed: ['admin'], send: (c) => c.get('/api/protocols/MR/versions/1') },
  { method: 'post', path: '/api/protocols', allowed: ['admin'], prepare: protocolDraft, send: (c, draft) => c.post('/api/protocols', draft as object) },
  { method: 'post', path: '/api/protocols/preview', allowed: ['admin'], prepare: protocolDraft, send: (c, draft) => c.post('/api/protocols/preview', { modality: 'US', body: (draft as { body: unknown }).body }) },
  { method: 'get', path: '/api/setup/checklist', allowed: ['admin'], send: (c) => c.get('/api/setup/checklist') },
  { method: 'get', path: '/api/users', allowed: ['admin'], send: (c) => c.get('/api/users') },
  {
    method: 'post',
    path: '/api/users',
    allowed: ['admin'],
    send: (c) => c.post('/api/users', { username: `matrix${++counter}`, displayName: 'Matrix user', email: 'matrix@example.org', role: 'tech', password: 'matrix-password-1' }),
  },
  { method: 'patch', path: '/api/users/:id', allowed: ['admin'], prepare: freshUser, send: (c, id) => c.patch(`/api/users/${id as number}`, { role: 'scheduler' }) },
  { method: 'post', path: '/api/users/:id/password', allowed: ['admin'], prepare: freshUser, send: (c, id) => c.post(`/api/users/${id as number}/password`, { password: 'matrix-password-2' }) },
  { method: 'post', path: '/api/users/:id/deactivate', allowed: ['admin'], prepare: freshUser, send: (c, id) => c.post(`/api/users/${id as number}/deactivate`, {}) },
  { method: 'post', path: '/api/users/:id/reactivate', allowed: ['admin'], prepare: freshUser, send: (c, id) => c.post(`/api/users/${id as number}/reactivate`, {}) },
  { method: 'get', path: '/api/profile', allowed: 'signed-in', send: (c) => c.get('/api/profile') },
  {
    method: 'put',
    path: '/api/profile/password',
    allowed: 'signed-in',
    // each role's demo account changes its password once; its matrix session stays signed in
    send: (c) => c.put('/api/profile/password', { currentPassword: DEMO_PASSWORD, newPassword: 'matrix-password-3' }),
  },
  { method: 'get', path: '/api/audit', allowed: ['admin'], send: (c) => c.get('/api/audit?limit=5') },
  // E-mail notices: one's own choices, the Outbox (admin), the unsubscribe link (no sign-in)
  { method: 'get', path: '/api/profile/notices', allowed: 'signed-in', send: (c) => c.get('/api/profile/notices') },
  { method: 'put', path: '/api/profile/notices', allowed: 'signed-in', send: (c) => c.put('/api/profile/notices', { email: 'matrix@example.test', kinds: { 'import-digest': true, 'slot-moves': false } }) },
  { method: 'get', path: '/api/outbox', allowed: ['admin'], send: (c) => c.get('/api/outbox?limit=5') },
  { method: 'get', path: '/api/outbox/:id', allowed: ['admin'], prepare: freshNotice, send: (c, id) => c.get(`/api/outbox/${id as number}`) },
  // The HL7 booking feed's interface log and mapping (admin)
  { method: 'get', path: '/api/hl7/messages', allowed: ['admin'], send: (c) => c.get('/api/hl7/messages?limit=5') },
  { method: 'get', path: '/api/hl7/messages/:id', allowed: ['admin'], prepare: freshHl7Message, send: (c, id) => c.get(`/api/hl7/messages/${id as number}`) },
  { method: 'get', path: '/api/hl7/mapping', allowed: ['admin'], send: (c) => c.get('/api/hl7/mapping') },
  { method: 'put', path: '/api/hl7/mapping', allowed: ['admin'], send: (c) => c.put('/api/hl7/mapping', DEFAULT_HL7_MAPPING) },
  {
    method: 'get',
    path: '/api/notices/unsubscribe',
    allowed: 'public',
    prepare: async (h) => unsubscribeToken('test-secret', await freshUser(h), 'slot-moves'),
    send: (c, token) => c.get(`/api/notices/unsubscribe?token=${encodeURIComponent(token as string)}`),
  },
  // Calendar feeds: one's own addresses (signed in); the feeds themselves by token (no sign-in)
  { method: 'get', path: '/api/profile/calendar', allowed: 'signed-in', send: (c) => c.get('/api/profile/calendar') },
  { method: 'post', path: '/api/profile/calendar/rotate', allowed: 'signed-in', send: (c) => c.post('/api/profile/calendar/rotate', {}) },
  { method: 'delete', path: '/api/profile/calendar', allowed: 'signed-in', send: (c) => c.delete('/api/profile/calendar') },
  {
    method: 'get',
    path: '/api/calendar/:token/mine.ics',
    allowed: 'public',
    prepare: async (h) => rotateFeedToken(h.db, await freshUser(h), h.clock.now()),
    send: (c, token) => c.get(`/api/calendar/${token as string}/mine.ics`),
  },
  {
    method: 'get',
    path: '/api/calendar/:token/rooms/:roomId.ics',
    allowed: 'public',
    prepare: async (h) => ({ token: await rotateFeedToken(h.db, await freshUser(h), h.clock.now()), roomId: (await h.db('rooms').where({ active: true }).first('id')).id as number }),
    send: (c, p) => c.get(`/api/calendar/${(p as { token: string }).token}/rooms/${(p as { roomId: number }).roomId}.ics`),
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

interface ExamForm {
  id: number;
  body: Record<string, unknown>;
}

/** The seeded day's first exam as an edit form would send it back unchanged. */
async function firstExamFields(h: Harness): Promise<ExamForm> {
  const exam = await h.db('exams').where({ day: '2027-03-10' }).orderBy('id').first();
  const room = await h.db('rooms').where({ id: exam.room_id }).first('name');
  return {
    id: exam.id,
    body: {
      accession: exam.accession, room: room.name, start: exam.start_at, duration_min: exam.duration_minutes, procedure: exam.procedure,
      coil: exam.coil, precaution: exam.precaution, mobility: exam.mobility, contrast: Boolean(exam.contrast), notes: exam.notes, version: exam.version,
    },
  };
}

/** A copy of the seeded day's first exam under a new accession, for a cancel to remove. */
async function spareExam(h: Harness): Promise<Exam> {
  const { id: _id, ...exam } = await h.db('exams').where({ day: '2027-03-10' }).orderBy('id').first();
  const [{ id }] = await h.db('exams').insert({ ...exam, accession: `SPARE-${++counter}`, version: 1 }).returning('id');
  return { id: id as number, start: exam.start_at, version: 1 };
}

/** An exam of the seeded day whose end is not recorded yet. */
async function unfinishedExam(h: Harness): Promise<number> {
  const exam = await h.db('exams').where({ day: '2027-03-10' }).whereNotIn('id', h.db('turnovers').select('from_exam_id')).orderBy('id').first('id');
  return exam.id;
}

interface OpenTurnover {
  id: number;
  firstStep: string;
}

/** A fresh turnover (recorded by the demo technologist) and the first step of its checklist. */
async function openTurnover(h: Harness): Promise<OpenTurnover> {
  const user = await h.db('users').where({ username: 'tech' }).first('id', 'username', 'display_name', 'role');
  const now = h.clock.now();
  const ref = await finishExam(h.db, await unfinishedExam(h), { id: user.id, username: user.username, displayName: user.display_name, role: user.role }, now, 'Role matrix check');
  const checklist = await loadChecklist(h.db, ref.roomId, ref.day, now, ref.turnoverId);
  return { id: ref.turnoverId, firstStep: checklist.steps[0]!.key };
}

/** An interface-log row as the feed stores it (refused, so it made no change). */
async function freshHl7Message(h: Harness): Promise<number> {
  const stamp = h.clock.now().toISOString();
  const [{ id }] = await h.db('hl7_messages').insert({ received_at: stamp, last_received_at: stamp, sender: 'RIS^INVENTED', control_id: `MATRIX-${++counter}`, message_type: 'SIU^S12', ack_code: 'AE', outcome: 'Unknown room', raw: 'MSH|^~\\&|RIS|INVENTED' }).returning('id');
  return id as number;
}

/** A room made for one check (retire, restore, kit), so checks never share state. */
async function freshRoom(h: Harness): Promise<number> {
  return (await createRoom(h.db, roomInputSchema.parse({ name: unique(), modality: 'CT', airChangesPerHour: 12 }), h.clock.now())).id;
}

/** A shift task made for one check (retire), so checks never share state. */
async function freshShiftTask(h: Harness): Promise<number> {
  const [{ id }] = await h.db('shift_tasks').insert({ room_id: 1, key: `matrix-${++counter}`, label: 'Matrix task', rrule: 'DTSTART:20270310T120000\nRRULE:FREQ=DAILY', duration_minutes: 5, created_at: h.clock.now().toISOString() }).returning('id');
  return id as number;
}

async function freshItem(h: Harness): Promise<number> {
  const [{ id }] = await h.db('equipment').insert({ name: `Matrix item ${++counter}`, kind: 'cart', marking: 'mr-safe', created_at: h.clock.now().toISOString() }).returning('id');
  return id as number;
}

async function freshProduct(h: Harness): Promise<number> {
  const stamp = h.clock.now().toISOString();
  const [{ id }] = await h.db('products').insert({ name: `Matrix wipe ${++counter}`, kind: 'standard', contact_minutes: 2, created_at: stamp, updated_at: stamp }).returning('id');
  return id as number;
}

/** A one-step US protocol effective from the harness's today (UTC date: the demo site is behind UTC, so never earlier). */
async function protocolDraft(h: Harness): Promise<unknown> {
  const productId = await freshProduct(h);
  const today = h.clock.now().toISOString().slice(0, 10);
  return { modality: 'US', effectiveFrom: today, body: { steps: [{ key: 'table', label: 'Couch', handsOnMinutes: 2, disinfects: true, productId }] } };
}

async function freshNotice(h: Harness): Promise<number> {
  const key = `matrix-notice-${++counter}`;
  await queueNotices(h.db, [{ key, kind: 'slot-moves', userId: await freshUser(h), to: 'matrix@example.test', subject: 'Matrix', text: 'x', html: '<p>x</p>', unsubscribeUrl: null }], h.clock.now());
  return (await h.db('notices').where({ idempotency_key: key }).first('id')).id as number;
}

async function freshUser(h: Harness): Promise<number> {
  return createUser(h.db, { username: `matrix-user-${++counter}`, password: 'matrix-password-0', role: 'tech', displayName: 'Matrix user' }, h.clock.now());
}
