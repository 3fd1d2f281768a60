import fc from 'fast-check';
import { dayText, isoInstant } from './values';

/** Ids that exist in the fuzzed database, so some requests reach the logic behind the checks. */
export interface KnownIds {
  exams: number[];
  rooms: number[];
  turnovers: number[];
  logEntries: number[];
  shiftTasks: number[];
  equipment: number[];
  /** Users other than the demo accounts the fuzz signs in as (so it does not lock itself out). */
  otherUsers: number[];
}

/** A route's inputs by name, each with plausible (mostly valid) values, the nasty ones being added by the fuzz: the body's fields, the query's, the path's. */
export interface RouteShape {
  body?: Record<string, fc.Arbitrary<unknown>>;
  query?: Record<string, fc.Arbitrary<string>>;
  params: Record<string, fc.Arbitrary<string>>;
}

const small = (min: number, max: number) => fc.integer({ min, max });
const text = (max: number) => fc.string({ maxLength: max });
const hhmm = fc.oneof(fc.constantFrom('07:00', '19:00', '00:00', '23:59', '12:00'), fc.tuple(fc.nat(23), fc.nat(59)).map(([h, m]) => `${String(h).padStart(2, '0')}:${String(m).padStart(2, '0')}`));
const zones = fc.constantFrom('America/Chicago', 'UTC', 'Etc/GMT+12', 'Etc/GMT-14', 'Pacific/Kiritimati', 'Asia/Kathmandu', 'America/St_Johns', 'Australia/Lord_Howe', 'Europe/London', 'utc');
const stepKeys = fc.constantFrom('don', 'linen', 'table', 'coil', 'floor', 'doff', 'air-hold', 'wipe-start', 'DON', '');
const productKeys = fc.constantFrom('standard', 'sporicidal', 'bleach', 'alcohol', '');
const fixIds = fc.oneof(
  fc.tuple(fc.constantFrom('push-later', 'other-room', 'add-helper', 'isolation-last', 'x'), fc.oneof(fc.nat(200), fc.constantFrom(999999999999999, 2 ** 53))).map(([kind, id]) => `${kind}:${id}`),
  fc.constantFrom('add-helper:0', 'add-helper:-1', 'push-later:1e3', '::', 'add-helper:1:2', ':'),
);

function id(known: number[], fallback = 1): fc.Arbitrary<string> {
  return fc.oneof(fc.constantFrom(...(known.length ? known : [fallback])), fc.integer({ min: 0, max: 10_000 })).map(String);
}

/** Rules a shift task may and may not use (RFC 5545), and random text. */
const rules = fc.oneof(
  fc.constantFrom(
    'DTSTART:20270301T073000\nRRULE:FREQ=WEEKLY;INTERVAL=2;BYDAY=MO,FR',
    'DTSTART:20270301T073000\nRRULE:FREQ=DAILY;COUNT=3;UNTIL=20270401',
    'DTSTART;TZID=Mars/Olympus:20270301T073000\nRRULE:FREQ=DAILY',
    'DTSTART:20270301T073000\nRRULE:FREQ=MONTHLY;BYDAY=1FR;BYSETPOS=-1',
    'RRULE:FREQ=SECONDLY',
    'DTSTART:99991231T235959\nRRULE:FREQ=YEARLY;INTERVAL=9999;COUNT=9999',
  ),
  fc.string({ maxLength: 600 }),
);
const shiftTaskFields = { label: text(130), rrule: rules, durationMinutes: small(0, 300) };

const equipmentFields = {
  name: fc.oneof(fc.string({ minLength: 1, maxLength: 80 }), fc.constantFrom('Knee coil', ' mop ', '')),
  kind: fc.constantFrom('coil', 'cushion', 'cart', 'bucket', 'mop', 'spray-bottle'),
  marking: fc.constantFrom('mr-safe', 'mr-conditional', 'mr-unsafe', 'not-marked'),
  conditions: fc.string({ maxLength: 500 }),
  notes: fc.string({ maxLength: 500 }),
};
const password = fc.oneof(fc.string({ minLength: 12, maxLength: 40 }), fc.constantFrom('short', 'p'.repeat(201)));

/**
 * The shape of a route without one below, guessed from its path: `:date` a day, other params
 * small ids; its body gets arbitrary JSON only. Enough to fuzz a new route; a shape here does better.
 */
export function guessedShape(path: string): RouteShape {
  const names = [...path.matchAll(/:(\w+)/g)].map((m) => m[1]!);
  return { params: Object.fromEntries(names.map((name) => [name, name === 'date' ? dayText : fc.integer({ min: 0, max: 60 }).map(String)])) };
}

/**
 * Routes of the role matrix by `method path` (as tests/api/route-table.ts writes it), with their
 * real field names; a route missing here is fuzzed with {@link guessedShape}.
 */
export function routeShapes(ids: KnownIds): Record<string, RouteShape> {
  const date = { date: dayText };
  const exam = { id: id(ids.exams) };
  const room = { id: id(ids.rooms) };
  const dayQuery = { date: dayText };
  return {
    'get /api/health': { params: {} },
    'get /api/auth/demo-accounts': { params: {} },
    'get /api/auth/me': { params: {} },
    'get /api/rooms': { params: {} },
    'post /api/rooms': {
      params: {},
      body: {
        name: fc.oneof(fc.string({ minLength: 1, maxLength: 40 }), fc.constantFrom('MR 1', 'mr 1', ' MR 1 ', 'ＭＲ 1', 'İ', 'ß', 'SS')),
        modality: fc.constantFrom('MR', 'CT', 'US', 'OT', 'NM', 'PT'),
        airChangesPerHour: fc.oneof(fc.integer({ min: 1, max: 60 }), fc.double({ min: 1, max: 60, noNaN: true })),
        staff: small(1, 4),
        opensAt: hhmm,
        closesAt: hhmm,
      },
    },
    'get /api/settings': { params: {} },
    'put /api/settings': { params: {}, body: { timezone: zones, snugMarginMinutes: small(0, 60), siteName: text(80) } },
    'get /api/days/:date/plan': { params: date },
    'post /api/days/:date/exams/import?dryRun=true': { params: date, query: { dryRun: fc.constantFrom('true', 'false'), dayVersion: fc.nat(50).map(String) } },
    'post /api/days/:date/exams/import': { params: date, query: { dryRun: fc.constantFrom('true', 'false'), dayVersion: fc.nat(50).map(String) } },
    'patch /api/exams/:id': {
      params: exam,
      body: { start: isoInstant, roomId: id(ids.rooms).map(Number), version: small(0, 5), reason: fc.constantFrom('drag', 'keyboard', 'api') },
    },
    'put /api/exams/:id/staffing': { params: exam, body: { staff: fc.oneof(small(1, 3), fc.constant(null)) } },
    'patch /api/rooms/:id/staffing': { params: room, body: { staff: small(1, 3) } },
    'get /api/days/:date/history': { params: date },
    'post /api/days/:date/undo': { params: date },
    'post /api/days/:date/redo': { params: date },
    'get /api/days/:date/fixes': { params: date, query: { gap: id(ids.exams), after: id(ids.exams), limit: fc.integer({ min: 1, max: 20 }).map(String) } },
    'post /api/days/:date/fixes/apply': { params: date, body: { fixId: fixIds, acceptNewProblems: fc.boolean() } },
    'get /api/days/:date/events': { params: date },
    'get /api/days/:date/board': { params: date },
    'post /api/exams/:id/arrived': { params: exam },
    'delete /api/exams/:id/arrived': { params: exam },
    'get /api/rooms/:id/turnover': { params: room, query: dayQuery },
    'post /api/exams/:id/finished': { params: exam },
    'post /api/turnovers/:id/steps/:key/done': {
      params: { id: id(ids.turnovers), key: stepKeys },
      body: { productKey: productKeys, earlyReason: text(500) },
    },
    'post /api/turnovers/:id/complete': { params: { id: id(ids.turnovers) }, body: { overrideReason: text(500) } },
    'get /api/log': { params: {}, query: { date: dayText, roomId: id(ids.rooms), user: fc.constantFrom('tech', 'admin', 'nobody', '') } },
    'get /api/log.csv': { params: {}, query: { date: dayText, roomId: id(ids.rooms), user: fc.constantFrom('tech', 'admin', 'nobody', '') } },
    'post /api/log/:id/corrections': { params: { id: id(ids.logEntries) }, body: { note: text(500) } },
    'get /api/rooms/:id/tasks': { params: room, query: dayQuery },
    'post /api/shift-tasks/:taskId/done': { params: { taskId: id(ids.shiftTasks) }, body: { due: isoInstant } },
    'get /api/shift-tasks': { params: {} },
    'post /api/shift-tasks': { params: {}, body: { roomId: id(ids.rooms).map(Number), ...shiftTaskFields } },
    'put /api/shift-tasks/:taskId': { params: { taskId: id(ids.shiftTasks) }, body: shiftTaskFields },
    'post /api/shift-tasks/:taskId/retire': { params: { taskId: id(ids.shiftTasks) } },
    'get /api/rooms/setup': { params: {} },
    'put /api/rooms/:id': {
      params: room,
      body: {
        name: fc.oneof(fc.string({ minLength: 1, maxLength: 40 }), fc.constantFrom('MR 1', 'CT 1', 'mr 2')),
        modality: fc.constantFrom('MR', 'CT', 'US', 'OT'),
        airChangesPerHour: fc.integer({ min: 1, max: 60 }),
        staff: small(1, 4),
        opensAt: hhmm,
        closesAt: hhmm,
        week: fc.oneof(
          fc.constant(undefined),
          fc.array(fc.record({ weekday: small(0, 8), closed: fc.boolean(), opensAt: hhmm, closesAt: hhmm }), { minLength: 6, maxLength: 8 }),
          fc.tuple(hhmm, hhmm).map(([opensAt, closesAt]) => [1, 2, 3, 4, 5, 6, 7].map((weekday) => ({ weekday, closed: weekday === 7, opensAt, closesAt }))),
        ),
        mrZones: fc.oneof(fc.constant(undefined), fc.record({ kitKeptIn: fc.constantFrom('zone-iii', 'zone-iv', 'zone-v', null), zoneIvAreas: text(600), notes: text(600) })),
      },
    },
    'post /api/rooms/:id/retire': { params: room },
    'post /api/rooms/:id/restore': { params: room },
    'get /api/rooms/:id/kit': { params: room },
    'put /api/rooms/:id/kit': { params: room, body: { equipmentIds: fc.array(id(ids.equipment).map(Number), { maxLength: 6 }) } },
    'get /api/equipment': { params: {} },
    'post /api/equipment': { params: {}, body: equipmentFields },
    'put /api/equipment/:id': { params: { id: id(ids.equipment) }, body: equipmentFields },
    'post /api/equipment/:id/retire': { params: { id: id(ids.equipment) } },
    'get /api/users': { params: {} },
    'post /api/users': {
      params: {},
      body: {
        username: fc.oneof(fc.stringMatching(/^[a-z0-9._-]{2,20}$/), fc.constantFrom('admin', 'ADMIN', 'a', 'x'.repeat(65))),
        displayName: fc.string({ minLength: 1, maxLength: 120 }),
        email: fc.oneof(fc.emailAddress(), fc.constantFrom('not-an-email', '')),
        role: fc.constantFrom('admin', 'charge', 'tech', 'scheduler', 'frontdesk', 'root'),
        password,
      },
    },
    'patch /api/users/:id': {
      params: { id: id(ids.otherUsers, 999) },
      body: { displayName: fc.string({ minLength: 1, maxLength: 120 }), email: fc.emailAddress(), role: fc.constantFrom('admin', 'charge', 'tech', 'scheduler', 'frontdesk') },
    },
    'post /api/users/:id/password': { params: { id: id(ids.otherUsers, 999) }, body: { password } },
    'post /api/users/:id/deactivate': { params: { id: id(ids.otherUsers, 999) } },
    'post /api/users/:id/reactivate': { params: { id: id(ids.otherUsers, 999) } },
    'get /api/profile': { params: {} },
    // a wrong current password only: the fuzz keeps the demo accounts' passwords
    'put /api/profile/password': { params: {}, body: { currentPassword: fc.string({ maxLength: 40 }), newPassword: password } },
    'get /api/audit': { params: {}, query: { limit: fc.integer({ min: 1, max: 100 }).map(String), offset: fc.nat(1000).map(String) } },
  };
}
