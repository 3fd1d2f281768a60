import type { Knex } from 'knex';

/**
 * Coils, cushions and cleaning equipment with their ASTM F2503 marking, and each room's cleaning
 * kit. The MR rule (only MR Safe or MR Conditional items in an MR room's kit) is the service's,
 * because it depends on the room's modality, which can change.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('equipment', (t) => {
    t.increments('id').primary();
    t.string('name', 80).notNullable();
    t.string('kind', 16).notNullable();
    t.string('marking', 16).notNullable();
    t.string('conditions', 500).notNullable().defaultTo('');
    t.string('notes', 500).notNullable().defaultTo('');
    t.boolean('active').notNullable().defaultTo(true);
    t.string('created_at', 40).notNullable();
  });
  await knex.schema.createTable('room_kit', (t) => {
    t.integer('room_id').notNullable().references('rooms.id');
    t.integer('equipment_id').notNullable().references('equipment.id');
    t.primary(['room_id', 'equipment_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('room_kit');
  await knex.schema.dropTable('equipment');
}
