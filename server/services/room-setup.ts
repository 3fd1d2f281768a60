import type { Knex } from 'knex';
import type { RoomFields, SetupRoom } from '../../shared/api/rooms';
import { NotFoundError, ValidationError } from '../errors';
import { RoomHasExamsError } from '../setup-errors';
import { changedFields, recordAudit, type Actor } from './audit';
import { refuseUnsafeForMr } from './equipment';
import { roomWeeks, saveRoomWeek, weekText } from './room-hours';
import { mrZonesText, readMrZones, saveMrZones } from './room-mr-zones';
import { refuseTakenHl7Code, toRoom } from './rooms';

type RoomRow = Parameters<typeof toRoom>[0] & { active: number | boolean; retired_at: string | null; hl7_code: string | null };

async function toSetupRooms(db: Knex, rows: RoomRow[]): Promise<SetupRoom[]> {
  const rooms = rows.map(toRoom);
  const [weeks, zones] = await Promise.all([roomWeeks(db, rooms), readMrZones(db, rooms.map((r) => r.id))]);
  return rooms.map((room, i) => ({
    ...room,
    retired: !rows[i]!.active,
    retiredAt: rows[i]!.retired_at,
    hl7Code: rows[i]!.hl7_code ?? null,
    week: weeks.get(room.id)!,
    mrZones: room.modality === 'MR' ? (zones.get(room.id) ?? null) : null,
  }));
}

/** Every room, retired ones last: Setup edits them all; the board and plan list only active ones. */
export async function listSetupRooms(db: Knex): Promise<SetupRoom[]> {
  const rows: RoomRow[] = await db('rooms').orderBy([{ column: 'active', order: 'desc' }, { column: 'sort_order' }, { column: 'name' }]);
  return toSetupRooms(db, rows);
}

export async function getSetupRoom(db: Knex, id: number): Promise<SetupRoom> {
  const row: RoomRow | undefined = await db('rooms').where({ id }).first();
  if (!row) throw new NotFoundError(`No room ${id}.`);
  return (await toSetupRooms(db, [row]))[0]!;
}

function audited(room: Omit<RoomFields, 'week' | 'mrZones'> & Partial<Pick<SetupRoom, 'week' | 'mrZones'>>) {
  return {
    name: room.name,
    modality: room.modality,
    airChangesPerHour: room.airChangesPerHour,
    staff: room.staff,
    opensAt: room.opensAt,
    closesAt: room.closesAt,
    ...(room.hl7Code ? { hl7Code: room.hl7Code } : {}),
    ...(room.week ? { week: weekText(room.week) } : {}),
    ...(room.mrZones ? { mrZones: mrZonesText(room.mrZones) } : {}),
  };
}

/**
 * Name, modality, air changes, usual staff and hours (the usual pair, and the week when given);
 * every plan recomputes (the setup version rises).
 */
export async function updateRoom(db: Knex, id: number, input: RoomFields, by: Actor, now: Date): Promise<SetupRoom> {
  if (input.closesAt <= input.opensAt) {
    throw new ValidationError('The room must close after it opens.', { problems: [{ field: 'closesAt', message: 'must be after the opening time' }] });
  }
  return db.transaction(async (trx) => {
    const before = await getSetupRoom(trx, id);
    const clash = await trx('rooms').whereRaw('lower(name) = lower(?)', [input.name]).whereNot({ id }).first('id');
    if (clash) throw new ValidationError(`A room named "${input.name}" already exists.`, { problems: [{ field: 'name', message: 'already exists' }] });
    await refuseTakenHl7Code(trx, input.hl7Code ?? null, id);
    if (input.modality === 'MR' && before.modality !== 'MR') {
      // a room becoming MR keeps its kit only if all of it may enter Zone IV
      const kit = await trx('equipment as e').join('room_kit as k', 'k.equipment_id', 'e.id').where('k.room_id', id).select('e.id', 'e.name', 'e.marking');
      refuseUnsafeForMr(kit, input.name);
    }
    await trx('rooms').where({ id }).update({
      name: input.name,
      modality: input.modality,
      air_changes_per_hour: input.airChangesPerHour,
      staff: input.staff,
      opens_at: input.opensAt,
      closes_at: input.closesAt,
      ...(input.hl7Code !== undefined ? { hl7_code: input.hl7Code } : {}),
    });
    if (input.week) await saveRoomWeek(trx, id, input.week);
    if (input.mrZones) await saveMrZones(trx, id, input.mrZones);
    const after = await getSetupRoom(trx, id);
    const diff = changedFields(audited(before), audited(after));
    if (Object.keys(diff.after).length > 0) await recordAudit(trx, by, { area: 'room', action: 'changed', subject: after.name, ...diff }, now);
    return after;
  });
}

/**
 * A retired room leaves the board and the plan; its exams, turnovers and log stay (a room with
 * history is never deleted). Refused while exams are booked in it from `today` on: move them first.
 */
export async function retireRoom(db: Knex, id: number, today: string, by: Actor, now: Date): Promise<SetupRoom> {
  return db.transaction(async (trx) => {
    const before = await getSetupRoom(trx, id);
    if (before.retired) return before;
    const [{ n, first }] = await trx('exams').where({ room_id: id }).andWhere('day', '>=', today).count({ n: '*' }).min({ first: 'day' });
    if (Number(n) > 0) {
      throw new RoomHasExamsError(`${before.name} has ${n} exam${Number(n) === 1 ? '' : 's'} booked from ${first} on: move them to another room first.`, {
        count: Number(n),
        firstDay: String(first),
      });
    }
    await trx('rooms').where({ id }).update({ active: false, retired_at: now.toISOString() });
    await recordAudit(trx, by, { area: 'room', action: 'retired', subject: before.name, before: { retired: false }, after: { retired: true } }, now);
    return getSetupRoom(trx, id);
  });
}

/** Back on the board and plan. */
export async function restoreRoom(db: Knex, id: number, by: Actor, now: Date): Promise<SetupRoom> {
  return db.transaction(async (trx) => {
    const before = await getSetupRoom(trx, id);
    if (!before.retired) return before;
    await trx('rooms').where({ id }).update({ active: true, retired_at: null });
    await recordAudit(trx, by, { area: 'room', action: 'restored', subject: before.name, before: { retired: true }, after: { retired: false } }, now);
    return getSetupRoom(trx, id);
  });
}
