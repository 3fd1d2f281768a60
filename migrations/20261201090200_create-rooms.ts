import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  // PostgreSQL has no NOCASE collation and its `real` is single precision: there the name is
  // unique as written (the seeds' ON CONFLICT (name) needs that) and, below, whatever its case;
  // air changes are a double, as SQLite's REAL is.
  const postgres = knex.client.config.client === 'pg';
  await knex.schema.createTable('rooms', (t) => {
    t.increments('id').primary();
    t.specificType('name', postgres ? 'varchar(40)' : 'varchar(40) collate nocase').notNullable().unique();
    t.string('modality', 4).notNullable();
    if (postgres) t.double('air_changes_per_hour').notNullable();
    else t.float('air_changes_per_hour').notNullable();
    t.integer('staff').notNullable().defaultTo(1);
    t.string('opens_at', 5).notNullable().defaultTo('07:00');
    t.string('closes_at', 5).notNullable().defaultTo('19:00');
    t.integer('sort_order').notNullable().defaultTo(0);
    t.boolean('active').notNullable().defaultTo(true);
    t.string('created_at', 40).notNullable();
  });
  if (postgres) await knex.raw('CREATE UNIQUE INDEX rooms_name_nocase ON rooms (lower(name))');
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('rooms');
}
