import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('users', (t) => {
    t.increments('id').primary();
    t.string('username', 64).notNullable().unique();
    t.string('display_name', 120).notNullable().defaultTo('');
    t.string('password_hash', 255).notNullable();
    t.string('role', 16).notNullable();
    t.boolean('active').notNullable().defaultTo(true);
    t.string('created_at', 40).notNullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('users');
}
