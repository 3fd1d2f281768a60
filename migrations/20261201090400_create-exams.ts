import type { Knex } from 'knex';

/**
 * The day list. No patient names or birth dates: the accession links back to the
 * department's own systems. `start_ms` (epoch ms) orders slots in real time across DST days;
 * `start_at` keeps the ISO text with the site offset as imported.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('exams', (t) => {
    t.increments('id').primary();
    t.string('day', 10).notNullable();
    t.string('accession', 64).notNullable();
    t.integer('room_id').notNullable().references('id').inTable('rooms').onDelete('RESTRICT');
    t.string('start_at', 40).notNullable();
    t.bigInteger('start_ms').notNullable();
    t.integer('duration_minutes').notNullable();
    t.string('procedure', 200).notNullable();
    t.string('coil', 40).nullable();
    t.string('precaution', 16).notNullable().defaultTo('none');
    t.string('mobility', 16).notNullable().defaultTo('ambulatory');
    t.boolean('contrast').notNullable().defaultTo(false);
    t.string('notes', 500).nullable();
    t.integer('version').notNullable().defaultTo(1);
    t.string('updated_at', 40).notNullable();
    t.unique(['day', 'accession']);
    t.index(['day', 'room_id', 'start_ms']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('exams');
}
