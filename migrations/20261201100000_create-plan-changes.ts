import type { Knex } from 'knex';

/**
 * The audit trail of changes to a day plan: slot moves and staffing changes, who made them,
 * when and why. One row per user action (a suggestion that moves five exams is one row);
 * `changes` holds each move's from/to. Undo and redo are new rows that point at the row they
 * revert, so nothing is rewritten.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('plan_changes', (t) => {
    t.increments('id').primary();
    t.string('day', 10).notNullable();
    t.integer('user_id').notNullable().references('id').inTable('users');
    t.string('reason', 16).notNullable();
    t.string('summary', 300).notNullable();
    t.text('changes').notNullable();
    t.integer('reverts_id').nullable().references('id').inTable('plan_changes');
    t.string('undone_at', 40).nullable();
    t.string('created_at', 40).notNullable();
    t.index(['day', 'id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('plan_changes');
}
