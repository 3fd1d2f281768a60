import type { Knex } from 'knex';

/**
 * An MR room's zone layout after the ACR's four zones: where its cleaning kit is kept (Zone III
 * or IV), which doors and areas are Zone IV, and notes. One row per MR room; it does not shape
 * the plan, so it raises no day version.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('room_mr_zones', (t) => {
    t.integer('room_id').primary().references('id').inTable('rooms');
    t.string('kit_kept_in', 10).nullable();
    t.string('zone_iv_areas', 500).notNullable().defaultTo('');
    t.string('notes', 500).notNullable().defaultTo('');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('room_mr_zones');
}
