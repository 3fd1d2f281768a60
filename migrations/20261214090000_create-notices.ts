import type { Knex } from 'knex';

/**
 * E-mail notices: the durable queue (`notices`, one row per message and recipient, unique by its
 * idempotency key), each user's on/off choice per kind of notice (`notice_settings`; no row = on),
 * where the sender loop has read up to in other tables (`notice_cursors`), and what the local demo
 * mail server received (`caught_mail`; demo mode, development and tests only).
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('notices', (t) => {
    t.increments('id').primary();
    t.string('idempotency_key', 200).notNullable().unique();
    t.string('kind', 32).notNullable();
    t.integer('user_id').nullable().references('users.id').onDelete('SET NULL');
    /** JSON array of addresses. */
    t.text('recipients').notNullable();
    t.string('subject', 300).notNullable();
    t.text('text').notNullable();
    t.text('html').notNullable();
    t.string('unsubscribe_url', 1000).nullable();
    t.string('status', 16).notNullable().defaultTo('queued');
    t.integer('attempts').notNullable().defaultTo(0);
    t.string('next_attempt_at', 40).notNullable();
    /** When a sender claimed the row; a `sending` row claimed long ago was cut off (a crash) and is retried. */
    t.string('claimed_at', 40).nullable();
    t.text('last_error').nullable();
    t.string('created_at', 40).notNullable();
    t.string('sent_at', 40).nullable();
    t.index(['status', 'next_attempt_at']);
    t.index(['created_at']);
  });
  // PostgreSQL: the same rule as a CHECK constraint, dropped with the table.
  if (knex.client.config.client === 'pg') {
    await knex.raw("ALTER TABLE notices ADD CONSTRAINT notices_status_check CHECK (status IN ('queued', 'sending', 'sent', 'failed'))");
  } else {
    await knex.raw(`create trigger notices_status_check before insert on notices
    when new.status not in ('queued', 'sending', 'sent', 'failed')
    begin select raise(abort, 'notices.status must be queued, sending, sent or failed'); end`);
  }

  await knex.schema.createTable('notice_settings', (t) => {
    t.integer('user_id').notNullable().references('users.id').onDelete('CASCADE');
    t.string('kind', 32).notNullable();
    t.boolean('enabled').notNullable();
    t.primary(['user_id', 'kind']);
  });

  await knex.schema.createTable('notice_cursors', (t) => {
    t.string('name', 64).primary();
    t.integer('value').notNullable();
  });

  await knex.schema.createTable('caught_mail', (t) => {
    t.increments('id').primary();
    t.string('received_at', 40).notNullable();
    t.string('envelope_from', 254).nullable();
    /** JSON array of the envelope's recipients. */
    t.text('envelope_to').notNullable();
    t.string('message_id', 300).nullable();
    t.string('subject', 300).nullable();
    t.text('text').nullable();
    t.text('html').nullable();
    t.text('raw').notNullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('caught_mail');
  await knex.schema.dropTable('notice_cursors');
  await knex.schema.dropTable('notice_settings');
  if (knex.client.config.client !== 'pg') await knex.raw('drop trigger if exists notices_status_check');
  await knex.schema.dropTable('notices');
}
