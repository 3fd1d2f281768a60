import type { Hl7MappedField, Hl7ValueMap } from '../../../shared/api/hl7-mapping';

/**
 * How SIU scheduling messages map onto exams: the defaults, in one place. The site's own part
 * (sources, value translations, procedure table) is set in Setup and read per message
 * (`hl7-mapping-setup.ts`); `createApp` may override the rest as `hl7.mapping`. Paths are `SEGMENT.field.component` as node-hl7-client reads them;
 * a list is tried in order and the first non-empty value wins.
 *
 * Field positions: HL7 v2.5.1 chapter 10 (SCH, AIS, AIL) and chapter 2 (MSH), from memory.
 */
export type SiuAction = 'book' | 'reschedule' | 'modify' | 'cancel' | 'delete' | 'no-show';

/** A value read from the first OBX whose OBX-3.1 is `obx` (its OBX-5), or the first NTE whose NTE-3 starts with `ntePrefix`; case aside. */
export type ObservationSource = { obx: string } | { ntePrefix: string } | null;

/** Precaution and mobility are the patient's, never the procedure's, so the table holds neither. */
export interface ProcedureDefaults {
  coil?: string;
  contrast?: boolean;
}

export interface SiuMapping {
  /** MSH-9.2 trigger event → what it does; any other event is refused (AR). */
  events: Record<string, SiuAction>;
  /** SCH-2 filler appointment id, else SCH-1 placer appointment id. */
  accession: string[];
  /** AIS-3 universal service identifier: its text, else its code. */
  procedure: string[];
  /** The code a procedure table is keyed on (AIS-3.1). */
  procedureCode: string;
  /** AIS-4 start date/time, else SCH-11.4 (TQ start). */
  start: string[];
  /** AIS-7 duration with AIS-8 units; SCH-11.3 (TQ duration, e.g. M45); SCH-9 with SCH-10 units. */
  duration: { value: string; units?: string }[];
  /** AIL-3 location resource id (PL): 3.2 room, else 3.1 point of care; matched to a room's name. */
  room: string[];
  /** SCH-25 filler status code (table 0278). */
  status: string;
  /** Statuses that take an exam off the plan whatever the event. */
  removingStatuses: string[];
  /** Where precaution, mobility, coil and contrast come from; null: not given (the import's defaults). */
  observations: Record<Hl7MappedField, ObservationSource>;
  /** Sent values the site translates (case aside), e.g. OBX-5 `ISO-A` → airborne; other values must already be ours. */
  values: Record<Hl7MappedField, Hl7ValueMap[]>;
  /** By procedure code (AIS-3.1) in lower case: what a procedure always has, e.g. { 'mrknee': { coil: 'knee' } }. */
  procedures: Record<string, ProcedureDefaults>;
}

export const DEFAULT_SIU_MAPPING: SiuMapping = {
  events: { S12: 'book', S13: 'reschedule', S14: 'modify', S15: 'cancel', S17: 'delete', S26: 'no-show' },
  accession: ['SCH.2.1', 'SCH.1.1'],
  procedure: ['AIS.3.2', 'AIS.3.1'],
  procedureCode: 'AIS.3.1',
  start: ['AIS.4.1', 'SCH.11.4'],
  duration: [{ value: 'AIS.7', units: 'AIS.8.1' }, { value: 'SCH.11.3' }, { value: 'SCH.9', units: 'SCH.10.1' }],
  room: ['AIL.3.2', 'AIL.3.1'],
  status: 'SCH.25.1',
  removingStatuses: ['Cancelled', 'Deleted', 'Noshow'],
  // Nothing is read for these unless a site says where: precaution none, ambulatory, no coil, no contrast.
  observations: { precaution: null, mobility: null, coil: null, contrast: null },
  values: { precaution: [], mobility: [], coil: [], contrast: [] },
  procedures: {},
};

/** A site's mapping over the defaults. */
export function siuMapping(site: Partial<SiuMapping> = {}): SiuMapping {
  return {
    ...DEFAULT_SIU_MAPPING,
    ...site,
    observations: { ...DEFAULT_SIU_MAPPING.observations, ...site.observations },
    values: { ...DEFAULT_SIU_MAPPING.values, ...site.values },
  };
}
