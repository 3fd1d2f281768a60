import ical, { ICalEventStatus, type ICalCalendar } from 'ical-generator';
import type { Knex } from 'knex';
import { DateTime } from 'luxon';
import { CALENDAR_FEED_WINDOW } from '../../../shared/api/calendar';
import { NotFoundError } from '../../errors';
import { loadDayPlan } from '../day-plan';
import { readSettings } from '../settings';
import type { UserRecord } from '../users';
import { vtimezone } from './vtimezone';

/*
 * iCalendar feeds (RFC 5545) built with ical-generator. Exams carry the accession and the
 * procedure only, never patient data. Every event has a stable UID; its SEQUENCE comes from the
 * exam's version (raised by every move or edit) plus the versions it had when it was cancelled
 * before, so it only ever rises. Times are local with a TZID whose VTIMEZONE is in the feed.
 */

export interface FeedContext {
  /** PUBLIC_URL: its host name ends every UID. */
  publicUrl: string;
}

interface ExamRow {
  id: number;
  day: string;
  accession: string;
  room_id: number;
  start_at: string;
  duration_minutes: number;
  procedure: string;
  version: number;
}

interface CancelledRow extends ExamRow {
  exam_id: number;
}

interface Room {
  id: number;
  name: string;
}

interface Feed {
  cal: ICalCalendar;
  /** The TZID of local times, or null to write UTC (a zone without a VTIMEZONE). */
  zone: string | null;
  siteZone: string;
  host: string;
  stamp: Date;
}

/** The days a feed covers: a week back and four ahead of today at the site (bounded). */
export function feedWindow(zone: string, now: Date): { from: string; to: string } {
  const today = DateTime.fromJSDate(now, { zone }).startOf('day');
  return { from: today.minus({ days: CALENDAR_FEED_WINDOW.daysBack }).toISODate()!, to: today.plus({ days: CALENDAR_FEED_WINDOW.daysAhead }).toISODate()! };
}

async function newFeed(db: Knex, ctx: FeedContext, name: string, now: Date): Promise<Feed> {
  const { timezone, siteName } = await readSettings(db);
  const zone = vtimezone(timezone) ? timezone : null;
  const cal = ical({
    name: `${siteName}: ${name}`,
    prodId: { company: 'Turnwise', product: 'calendar-feeds', language: 'EN' },
    // name null: the calendar has no zone of its own (so DTSTAMP stays UTC, as §3.8.7.2 wants);
    // the generator writes one VTIMEZONE per TZID its events use
    timezone: { name: null, generator: vtimezone },
    ttl: 15 * 60,
  });
  return { cal, zone, siteZone: timezone, host: new URL(ctx.publicUrl).hostname || 'turnwise.invalid', stamp: now };
}

/** One room's exams, turnover blocks and cancelled exams over the feed window. */
export async function roomFeed(db: Knex, ctx: FeedContext, roomId: number, now: Date): Promise<string> {
  const room: Room | undefined = await db('rooms').where({ id: roomId }).first('id', 'name');
  if (!room) throw new NotFoundError(`No room ${roomId}.`);
  const feed = await newFeed(db, ctx, room.name, now);
  await addRooms(db, feed, [room], now);
  return finish(feed);
}

/**
 * One user's feed: the shift tasks of every active room for technologists and charge
 * technologists (as recurring events), and for charge technologists, who follow the whole
 * department, every active room's exams and turnovers. Other roles get an empty calendar.
 */
export async function userFeed(db: Knex, ctx: FeedContext, user: UserRecord, now: Date): Promise<string> {
  const feed = await newFeed(db, ctx, user.displayName || user.username, now);
  const rooms: Room[] = await db('rooms').where({ active: true }).orderBy('id').select('id', 'name');
  if (user.role === 'tech' || user.role === 'charge') await addShiftTasks(db, feed, rooms);
  if (user.role === 'charge') await addRooms(db, feed, rooms, now);
  return finish(feed);
}

/** Every content line ends in CRLF (RFC 5545 §3.1), the last one too; ical-generator leaves it off. */
function finish(feed: Feed): string {
  const text = feed.cal.toString();
  return text.endsWith('\r\n') ? text : `${text}\r\n`;
}

async function addRooms(db: Knex, feed: Feed, rooms: Room[], now: Date): Promise<void> {
  const { from, to } = feedWindow(feed.siteZone, now);
  const ids = rooms.map((r) => r.id);
  const names = new Map(rooms.map((r) => [r.id, r.name]));
  const exams: ExamRow[] = await db('exams').whereIn('room_id', ids).whereBetween('day', [from, to]).orderBy('start_ms');
  const gone: CancelledRow[] = await db('cancelled_exams').whereBetween('day', [from, to]).orderBy('id');
  const earlier = new Map<number, number>();
  for (const c of gone) earlier.set(c.exam_id, (earlier.get(c.exam_id) ?? 0) + c.version + 1);
  const live = new Map(exams.map((e) => [e.id, e]));
  const liveAnywhere = new Set<number>((await db('exams').whereIn('id', [...earlier.keys()]).pluck('id')) as number[]);

  for (const e of exams) examEvent(feed, e, names.get(e.room_id)!, e.version + (earlier.get(e.id) ?? 0), null);
  const lastCancel = new Map<number, CancelledRow>();
  for (const c of gone) lastCancel.set(c.exam_id, c);
  for (const c of lastCancel.values()) {
    if (liveAnywhere.has(c.exam_id) || !names.has(c.room_id)) continue;
    examEvent(feed, { ...c, id: c.exam_id }, names.get(c.room_id)!, earlier.get(c.exam_id)!, ICalEventStatus.CANCELLED);
  }

  for (const day of [...new Set(exams.map((e) => e.day))].sort()) {
    const plan = await loadDayPlan(db, day);
    for (const room of plan.rooms) {
      if (!names.has(room.id)) continue;
      for (const gap of room.gaps) {
        if (gap.fromExamId === null || gap.requiredMinutes <= 0) continue;
        const before = live.get(gap.fromExamId);
        const next = live.get(gap.toExamId);
        if (!before || !next) continue;
        const end = DateTime.fromISO(gap.readyAt, { setZone: true });
        feed.cal.createEvent({
          id: `turnover-${gap.fromExamId}-${gap.toExamId}@${feed.host}`,
          sequence: before.version + next.version + (earlier.get(before.id) ?? 0) + (earlier.get(next.id) ?? 0),
          stamp: feed.stamp,
          start: local(feed, end.minus({ minutes: gap.requiredMinutes })),
          end: local(feed, end),
          timezone: feed.zone,
          summary: `Turnover after ${before.accession} (${gap.verdict})`,
          description: `${room.name}: turnover needs ${gap.requiredMinutes} min before ${next.accession}; ${gap.availableMinutes} min available.`,
          location: room.name,
        });
      }
    }
  }
}

function examEvent(feed: Feed, e: ExamRow, roomName: string, sequence: number, status: ICalEventStatus | null): void {
  const start = DateTime.fromISO(e.start_at, { setZone: true });
  feed.cal.createEvent({
    id: `exam-${e.id}@${feed.host}`,
    sequence,
    stamp: feed.stamp,
    start: local(feed, start),
    // DTEND is exclusive (RFC 5545 §3.6.1): the minute the exam ends, which the next may start at
    end: local(feed, start.plus({ minutes: e.duration_minutes })),
    timezone: feed.zone,
    summary: `${e.accession} ${e.procedure}`,
    description: `Exam ${e.accession}, ${e.procedure}, ${e.duration_minutes} min in ${roomName}.`,
    location: roomName,
    status: status ?? ICalEventStatus.CONFIRMED,
  });
}

/** A time in the feed's zone (local with TZID), or UTC when the zone has no VTIMEZONE. */
function local(feed: Feed, t: DateTime): DateTime {
  return feed.zone ? t.setZone(feed.zone) : t.toUTC();
}

interface TaskRow {
  id: number;
  label: string;
  rrule: string;
  duration_minutes: number;
  room_name: string;
}

/**
 * Each active shift task as one recurring event: its rule's DTSTART (a wall-clock time, in the
 * rule's TZID or the site's zone) and its RRULE as stored, so a calendar app expands the same
 * occurrences as `ruleOccurrences` does (wall-clock times kept across daylight-saving changes).
 */
async function addShiftTasks(db: Knex, feed: Feed, rooms: Room[]): Promise<void> {
  const tasks: TaskRow[] = await db('shift_tasks as t')
    .join('rooms as r', 'r.id', 't.room_id')
    .whereIn('t.room_id', rooms.map((r) => r.id))
    .andWhere('t.active', true)
    .orderBy('t.id')
    .select('t.id', 't.label', 't.rrule', 't.duration_minutes', 'r.name as room_name');
  for (const task of tasks) {
    const dtstart = /DTSTART(?:;TZID=([^:;\s]+))?:(\d{8}T\d{6})/.exec(task.rrule);
    const rule = /^RRULE:(.+)$/m.exec(task.rrule);
    if (!dtstart || !rule) continue;
    const zone = dtstart[1] ?? feed.siteZone;
    const start = DateTime.fromFormat(dtstart[2], "yyyyLLdd'T'HHmmss", { zone });
    if (!start.isValid) continue;
    const tzid = vtimezone(zone) ? zone : null;
    feed.cal.createEvent({
      id: `shift-task-${task.id}@${feed.host}`,
      sequence: 0,
      stamp: feed.stamp,
      start: tzid ? start : start.toUTC(),
      end: (tzid ? start : start.toUTC()).plus({ minutes: task.duration_minutes }),
      timezone: tzid,
      repeating: `RRULE:${utcUntil(rule[1].trim(), zone)}`,
      summary: `${task.label} (${task.room_name})`,
      location: task.room_name,
    });
  }
}

/**
 * The rules keep UNTIL as a wall-clock time (see shift-task-rules.ts), but with a TZID on DTSTART
 * RFC 5545 §3.3.10 wants UNTIL in UTC: a local UNTIL (a date means its last second) is read in
 * the rule's zone and written in UTC.
 */
export function utcUntil(rule: string, zone: string): string {
  return rule.replace(/UNTIL=(\d{8})(T\d{6})?(Z?)/, (whole, date: string, time: string | undefined, z: string) => {
    if (z) return whole;
    const local = DateTime.fromFormat(`${date}${time ?? 'T235959'}`, "yyyyLLdd'T'HHmmss", { zone });
    return local.isValid ? `UNTIL=${local.toUTC().toFormat("yyyyLLdd'T'HHmmss'Z'")}` : whole;
  });
}

