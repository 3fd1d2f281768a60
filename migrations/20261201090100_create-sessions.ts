import type { Knex } from 'knex';

/** The table connect-session-knex reads and writes (its own auto-create is switched off). */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('sessions', (t) => {
    t.string('sid', 255).primary();
    t.json('sess').notNullable();
    t.timestamp('expired').notNullable().index();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('sessions');
}
