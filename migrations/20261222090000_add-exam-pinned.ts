import type { Knex } from 'knex';

/**
 * An exam pinned by a user must not move when the day is made to fit. A plain column on both
 * databases; the exams' update trigger (create-day-versions) raises the day's version on a pin
 * change, as on any change to the exam.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('exams', (t) => {
    t.boolean('pinned').notNullable().defaultTo(false);
  });
}

export async function down(knex: Knex): Promise<void> {
  // Plain SQL on both databases: knex's SQLite dropColumn copies the table, losing its triggers.
  await knex.raw('ALTER TABLE exams DROP COLUMN pinned');
}
