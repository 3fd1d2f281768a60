import type { Knex } from 'knex';
import { DEFAULT_HL7_MAPPING, HL7_MAPPED_FIELDS, hl7MappingSchema, type Hl7FieldMapping, type Hl7Mapping } from '../../../shared/api/hl7-mapping';
import { changedFields, recordAudit, type Actor } from '../audit';
import type { ObservationSource, SiuMapping } from './siu-mapping';

const ROW_ID = 1;

/**
 * The site's booking-feed mapping as stored (Setup → Site), or the defaults when none is. Read
 * per message: one row by key, so a change in Setup holds from the next message on. A stored
 * value the schema no longer takes throws (the message is answered AE 207 and the error logged)
 * rather than being read as "nothing configured", which would drop precautions unseen.
 */
export async function readHl7Mapping(db: Knex): Promise<Hl7Mapping> {
  const row = (await db('hl7_mapping').where({ id: ROW_ID }).first('options')) as { options: string } | undefined;
  if (!row) return DEFAULT_HL7_MAPPING;
  const read = hl7MappingSchema.safeParse(JSON.parse(row.options));
  if (!read.success) throw new Error(`The stored HL7 mapping is not valid: ${read.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`).join('; ')}`);
  return read.data;
}

/** Replaces the mapping and records one setup-audit row (area `site`) with what changed, in one transaction. */
export async function writeHl7Mapping(db: Knex, mapping: Hl7Mapping, by: Actor, now: Date): Promise<Hl7Mapping> {
  return db.transaction(async (trx) => {
    const before = await readHl7Mapping(trx);
    await trx('hl7_mapping').insert({ id: ROW_ID, options: JSON.stringify(mapping), updated_at: now.toISOString() }).onConflict('id').merge();
    const diff = changedFields(before, mapping);
    if (Object.keys(diff.after).length > 0) await recordAudit(trx, by, { area: 'site', action: 'changed', subject: 'Booking system feed (HL7)', ...diff }, now);
    return mapping;
  });
}

/** The site's part of the SIU mapping (`siu-mapping.ts`), with keys the reader looks up case aside. */
export function siteSiuMapping(site: Hl7Mapping): Pick<SiuMapping, 'observations' | 'values' | 'procedures'> {
  const source = (f: Hl7FieldMapping): ObservationSource => (f.source === 'obx' ? { obx: f.code } : f.source === 'nte' ? { ntePrefix: f.code } : null);
  const procedures: SiuMapping['procedures'] = {};
  for (const p of site.procedures) {
    procedures[p.code.toLowerCase()] = { ...(p.coil !== null && { coil: p.coil }), ...(p.contrast !== null && { contrast: p.contrast }) };
  }
  return {
    observations: Object.fromEntries(HL7_MAPPED_FIELDS.map((f) => [f, source(site[f])])) as SiuMapping['observations'],
    values: Object.fromEntries(HL7_MAPPED_FIELDS.map((f) => [f, site[f].values])) as SiuMapping['values'],
    procedures,
  };
}
