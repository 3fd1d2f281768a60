import type { Knex } from 'knex';

/** Who imported which file for which day, and what it changed. */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('imports', (t) => {
    t.increments('id').primary();
    t.string('day', 10).notNullable().index();
    t.integer('user_id').notNullable().references('id').inTable('users');
    t.string('file_name', 255).notNullable();
    t.integer('rows').notNullable();
    t.integer('added').notNullable();
    t.integer('changed').notNullable();
    t.integer('removed').notNullable();
    t.string('created_at', 40).notNullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('imports');
}
