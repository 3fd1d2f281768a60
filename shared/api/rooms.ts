import { z } from 'zod';
import { AIR_CHANGES_PER_HOUR, ROOM_NAME_MAX, TURNOVER_STAFF } from './limits';
import { mrZonesSchema, type MrZones } from './mr-zones';
import { hhmm, roomWeekSchema, type RoomDay } from './room-hours';

/** A room's HL7 location code (AIL-3) is at most this long. */
export const HL7_CODE_MAX = 60;

/**
 * DICOM modality codes, attribute (0008,0060), PS3.3 C.7.3.1.1.1 — the subset an imaging
 * department books scan rooms for.
 */
export const MODALITIES = ['MR', 'CT', 'US', 'CR', 'DX', 'NM', 'PT', 'MG', 'XA', 'RF', 'OT'] as const;
export type Modality = (typeof MODALITIES)[number];

export const roomInputSchema = z.object({
  name: z.string().trim().min(1, 'a room needs a name').max(ROOM_NAME_MAX),
  modality: z.enum(MODALITIES, { message: `use a DICOM modality code (${MODALITIES.join(', ')})` }),
  airChangesPerHour: z
    .number()
    .min(AIR_CHANGES_PER_HOUR.min, `at least ${AIR_CHANGES_PER_HOUR.min} air change per hour`)
    .max(AIR_CHANGES_PER_HOUR.max, `at most ${AIR_CHANGES_PER_HOUR.max} air changes per hour`),
  staff: z.number().int().min(TURNOVER_STAFF.min).max(TURNOVER_STAFF.max).default(1),
  opensAt: hhmm.default('07:00'),
  closesAt: hhmm.default('19:00'),
  /** Hours per weekday, Monday to Sunday; a weekday without its own hours keeps `opensAt`–`closesAt`. */
  week: roomWeekSchema.optional(),
  /** What the booking feed sends for this room in AIL-3 (matched before the name); '' or null: none. Left out: kept. */
  hl7Code: z.string().trim().max(HL7_CODE_MAX, `at most ${HL7_CODE_MAX} characters`).nullable().optional().transform((code) => (code === '' ? null : code)),
  /** MR rooms only: the ACR zone layout (where the kit is kept, what is Zone IV). */
  mrZones: mrZonesSchema.optional(),
}).superRefine((room, ctx) => {
  if (room.mrZones && room.modality !== 'MR') ctx.addIssue({ code: 'custom', path: ['mrZones'], message: 'only an MR room has MR zones' });
});
export type RoomInput = z.input<typeof roomInputSchema>;
export type RoomFields = z.output<typeof roomInputSchema>;

export interface Room {
  id: number;
  name: string;
  modality: Modality;
  airChangesPerHour: number;
  staff: number;
  opensAt: string;
  closesAt: string;
}

/** A room as Setup lists it: retired rooms too (they leave the board and plan, never the log). */
export interface SetupRoom extends Room {
  retired: boolean;
  retiredAt: string | null;
  /** Monday to Sunday: each weekday's own hours, or the usual ones where it has none. */
  week: RoomDay[];
  /** The booking feed's location code for this room (AIL-3), matched before the room's name. */
  hl7Code: string | null;
  /** An MR room's zone layout; null for other rooms and an MR room not yet described. */
  mrZones: MrZones | null;
}
