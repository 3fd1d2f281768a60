import type { Knex } from 'knex';

/** One row per setting; values are JSON so new settings need no schema change. */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('settings', (t) => {
    t.string('key', 64).primary();
    t.text('value').notNullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('settings');
}
