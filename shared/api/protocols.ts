/**
 * Setup → Products and Protocols: the site's disinfectants and its versioned turnover protocols
 * per DICOM modality (`*` = the fallback for modalities without their own). The engine computes
 * every turnover from these; nothing in production falls back to invented defaults.
 */
import { z } from 'zod';
import type { Mobility, Precaution, Verdict } from '../turnover/model';
import { NO_PROTOCOL_MESSAGE } from '../turnover/no-protocol';
import type { Problem } from './errors';

export { NO_PROTOCOL_MESSAGE };

/* ---------------------------------------------------------------- limits */

/** Hands-on minutes of one step (a precaution's `don` step, an adjustment's `setMinutes` too). */
export const HANDS_ON_MINUTES = { min: 0, max: 120 } as const;
/** Dry minutes after a step (after the product's contact time, for a disinfecting step). */
export const DRY_MINUTES = { min: 0, max: 240 } as const;
/** Label contact time and stays-wet time of a product, in minutes (decimals allowed, > 0). */
export const PRODUCT_MINUTES_MAX = 240;
/** Steps in one protocol's turnover or opening. */
export const PROTOCOL_STEPS_MAX = 40;
/** Days an effect preview looks at: today and the next 7. */
export const PREVIEW_DAYS = 8;

/** Below this label contact time the answer carries {@link SHORT_CONTACT_CAUTION}. */
export const SHORT_CONTACT_MINUTES = 1;

/**
 * Said when a product's contact time is under 1 minute (saved anyway: the label rules).
 * Source: CDC/HICPAC, Guideline for Disinfection and Sterilization in Healthcare Facilities
 * (2008), Table 1: low-level disinfection of noncritical surfaces, contact time ≥ 1 minute.
 */
export const SHORT_CONTACT_CAUTION =
  'This contact time is under 1 minute: below the ≥ 1 minute that CDC’s 2008 Guideline for Disinfection and ' +
  'Sterilization in Healthcare Facilities gives for low-level disinfection of noncritical surfaces. ' +
  'The product’s label is the legal instruction and rules; check it and your infection-prevention policy.';

/* ---------------------------------------------------------------- products */

/** `standard` (routine surface disinfectant), `sporicidal` (e.g. for enteric precautions), `other`. */
export const PRODUCT_KINDS = ['standard', 'sporicidal', 'other'] as const;
export type ProductKind = (typeof PRODUCT_KINDS)[number];

export const PRODUCT_KIND_LABELS: Record<ProductKind, string> = {
  standard: 'Standard',
  sporicidal: 'Sporicidal',
  other: 'Other',
};

const productMinutes = (what: string) =>
  z
    .number({ message: `${what} must be a number of minutes` })
    .refine(Number.isFinite, `${what} must be a number of minutes`)
    .gt(0, `${what} must be more than 0 minutes`)
    .max(PRODUCT_MINUTES_MAX, `${what} must be at most ${PRODUCT_MINUTES_MAX} minutes`);

/** `POST /api/products`, `PUT /api/products/:id`, `POST /api/products/:id/preview`. */
export const productInputSchema = z.object({
  name: z.string().trim().min(1, 'a product needs a name').max(80, 'use at most 80 characters'),
  kind: z.enum(PRODUCT_KINDS, { message: `use one of ${PRODUCT_KINDS.join(', ')}` }),
  /** The label's contact (wet) time. */
  contactMinutes: productMinutes('the contact time'),
  /** How long one application stays wet on a surface (label or a site test); null: not known. */
  staysWetMinutes: productMinutes('the stays-wet time').nullable().default(null),
  /** Registration number as printed on the label (free text, e.g. an EPA Reg. No.). */
  registration: z.string().trim().max(80, 'use at most 80 characters').default(''),
  notes: z.string().trim().max(500, 'use at most 500 characters').default(''),
});
export type ProductInput = z.input<typeof productInputSchema>;
export type ProductFields = z.output<typeof productInputSchema>;

export interface ProductView {
  id: number;
  /** The key the engine, checklists and the cleaning log use for it (its id as text). */
  key: string;
  name: string;
  kind: ProductKind;
  contactMinutes: number;
  staysWetMinutes: number | null;
  registration: string;
  notes: string;
  retired: boolean;
  /** Applications one disinfecting step takes: ⌈contact ÷ stays-wet⌉ when it dries first, else 1. */
  applications: number;
  /** Modalities whose current or a future protocol version uses it. */
  usedBy: string[];
}

/** A save's non-blocking remarks (e.g. the short-contact caution). */
export interface SaveWarning {
  field: string;
  message: string;
}

/** `GET /api/products`. */
export interface ProductList {
  products: ProductView[];
}

/** `POST /api/products`, `PUT /api/products/:id`, `POST /api/products/:id/retire`. */
export interface ProductAnswer {
  product: ProductView;
  warnings: SaveWarning[];
}

/* ---------------------------------------------------------------- protocols */

/** Modality codes a protocol may be for: a DICOM (0008,0060) code such as MR or CT, or `*`. */
export const FALLBACK_MODALITY = '*';
export const modalitySchema = z
  .string()
  .trim()
  .transform((m) => m.toUpperCase())
  .pipe(z.string().regex(/^(\*|[A-Z0-9]{2,16})$/, 'use a DICOM modality code (e.g. MR, CT) or * for every other modality'));

/** The precaution levels a protocol sets extras for (`none` has none). */
export const PRECAUTION_LEVELS = ['contact', 'enteric', 'droplet', 'airborne'] as const satisfies readonly Precaution[];
export type PrecautionLevel = (typeof PRECAUTION_LEVELS)[number];
export const MOBILITY_LEVELS = ['ambulatory', 'wheelchair', 'stretcher'] as const satisfies readonly Mobility[];

const stepKey = z
  .string()
  .trim()
  .regex(/^[a-z][a-z0-9-]{0,29}$/, 'use 1–30 lower-case letters, digits or dashes, starting with a letter');
const handsOn = z
  .number({ message: 'hands-on time must be a number of minutes' })
  .min(HANDS_ON_MINUTES.min, `hands-on time must be ${HANDS_ON_MINUTES.min}–${HANDS_ON_MINUTES.max} minutes`)
  .max(HANDS_ON_MINUTES.max, `hands-on time must be ${HANDS_ON_MINUTES.min}–${HANDS_ON_MINUTES.max} minutes`);
const productId = z.number().int('choose a product').positive('choose a product');

export const stepNeedSchema = z.object({
  key: stepKey,
  /** true: the other step done and its surface dry; false: done. */
  dry: z.boolean().default(false),
});

/** When a step is part of a turnover at all; every condition given must hold. */
export const onlyWhenSchema = z.object({
  /** The arriving exam has contrast (e.g. injector prep). */
  contrast: z.boolean().optional(),
  /** The coil changes between the two exams. */
  coilChange: z.boolean().optional(),
  /** The leaving patient moved so (any of these). */
  mobility: z.array(z.enum(MOBILITY_LEVELS)).min(1, 'choose at least one mobility').optional(),
  /** The leaving exam was under one of these precautions. */
  precaution: z.array(z.enum(['none', ...PRECAUTION_LEVELS])).min(1, 'choose at least one precaution').optional(),
});
export type OnlyWhen = z.output<typeof onlyWhenSchema>;

export const protocolStepSchema = z.object({
  key: stepKey,
  label: z.string().trim().min(1, 'a step needs a label').max(80, 'use at most 80 characters'),
  handsOnMinutes: handsOn,
  dryMinutes: z
    .number({ message: 'dry time must be a number of minutes' })
    .min(DRY_MINUTES.min, `dry time must be ${DRY_MINUTES.min}–${DRY_MINUTES.max} minutes`)
    .max(DRY_MINUTES.max, `dry time must be ${DRY_MINUTES.min}–${DRY_MINUTES.max} minutes`)
    .default(0),
  /** A disinfecting step waits its product's contact time (then its dry time). */
  disinfects: z.boolean().default(false),
  /** This step's product; null: the protocol's default product. */
  productId: productId.nullable().default(null),
  needs: z.array(stepNeedSchema).max(PROTOCOL_STEPS_MAX).default([]),
  onlyWhen: onlyWhenSchema.default({}),
  /** Needs every other step's hands-on done (e.g. gloves off and hand hygiene). */
  afterAllOthers: z.boolean().default(false),
});
export type ProtocolStepInput = z.input<typeof protocolStepSchema>;
export type ProtocolStepFields = z.output<typeof protocolStepSchema>;

/** Minutes added to (or set on) a step's hands-on time, by the step's key. */
export const stepAdjustmentSchema = z
  .object({ step: stepKey, addMinutes: handsOn.optional(), setMinutes: handsOn.optional() })
  .refine((a) => a.addMinutes !== undefined || a.setMinutes !== undefined, { message: 'give addMinutes or setMinutes', path: ['addMinutes'] });

/** What a precaution level of the leaving exam adds: protective equipment, longer steps, a product. */
export const precautionExtrasSchema = z.object({
  /** Protective equipment put on first; every first step waits for it. */
  don: z.object({ label: z.string().trim().min(1, 'a step needs a label').max(80), handsOnMinutes: handsOn }).nullable().default(null),
  /** E.g. longer hand hygiene: `{ step: 'hygiene', setMinutes: 3 }`. */
  adjust: z.array(stepAdjustmentSchema).max(PROTOCOL_STEPS_MAX).default([]),
  /** Product for every disinfecting step after such a patient (e.g. sporicidal); null: each step's own. */
  productId: productId.nullable().default(null),
  /** The room stays closed until the air is exchanged (CDC 2003, Appendix B, Table B.1). */
  airHold: z.boolean().default(false),
});
export type PrecautionExtras = z.output<typeof precautionExtrasSchema>;

const noExtras = { don: null, adjust: [], productId: null, airHold: false };

/** `POST /api/protocols` and `POST /api/protocols/preview`: a protocol's content. */
export const protocolBodySchema = z.object({
  steps: z.array(protocolStepSchema).min(1, 'a protocol needs at least one step').max(PROTOCOL_STEPS_MAX, `at most ${PROTOCOL_STEPS_MAX} steps`),
  openingSteps: z.array(protocolStepSchema).max(PROTOCOL_STEPS_MAX, `at most ${PROTOCOL_STEPS_MAX} steps`).default([]),
  /** Product of disinfecting steps that name none. */
  defaultProductId: productId.nullable().default(null),
  precautions: z
    .object({
      contact: precautionExtrasSchema.default(noExtras),
      enteric: precautionExtrasSchema.default(noExtras),
      droplet: precautionExtrasSchema.default(noExtras),
      airborne: precautionExtrasSchema.default({ ...noExtras, airHold: true }),
    })
    .default({ contact: noExtras, enteric: noExtras, droplet: noExtras, airborne: { ...noExtras, airHold: true } }),
  /** Hands-on changes by the leaving patient's mobility. */
  mobility: z
    .object({
      ambulatory: z.array(stepAdjustmentSchema).default([]),
      wheelchair: z.array(stepAdjustmentSchema).default([]),
      stretcher: z.array(stepAdjustmentSchema).default([]),
    })
    .default({ ambulatory: [], wheelchair: [], stretcher: [] }),
  /** Hands-on changes when the coil changes between two exams. */
  coilChange: z.array(stepAdjustmentSchema).max(PROTOCOL_STEPS_MAX).default([]),
});
export type ProtocolBodyInput = z.input<typeof protocolBodySchema>;
export type ProtocolBody = z.output<typeof protocolBodySchema>;

/** `POST /api/protocols`: a new version of a modality's protocol. */
export const newProtocolVersionSchema = z.object({
  modality: modalitySchema,
  /** `YYYY-MM-DD`, today at the site or later: a past day keeps the version it used. */
  effectiveFrom: z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'use YYYY-MM-DD'),
  note: z.string().trim().max(500, 'use at most 500 characters').default(''),
  body: protocolBodySchema,
});
export type NewProtocolVersionInput = z.input<typeof newProtocolVersionSchema>;
export type NewProtocolVersion = z.output<typeof newProtocolVersionSchema>;

/** `POST /api/protocols/preview`: a draft for a modality (not saved). */
export const protocolPreviewSchema = z.object({ modality: modalitySchema, body: protocolBodySchema });
export type ProtocolPreviewInput = z.input<typeof protocolPreviewSchema>;

/** Which protocol version a plan, turnover or log entry was computed with. */
export interface ProtocolRef {
  id: number;
  modality: string;
  version: number;
  effectiveFrom: string;
}

export interface ProtocolVersionView extends ProtocolRef {
  body: ProtocolBody;
  note: string;
  createdAt: string;
  createdBy: { username: string; displayName: string } | null;
}

/** One modality's protocol: the version in force today, those scheduled, and the older ones. */
export interface ModalityProtocols {
  modality: string;
  current: ProtocolVersionView | null;
  /** Effective after today, earliest first. */
  future: ProtocolVersionView[];
  /** Superseded versions, newest first. */
  history: ProtocolVersionView[];
  /** Rooms (active) of this modality; for `*`, rooms whose modality has no protocol of its own. */
  roomIds: number[];
}

/** `GET /api/protocols`. */
export interface ProtocolList {
  /** `YYYY-MM-DD` at the site: what "current" means. */
  today: string;
  protocols: ModalityProtocols[];
  /** Modalities of active rooms with neither a protocol nor a `*` fallback in force today. */
  missing: string[];
}

/** `POST /api/protocols` (201), `GET /api/protocols/:modality/versions/:version`. */
export interface ProtocolVersionAnswer {
  protocol: ProtocolVersionView;
  warnings: SaveWarning[];
}

/* ---------------------------------------------------------------- effect preview */

/** The gap types a preview compares (before → after). */
export const PREVIEW_GAP_TYPES = [
  'plain',
  'contrast-next',
  'coil-change',
  'contact',
  'enteric',
  'droplet',
  'airborne',
  'opening',
] as const;
export type PreviewGapType = (typeof PREVIEW_GAP_TYPES)[number];

export interface PreviewRequired {
  modality: string;
  gapType: PreviewGapType;
  /** Required minutes with one person (the room's usual staff where a room is known); null: no protocol. */
  before: number | null;
  after: number | null;
}

/** A stored gap whose verdict the draft would change. */
export interface PreviewVerdictChange {
  date: string;
  roomId: number;
  roomName: string;
  /** The arriving exam's start, site time (ISO with offset). */
  time: string;
  /** Leaving (null: the room's opening) and arriving accession. */
  accessions: [string | null, string];
  before: { verdict: Verdict; requiredMinutes: number } | null;
  after: { verdict: Verdict; requiredMinutes: number } | null;
}

/** `POST /api/protocols/preview`, `POST /api/products/:id/preview`. */
export interface EffectPreview {
  /** The days looked at (today and the next 7). */
  days: string[];
  required: PreviewRequired[];
  changes: PreviewVerdictChange[];
  /** The draft's problems that would refuse a save (empty: it would save). */
  problems: Problem[];
  warnings: SaveWarning[];
}

/* ---------------------------------------------------------------- setup checklist */

export interface SetupChecklistItem {
  key: 'rooms' | 'products' | 'protocols' | 'users';
  done: boolean;
  /** What is missing, in words (empty when done). */
  missing: string[];
}

/** `GET /api/setup/checklist` (admin): what a new department still has to set up. */
export interface SetupChecklist {
  complete: boolean;
  items: SetupChecklistItem[];
}
