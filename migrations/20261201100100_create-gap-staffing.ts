import type { Knex } from 'knex';

/** People on one turnover (the gap before an exam), overriding the room's staff for that gap. */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('gap_staffing', (t) => {
    t.integer('to_exam_id').primary().references('id').inTable('exams').onDelete('CASCADE');
    t.integer('staff').notNullable();
    t.integer('user_id').notNullable().references('id').inTable('users');
    t.string('updated_at', 40).notNullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('gap_staffing');
}
