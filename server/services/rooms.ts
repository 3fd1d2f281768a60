import type { Knex } from 'knex';
import type { Room, RoomFields } from '../../shared/api/rooms';
import { ValidationError } from '../errors';
import { recordAudit, type Actor } from './audit';
import { saveRoomWeek, weekText } from './room-hours';
import { mrZonesText, saveMrZones } from './room-mr-zones';
import { readSettings } from './settings';
import { addDefaultShiftTasks } from './shift-tasks';

interface RoomRow {
  id: number;
  name: string;
  modality: string;
  air_changes_per_hour: number;
  staff: number;
  opens_at: string;
  closes_at: string;
}

export function toRoom(row: RoomRow): Room {
  return {
    id: row.id,
    name: row.name,
    modality: row.modality as Room['modality'],
    airChangesPerHour: row.air_changes_per_hour,
    staff: row.staff,
    opensAt: row.opens_at,
    closesAt: row.closes_at,
  };
}

/** Two rooms cannot answer to one HL7 location code (case aside): the feed would not know which. */
export async function refuseTakenHl7Code(db: Knex, code: string | null, roomId: number | null): Promise<void> {
  if (!code) return;
  const q = db('rooms').whereRaw('lower(hl7_code) = lower(?)', [code]);
  if (roomId !== null) q.whereNot({ id: roomId });
  const taken = await q.first('name');
  if (taken) throw new ValidationError(`The HL7 location code "${code}" is already ${taken.name}'s.`, { problems: [{ field: 'hl7Code', message: `already ${taken.name}'s` }] });
}

export async function listRooms(db: Knex): Promise<Room[]> {
  const rows: RoomRow[] = await db('rooms').where({ active: true }).orderBy([{ column: 'sort_order' }, { column: 'name' }]);
  return rows.map(toRoom);
}

/** `by`: who made it in Setup (recorded in the setup audit); seeds leave it out. */
export async function createRoom(db: Knex, room: RoomFields, now: Date, by?: Actor): Promise<Room> {
  const clash = await db('rooms').whereRaw('lower(name) = lower(?)', [room.name]).first();
  if (clash) throw new ValidationError(`A room named "${room.name}" already exists.`, { problems: [{ field: 'name', message: 'already exists' }] });
  await refuseTakenHl7Code(db, room.hl7Code ?? null, null);
  const [{ max }] = await db('rooms').max({ max: 'sort_order' });
  const id = await db.transaction(async (trx) => {
    const [{ id: roomId }] = await trx('rooms').insert({
      name: room.name,
      modality: room.modality,
      air_changes_per_hour: room.airChangesPerHour,
      staff: room.staff,
      opens_at: room.opensAt,
      closes_at: room.closesAt,
      hl7_code: room.hl7Code ?? null,
      sort_order: (Number(max) || 0) + 1,
      created_at: now.toISOString(),
    }).returning('id');
    if (room.week) await saveRoomWeek(trx, roomId, room.week);
    if (room.mrZones) await saveMrZones(trx, roomId, room.mrZones);
    // every new room starts with our default shift tasks (wipe-downs, scanner QA, deep clean)
    await addDefaultShiftTasks(trx, roomId, room, now, (await readSettings(trx)).timezone);
    if (by) {
      const { name, modality, airChangesPerHour, staff, opensAt, closesAt, week } = room;
      const after = {
        name, modality, airChangesPerHour, staff, opensAt, closesAt,
        ...(week ? { week: weekText(week) } : {}),
        ...(room.mrZones ? { mrZones: mrZonesText(room.mrZones) } : {}),
      };
      await recordAudit(trx, by, { area: 'room', action: 'created', subject: name, before: null, after }, now);
    }
    return roomId;
  });
  return toRoom((await db<RoomRow>('rooms').where({ id }).first())!);
}
