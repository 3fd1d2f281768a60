import type { Knex } from 'knex';

/**
 * The demo accounts the sign-in page offers in demo mode, written by the demo seed, so the
 * server reads them from the database rather than importing the seed. The password is kept
 * in clear on purpose: the demo shows it to everyone; no real account is ever listed here.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('demo_accounts', (t) => {
    t.string('username', 64).primary();
    t.string('password', 100).notNullable();
    t.integer('sort_order').notNullable().defaultTo(0);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('demo_accounts');
}
