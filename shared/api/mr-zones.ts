import { z } from 'zod';

/**
 * The ACR's four MR safety zones (ACR Manual on MR Safety; ACR Guidance Document on MR Safe
 * Practices, 2013): I public, II reception and screening, III restricted and access-controlled,
 * IV the magnet room.
 */
export const ACR_ZONES = [
  { zone: 'I', text: 'public areas' },
  { zone: 'II', text: 'reception and screening' },
  { zone: 'III', text: 'restricted, access-controlled' },
  { zone: 'IV', text: 'the magnet room' },
] as const;

/** Where an MR room's cleaning kit is kept between turnovers. */
export const KIT_ZONES = ['zone-iii', 'zone-iv'] as const;
export type KitZone = (typeof KIT_ZONES)[number];
export const KIT_ZONE_LABELS: Record<KitZone, string> = { 'zone-iii': 'Zone III', 'zone-iv': 'Zone IV' };

export const MR_ZONE_TEXT_MAX = 500;

/** A modest record of an MR room's layout: where the kit is kept, what is Zone IV, notes. */
export const mrZonesSchema = z.object({
  kitKeptIn: z.enum(KIT_ZONES, { message: 'use zone-iii or zone-iv' }).nullable().default(null),
  zoneIvAreas: z.string().trim().max(MR_ZONE_TEXT_MAX, `use at most ${MR_ZONE_TEXT_MAX} characters`).default(''),
  notes: z.string().trim().max(MR_ZONE_TEXT_MAX, `use at most ${MR_ZONE_TEXT_MAX} characters`).default(''),
});
export type MrZonesInput = z.input<typeof mrZonesSchema>;
export type MrZones = z.output<typeof mrZonesSchema>;

/** `GET /api/rooms/:id/kit`: the room's cleaning kit and, for an MR room, its zone layout (null when not described). */
export interface RoomKitAnswer {
  kit: import('./equipment').EquipmentItem[];
  mrZones: MrZones | null;
}
