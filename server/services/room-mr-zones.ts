import type { Knex } from 'knex';
import { KIT_ZONE_LABELS, type KitZone, type MrZones } from '../../shared/api/mr-zones';

interface ZonesRow {
  room_id: number;
  kit_kept_in: KitZone | null;
  zone_iv_areas: string;
  notes: string;
}

/** MR rooms' zone layouts by room id (rooms without one are absent). */
export async function readMrZones(db: Knex, roomIds: readonly number[]): Promise<Map<number, MrZones>> {
  const rows: ZonesRow[] = await db('room_mr_zones').whereIn('room_id', roomIds);
  return new Map(rows.map((r) => [r.room_id, { kitKeptIn: r.kit_kept_in, zoneIvAreas: r.zone_iv_areas, notes: r.notes }]));
}

/** Replaces an MR room's layout (inside the caller's transaction). */
export async function saveMrZones(trx: Knex.Transaction, roomId: number, zones: MrZones): Promise<void> {
  await trx('room_mr_zones')
    .insert({ room_id: roomId, kit_kept_in: zones.kitKeptIn, zone_iv_areas: zones.zoneIvAreas, notes: zones.notes })
    .onConflict('room_id')
    .merge();
}

/** How the layout reads in the audit. */
export function mrZonesText(zones: MrZones): string {
  const kept = zones.kitKeptIn ? `kit kept in ${KIT_ZONE_LABELS[zones.kitKeptIn]}` : 'kit place not said';
  return [kept, zones.zoneIvAreas && `Zone IV: ${zones.zoneIvAreas}`, zones.notes && `notes: ${zones.notes}`].filter(Boolean).join('; ');
}
