import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('rooms', (t) => {
    t.increments('id').primary();
    t.specificType('name', 'varchar(40) collate nocase').notNullable().unique();
    t.string('modality', 4).notNullable();
    t.float('air_changes_per_hour').notNullable();
    t.integer('staff').notNullable().defaultTo(1);
    t.string('opens_at', 5).notNullable().defaultTo('07:00');
    t.string('closes_at', 5).notNullable().defaultTo('19:00');
    t.integer('sort_order').notNullable().defaultTo(0);
    t.boolean('active').notNullable().defaultTo(true);
    t.string('created_at', 40).notNullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('rooms');
}
