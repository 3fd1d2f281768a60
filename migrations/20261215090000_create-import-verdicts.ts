import type { Knex } from 'knex';

/**
 * The gap verdicts of each room's plan right after an import was committed, so Reports can set
 * "as imported" beside "now" after moves and fixes. Earlier imports have no rows: their plans
 * cannot be rebuilt exactly (staffing, setup and hand edits changed since), so none is invented.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('import_verdicts', (t) => {
    t.integer('import_id').notNullable().references('id').inTable('imports').onDelete('CASCADE');
    t.integer('room_id').notNullable().references('id').inTable('rooms');
    t.integer('fits').notNullable();
    t.integer('snug').notNullable();
    t.integer('short').notNullable();
    t.integer('overlap').notNullable();
    t.integer('minutes_short').notNullable();
    t.primary(['import_id', 'room_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('import_verdicts');
}
