import type { Knex } from 'knex';

/** Patients marked arrived (waiting) by the front desk; a mistaken mark is removed. */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('arrivals', (t) => {
    t.integer('exam_id').primary().references('id').inTable('exams').onDelete('CASCADE');
    t.string('arrived_at', 40).notNullable();
    t.integer('user_id').notNullable().references('id').inTable('users');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('arrivals');
}
