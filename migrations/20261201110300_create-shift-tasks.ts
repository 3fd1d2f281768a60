import type { Knex } from 'knex';

/**
 * Recurring shift tasks per room (workstation wipe-down, scanner QA, weekly deep clean) as
 * RFC 5545 recurrence rules whose DTSTART is a floating local time: occurrences stay at the
 * same wall-clock time across daylight-saving changes. `shift_task_done` holds one row per
 * occurrence ticked off, keyed by the occurrence's instant.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('shift_tasks', (t) => {
    t.increments('id').primary();
    t.integer('room_id').notNullable().references('id').inTable('rooms');
    t.string('key', 40).notNullable();
    t.string('label', 120).notNullable();
    t.string('rrule', 500).notNullable();
    t.integer('duration_minutes').notNullable();
    t.boolean('active').notNullable().defaultTo(true);
    t.string('created_at', 40).notNullable();
    t.unique(['room_id', 'key']);
  });
  await knex.schema.createTable('shift_task_done', (t) => {
    t.increments('id').primary();
    t.integer('task_id').notNullable().references('id').inTable('shift_tasks');
    t.string('due', 40).notNullable();
    t.bigInteger('due_ms').notNullable();
    t.string('done_at', 40).notNullable();
    t.integer('user_id').notNullable().references('id').inTable('users');
    t.unique(['task_id', 'due_ms']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('shift_task_done');
  await knex.schema.dropTable('shift_tasks');
}
