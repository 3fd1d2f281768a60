import type { Knex } from 'knex';

/**
 * The site's booking-feed mapping (Setup → Site): where an SIU message says an exam's precaution,
 * mobility, coil and contrast, and the procedure-code table. One row (`id` 1) holding the
 * options as JSON text, read and checked in code with the API's own schema; no row means nothing
 * is read (the defaults). It does not shape the plan (a message's values reach the plan through
 * `exams`), so it raises no day version. Portable as written: no dialect branch.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('hl7_mapping', (t) => {
    t.integer('id').primary();
    t.text('options').notNullable();
    t.string('updated_at', 40).notNullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('hl7_mapping');
}
