import type { Knex } from 'knex';

/**
 * Live turnovers: one opens when a technologist records "exam finished" for the leaving exam
 * (its actual end) and closes with "turnover complete". Each ticked step is a row of
 * `turnover_steps`. These rows follow the day list (an exam removed by a re-import takes its
 * turnover along); the permanent record is the append-only cleaning log, which copies what it
 * needs instead of pointing here.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('turnovers', (t) => {
    t.increments('id').primary();
    t.string('day', 10).notNullable();
    t.integer('room_id').notNullable().references('id').inTable('rooms');
    // one turnover after an exam: a second "exam finished" is a conflict, not a new turnover
    t.integer('from_exam_id').notNullable().unique().references('id').inTable('exams').onDelete('CASCADE');
    t.string('clean_type', 16).notNullable();
    t.string('precaution', 16).notNullable();
    t.string('exam_ended_at', 40).notNullable();
    t.bigInteger('exam_ended_ms').notNullable();
    t.integer('ended_by').notNullable().references('id').inTable('users');
    t.string('completed_at', 40).nullable();
    t.bigInteger('completed_ms').nullable();
    t.integer('completed_by').nullable().references('id').inTable('users');
    /** Why the room was made ready before the air hold was over. */
    t.string('override_reason', 500).nullable();
    t.index(['day', 'room_id']);
  });
  await knex.schema.createTable('turnover_steps', (t) => {
    t.increments('id').primary();
    t.integer('turnover_id').notNullable().references('id').inTable('turnovers').onDelete('CASCADE');
    t.string('step_key', 40).notNullable();
    t.string('done_at', 40).notNullable();
    t.bigInteger('done_ms').notNullable();
    t.integer('user_id').notNullable().references('id').inTable('users');
    t.string('product_key', 40).nullable();
    /** Minutes the surface must stay untouched after this tick: the product's contact + dry time. */
    t.integer('wait_minutes').notNullable();
    t.string('early_reason', 500).nullable();
    t.unique(['turnover_id', 'step_key']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('turnover_steps');
  await knex.schema.dropTable('turnovers');
}
