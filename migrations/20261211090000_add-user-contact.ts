import type { Knex } from 'knex';

/**
 * Accounts made in Setup: an e-mail address, and a flag a password reset sets so the user must
 * choose their own password before anything else.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('users', (t) => {
    t.string('email', 254).nullable();
    t.boolean('must_change_password').notNullable().defaultTo(false);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('users', (t) => {
    t.dropColumn('email');
    t.dropColumn('must_change_password');
  });
}
