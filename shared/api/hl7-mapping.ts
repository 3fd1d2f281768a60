import { z } from 'zod';
import { CONTRAST_SPELLINGS, EXAM_LIST_LIMITS, MOBILITIES, PRECAUTIONS } from '../exam-list/columns';

/**
 * The site's booking-feed mapping (Setup → Site → Booking system feed): where an SIU message
 * says an exam's precaution, mobility, coil and contrast. Nothing is read unless the site names
 * a source, so with the defaults a booking gets the import's own (precaution none, ambulatory,
 * no coil, no contrast) and a change keeps what the exam has: never guessed.
 */
export const HL7_MAPPED_FIELDS = ['precaution', 'mobility', 'coil', 'contrast'] as const;
export type Hl7MappedField = (typeof HL7_MAPPED_FIELDS)[number];

/** `obx`: OBX-5 of the first OBX whose OBX-3.1 is `code`; `nte`: the rest of the first NTE-3 that starts with `code`. */
export const HL7_SOURCES = ['none', 'obx', 'nte'] as const;
export type Hl7Source = (typeof HL7_SOURCES)[number];

/** One translation: what the booking system sends (case aside) → our value. */
export interface Hl7ValueMap {
  sent: string;
  value: string;
}

export interface Hl7FieldMapping {
  source: Hl7Source;
  /** The OBX-3.1 observation identifier, or the NTE comment's prefix; '' when `source` is none. */
  code: string;
  /** Sent values that are not already ours (e.g. AIRBORNE-ISO → airborne). */
  values: Hl7ValueMap[];
}

/** What a procedure code (AIS-3.1, case aside) always has: its coil, with or without contrast; null: not said. */
export interface Hl7ProcedureDefaults {
  code: string;
  coil: string | null;
  contrast: boolean | null;
}

export type Hl7Mapping = Record<Hl7MappedField, Hl7FieldMapping> & { procedures: Hl7ProcedureDefaults[] };

export const HL7_MAPPING_LIMITS = { codeMaxChars: 60, valuesPerField: 30, procedures: 500 } as const;

const NOT_READ: Hl7FieldMapping = { source: 'none', code: '', values: [] };

export const DEFAULT_HL7_MAPPING: Hl7Mapping = { precaution: NOT_READ, mobility: NOT_READ, coil: NOT_READ, contrast: NOT_READ, procedures: [] };

/** Our values of a mapped field; null: free text (a coil), up to the import's limit. */
export const HL7_FIELD_VALUES: Record<Hl7MappedField, readonly string[] | null> = {
  precaution: PRECAUTIONS,
  mobility: MOBILITIES,
  coil: null,
  contrast: ['yes', 'no'],
};

/**
 * A value the message gave, in our words: through the site's translations first, then as the
 * import reads a cell (case aside; contrast's spellings); null when it is neither.
 *
 * @example
 * ourValue('precaution', 'AIRBORNE', []); // 'airborne'
 * ourValue('precaution', 'ISO-A', [{ sent: 'iso-a', value: 'airborne' }]); // 'airborne'
 * ourValue('precaution', 'quarantine', []); // null
 */
export function ourValue(field: Hl7MappedField, sent: string, values: Hl7ValueMap[]): string | null {
  const lower = sent.trim().toLowerCase();
  const mapped = values.find((v) => v.sent.toLowerCase() === lower)?.value ?? sent.trim();
  if (field === 'coil') return mapped.length > 0 && [...mapped].length <= EXAM_LIST_LIMITS.coilMaxChars ? mapped : null;
  const our = mapped.toLowerCase();
  if (field === 'contrast') {
    if ((CONTRAST_SPELLINGS.yes as readonly string[]).includes(our)) return 'yes';
    if ((CONTRAST_SPELLINGS.no as readonly string[]).includes(our)) return 'no';
    return null;
  }
  return HL7_FIELD_VALUES[field]!.includes(our) ? our : null;
}

const text = (max: number) => z.string().trim().max(max, `use at most ${max} characters`);
const coilText = text(EXAM_LIST_LIMITS.coilMaxChars);

function fieldSchema(field: Hl7MappedField) {
  const allowed = HL7_FIELD_VALUES[field];
  const value = allowed
    ? z.string().trim().toLowerCase().refine((v) => allowed.includes(v), `one of ${allowed.join(', ')}`)
    : coilText.min(1, 'name the coil');
  return z
    .object({
      source: z.enum(HL7_SOURCES, `one of ${HL7_SOURCES.join(', ')}`),
      code: text(HL7_MAPPING_LIMITS.codeMaxChars),
      values: z.array(z.object({ sent: text(HL7_MAPPING_LIMITS.codeMaxChars).min(1, 'say what the booking system sends'), value })).max(HL7_MAPPING_LIMITS.valuesPerField, `at most ${HL7_MAPPING_LIMITS.valuesPerField} values`),
    })
    .superRefine((f, ctx) => {
      if (f.source !== 'none' && f.code === '') ctx.addIssue({ code: 'custom', path: ['code'], message: f.source === 'obx' ? 'name the OBX-3 observation code' : 'name the comment prefix' });
      duplicates(f.values.map((v) => v.sent), ctx, (i) => ['values', i, 'sent'], 'sent twice: keep one');
    })
    .transform((f): Hl7FieldMapping => (f.source === 'none' ? { ...f, code: '' } : f));
}

/** PUT /api/hl7/mapping: every problem at once, each at its field (`precaution.code`, `procedures.2.coil`, …). */
export const hl7MappingSchema = z.object({
  precaution: fieldSchema('precaution'),
  mobility: fieldSchema('mobility'),
  coil: fieldSchema('coil'),
  contrast: fieldSchema('contrast'),
  procedures: z
    .array(
      z
        .object({
          code: text(HL7_MAPPING_LIMITS.codeMaxChars).min(1, 'name the procedure code (AIS-3.1)'),
          coil: z.union([z.null(), coilText.transform((c) => c || null)]),
          contrast: z.boolean().nullable(),
        })
        .superRefine((p, ctx) => {
          if (p.coil === null && p.contrast === null) ctx.addIssue({ code: 'custom', path: ['coil'], message: 'give a coil or contrast, or remove the row' });
        }),
    )
    .max(HL7_MAPPING_LIMITS.procedures, `at most ${HL7_MAPPING_LIMITS.procedures} procedures`)
    .superRefine((rows, ctx) => duplicates(rows.map((r) => r.code), ctx, (i) => [i, 'code'], 'listed twice: keep one')),
});

function duplicates(keys: string[], ctx: z.RefinementCtx, path: (i: number) => (string | number)[], message: string): void {
  const seen = new Set<string>();
  keys.forEach((key, i) => {
    const k = key.trim().toLowerCase();
    if (seen.has(k)) ctx.addIssue({ code: 'custom', path: path(i), message });
    seen.add(k);
  });
}
