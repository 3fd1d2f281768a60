import type { Knex } from 'knex';

/**
 * A room's HL7 location code: what the booking system sends in AIL-3 for it (e.g. "MRI-2" for
 * the room Turnwise calls "MR 2"). The booking feed matches it before the room's name. Unique
 * without regard to case among rooms that have one. The `setup` day version rises on every
 * change to `rooms` already (table triggers of `create-day-versions`), so nothing is added here.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('rooms', (t) => {
    t.string('hl7_code', 60).nullable();
  });
  await knex.raw('CREATE UNIQUE INDEX rooms_hl7_code_unique ON rooms (lower(hl7_code)) WHERE hl7_code IS NOT NULL');
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw('DROP INDEX IF EXISTS rooms_hl7_code_unique');
  await knex.schema.alterTable('rooms', (t) => {
    t.dropColumn('hl7_code');
  });
}
