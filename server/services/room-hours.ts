import type { Knex } from 'knex';
import { DateTime } from 'luxon';
import type { RoomDay, RoomHoursOnDay } from '../../shared/api/room-hours';
import type { Room } from '../../shared/api/rooms';
import { listRooms } from './rooms';

interface HoursRow {
  room_id: number;
  weekday: number;
  closed: number | boolean;
  opens_at: string;
  closes_at: string;
}

/** ISO weekday (1 Monday … 7 Sunday) of a `YYYY-MM-DD` date. */
export function weekdayOf(day: string): number {
  return DateTime.fromISO(day, { zone: 'UTC' }).weekday;
}

/** Each room's week, Monday to Sunday: a weekday without its own row keeps the room's usual hours. */
export async function roomWeeks(db: Knex, rooms: readonly Pick<Room, 'id' | 'opensAt' | 'closesAt'>[]): Promise<Map<number, RoomDay[]>> {
  const rows: HoursRow[] = await db('room_hours').whereIn('room_id', rooms.map((r) => r.id));
  const own = new Map(rows.map((r) => [`${r.room_id}|${r.weekday}`, r]));
  return new Map(
    rooms.map((room) => [
      room.id,
      [1, 2, 3, 4, 5, 6, 7].map((weekday) => {
        const row = own.get(`${room.id}|${weekday}`);
        return row
          ? { weekday, closed: Boolean(row.closed), opensAt: row.opens_at, closesAt: row.closes_at }
          : { weekday, closed: false, opensAt: room.opensAt, closesAt: room.closesAt };
      }),
    ]),
  );
}

/** Replaces a room's week (inside the caller's transaction). */
export async function saveRoomWeek(trx: Knex.Transaction, roomId: number, week: readonly RoomDay[]): Promise<void> {
  await trx('room_hours').where({ room_id: roomId }).delete();
  await trx('room_hours').insert(week.map((d) => ({ room_id: roomId, weekday: d.weekday, closed: d.closed, opens_at: d.opensAt, closes_at: d.closesAt })));
}

/** A room as one date sees it: that weekday's hours, and whether it is closed all day. */
export type RoomOnDay = Room & Pick<RoomHoursOnDay, 'closed'>;

/** The active rooms with their hours on `day` (the plan, the board and the checklist read these). */
export async function roomsOnDay(db: Knex, day: string): Promise<RoomOnDay[]> {
  const rooms = await listRooms(db);
  const weekday = weekdayOf(day);
  const rows: HoursRow[] = await db('room_hours').where({ weekday });
  const byRoom = new Map(rows.map((r) => [r.room_id, r]));
  return rooms.map((room) => {
    const row = byRoom.get(room.id);
    return row ? { ...room, opensAt: row.opens_at, closesAt: row.closes_at, closed: Boolean(row.closed) } : { ...room, closed: false };
  });
}

/** How the week reads in the audit: one short line per weekday. */
export function weekText(week: readonly RoomDay[]): string {
  const names = ['Mon', 'Tue', 'Wed', 'Thu', 'Fri', 'Sat', 'Sun'];
  return week.map((d) => `${names[d.weekday - 1]} ${d.closed ? 'closed' : `${d.opensAt}–${d.closesAt}`}`).join(', ');
}
