import type { Knex } from 'knex';

/**
 * The interface log of the HL7 booking feed: one row per message received (a repeat of the same
 * sender and control id counts on its first row, since it is applied once). `raw` is the message
 * as received less its patient segments (PID and the like), which are never stored.
 * `change_id` points at the day's history entry the message made, if any.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('hl7_messages', (t) => {
    t.increments('id').primary();
    t.string('received_at', 40).notNullable();
    t.string('last_received_at', 40).notNullable();
    t.integer('times_received').notNullable().defaultTo(1);
    // MSH-3^MSH-4 and MSH-10: control ids are unique per sending application and facility.
    t.string('sender', 200).notNullable().defaultTo('');
    t.string('control_id', 200).nullable();
    t.string('message_type', 40).notNullable().defaultTo('');
    t.string('sent_at', 40).nullable();
    t.string('ack_code', 2).notNullable();
    t.string('outcome', 500).notNullable();
    t.string('accession', 100).nullable();
    t.string('day', 10).nullable();
    t.integer('change_id').nullable().references('id').inTable('plan_changes');
    t.boolean('after_manual_change').notNullable().defaultTo(false);
    t.text('raw').notNullable();
    t.unique(['sender', 'control_id']);
    t.index(['accession', 'id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('hl7_messages');
}
