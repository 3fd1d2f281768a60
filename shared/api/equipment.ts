import { z } from 'zod';

/** What a department keeps on a cleaning kit or makes a room up with. */
export const EQUIPMENT_KINDS = ['coil', 'cushion', 'cart', 'bucket', 'mop', 'spray-bottle'] as const;
export type EquipmentKind = (typeof EQUIPMENT_KINDS)[number];

export const EQUIPMENT_KIND_LABELS: Record<EquipmentKind, string> = {
  coil: 'Coil',
  cushion: 'Cushion',
  cart: 'Cart',
  bucket: 'Bucket',
  mop: 'Mop',
  'spray-bottle': 'Spray bottle',
};

/**
 * ASTM F2503 marking of items in the MR environment: MR Safe (no known hazard in any MR
 * environment), MR Conditional (safe under stated conditions), MR Unsafe (keep out); plus
 * "not marked", which counts as unsafe until someone checks it.
 */
export const MR_MARKINGS = ['mr-safe', 'mr-conditional', 'mr-unsafe', 'not-marked'] as const;
export type MrMarking = (typeof MR_MARKINGS)[number];

export const MR_MARKING_LABELS: Record<MrMarking, string> = {
  'mr-safe': 'MR Safe',
  'mr-conditional': 'MR Conditional',
  'mr-unsafe': 'MR Unsafe',
  'not-marked': 'not marked',
};

/** Markings that may enter ACR Zone IV (the magnet room), so an MR room's kit. */
export const ZONE_IV_MARKINGS: readonly MrMarking[] = ['mr-safe', 'mr-conditional'];

export const equipmentInputSchema = z
  .object({
    name: z.string().trim().min(1, 'an item needs a name').max(80, 'use at most 80 characters'),
    kind: z.enum(EQUIPMENT_KINDS, { message: `use one of ${EQUIPMENT_KINDS.join(', ')}` }),
    marking: z.enum(MR_MARKINGS, { message: `use one of ${MR_MARKINGS.join(', ')}` }),
    /** MR Conditional only: the conditions from the label (field strength, spatial gradient, …). */
    conditions: z.string().trim().max(500, 'use at most 500 characters').default(''),
    notes: z.string().trim().max(500, 'use at most 500 characters').default(''),
  })
  .superRefine((item, ctx) => {
    if (item.marking === 'mr-conditional' && item.conditions === '') {
      ctx.addIssue({ code: 'custom', path: ['conditions'], message: 'an MR Conditional item needs its conditions from the label' });
    }
  });
export type EquipmentInput = z.input<typeof equipmentInputSchema>;
export type EquipmentFields = z.output<typeof equipmentInputSchema>;

export interface EquipmentItem {
  id: number;
  name: string;
  kind: EquipmentKind;
  marking: MrMarking;
  conditions: string;
  notes: string;
  retired: boolean;
  /** Rooms whose kit holds it. */
  roomIds: number[];
}

/** `PUT /api/rooms/:id/kit`: the room's whole kit. */
export const kitInputSchema = z.object({
  equipmentIds: z.array(z.number().int().positive()).max(200, 'at most 200 items in one kit'),
});
