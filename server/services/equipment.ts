import type { Knex } from 'knex';
import {
  MR_MARKING_LABELS,
  ZONE_IV_MARKINGS,
  type EquipmentFields,
  type EquipmentItem,
} from '../../shared/api/equipment';
import { NotFoundError } from '../errors';
import { KitNotMrSafeError } from '../setup-errors';
import { changedFields, recordAudit, type Actor } from './audit';

interface EquipmentRow {
  id: number;
  name: string;
  kind: string;
  marking: string;
  conditions: string;
  notes: string;
  active: number | boolean;
}

function toItem(row: EquipmentRow, roomIds: number[]): EquipmentItem {
  return {
    id: row.id,
    name: row.name,
    kind: row.kind as EquipmentItem['kind'],
    marking: row.marking as EquipmentItem['marking'],
    conditions: row.conditions,
    notes: row.notes,
    retired: !row.active,
    roomIds,
  };
}

async function itemsWhere(db: Knex, where: (q: Knex.QueryBuilder) => void): Promise<EquipmentItem[]> {
  const query = db<EquipmentRow>('equipment').orderBy([{ column: 'active', order: 'desc' }, { column: 'kind' }, { column: 'name' }]);
  where(query);
  const rows = (await query) as EquipmentRow[];
  const links: { room_id: number; equipment_id: number }[] = await db('room_kit').whereIn('equipment_id', rows.map((r) => r.id));
  return rows.map((row) => toItem(row, links.filter((l) => l.equipment_id === row.id).map((l) => l.room_id)));
}

export function listEquipment(db: Knex): Promise<EquipmentItem[]> {
  return itemsWhere(db, () => {});
}

async function getItem(db: Knex, id: number): Promise<EquipmentItem> {
  const [item] = await itemsWhere(db, (q) => q.where({ id }));
  if (!item) throw new NotFoundError(`No equipment item ${id}.`);
  return item;
}

function audited(item: EquipmentItem | EquipmentFields) {
  return { name: item.name, kind: item.kind, marking: MR_MARKING_LABELS[item.marking], conditions: item.conditions, notes: item.notes };
}

/**
 * ASTM F2503 and the ACR's Zone IV rule: only MR Safe or MR Conditional items enter the magnet
 * room, so an MR room's kit refuses MR Unsafe and unmarked items.
 */
export function refuseUnsafeForMr(items: { id: number; name: string; marking: string }[], roomName: string): void {
  const unsafe = items.filter((i) => !(ZONE_IV_MARKINGS as readonly string[]).includes(i.marking));
  if (unsafe.length === 0) return;
  const names = unsafe.map((i) => `${i.name} (${MR_MARKING_LABELS[i.marking as EquipmentItem['marking']] ?? i.marking})`).join(', ');
  const message =
    `${roomName} is an MR room: its kit enters ACR Zone IV (the magnet room), where only items marked MR Safe or MR Conditional ` +
    `under ASTM F2503 may go. Not allowed: ${names}.`;
  throw new KitNotMrSafeError(message, {
    items: unsafe.map(({ id, name, marking }) => ({ id, name, marking })),
    problems: unsafe.map((i) => ({ field: 'equipmentIds', message: `${i.name} is not MR Safe or MR Conditional (ASTM F2503); it may not enter Zone IV` })),
  });
}

export async function createEquipment(db: Knex, input: EquipmentFields, by: Actor, now: Date): Promise<EquipmentItem> {
  return db.transaction(async (trx) => {
    const [{ id }] = await trx('equipment').insert({ ...input, active: true, created_at: now.toISOString() }).returning('id');
    const item = await getItem(trx, id as number);
    await recordAudit(trx, by, { area: 'equipment', action: 'created', subject: item.name, before: null, after: audited(item) }, now);
    return item;
  });
}

/** A new marking must still fit every MR room whose kit holds the item. */
export async function updateEquipment(db: Knex, id: number, input: EquipmentFields, by: Actor, now: Date): Promise<EquipmentItem> {
  return db.transaction(async (trx) => {
    const before = await getItem(trx, id);
    const mrRooms: { name: string }[] = await trx('rooms as r')
      .join('room_kit as k', 'k.room_id', 'r.id')
      .where({ 'k.equipment_id': id, 'r.modality': 'MR' })
      .select('r.name');
    for (const room of mrRooms) refuseUnsafeForMr([{ id, name: input.name, marking: input.marking }], room.name);
    await trx('equipment').where({ id }).update(input);
    const after = await getItem(trx, id);
    const diff = changedFields(audited(before), audited(after));
    if (Object.keys(diff.after).length > 0) await recordAudit(trx, by, { area: 'equipment', action: 'changed', subject: after.name, ...diff }, now);
    return after;
  });
}

/** Retired items leave every kit; the audit keeps what they were. */
export async function retireEquipment(db: Knex, id: number, by: Actor, now: Date): Promise<EquipmentItem> {
  return db.transaction(async (trx) => {
    const before = await getItem(trx, id);
    if (before.retired) return before;
    await trx('room_kit').where({ equipment_id: id }).del();
    await trx('equipment').where({ id }).update({ active: false });
    await recordAudit(trx, by, { area: 'equipment', action: 'retired', subject: before.name, before: { retired: false, roomIds: before.roomIds }, after: { retired: true, roomIds: [] } }, now);
    return getItem(trx, id);
  });
}

export async function roomKit(db: Knex, roomId: number): Promise<EquipmentItem[]> {
  const room = await db('rooms').where({ id: roomId }).first('id');
  if (!room) throw new NotFoundError(`No room ${roomId}.`);
  return itemsWhere(db, (q) => q.whereIn('id', db('room_kit').where({ room_id: roomId }).select('equipment_id')));
}

/** Replaces a room's kit; an MR room refuses what may not enter Zone IV. */
export async function setRoomKit(db: Knex, roomId: number, equipmentIds: number[], by: Actor, now: Date): Promise<EquipmentItem[]> {
  const ids = [...new Set(equipmentIds)];
  return db.transaction(async (trx) => {
    const room: { id: number; name: string; modality: string; active: number | boolean } | undefined = await trx('rooms').where({ id: roomId }).first();
    if (!room || !room.active) throw new NotFoundError(`No room ${roomId}.`);
    const rows: EquipmentRow[] = await trx('equipment').whereIn('id', ids).andWhere({ active: true });
    const missing = ids.filter((id) => !rows.some((r) => r.id === id));
    if (missing.length > 0) throw new NotFoundError(`No equipment item ${missing.join(', ')}.`);
    if (room.modality === 'MR') refuseUnsafeForMr(rows, room.name);
    const before = (await roomKit(trx, roomId)).map((i) => i.name);
    await trx('room_kit').where({ room_id: roomId }).del();
    if (ids.length > 0) await trx('room_kit').insert(ids.map((id) => ({ room_id: roomId, equipment_id: id })));
    const kit = await roomKit(trx, roomId);
    await recordAudit(trx, by, { area: 'kit', action: 'kit changed', subject: room.name, before: { items: before }, after: { items: kit.map((i) => i.name) } }, now);
    return kit;
  });
}
