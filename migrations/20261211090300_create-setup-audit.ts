import type { Knex } from 'knex';

/**
 * One row per setup change (users, rooms, equipment, kits, site): who, when, what, before and
 * after as JSON. The user's name is copied in so a row still reads right after a rename.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('setup_audit', (t) => {
    t.increments('id').primary();
    t.string('at', 40).notNullable();
    t.integer('user_id').notNullable().references('users.id');
    t.string('username', 64).notNullable();
    t.string('display_name', 120).notNullable();
    t.string('area', 16).notNullable();
    t.string('action', 40).notNullable();
    t.string('subject', 120).notNullable();
    t.text('before').nullable();
    t.text('after').nullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('setup_audit');
}
