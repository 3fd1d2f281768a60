import type { Knex } from 'knex';

/**
 * Private calendar feeds: one token per user, kept only as its SHA-256 hash (the address is
 * shown once, when made). Rotating replaces the row; revoking deletes it, so the old address
 * answers 404 at once.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('calendar_tokens', (t) => {
    t.integer('user_id').primary().references('users.id').onDelete('CASCADE');
    t.string('token_hash', 64).notNullable().unique();
    t.string('created_at', 40).notNullable();
    t.string('last_used_at', 40).nullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('calendar_tokens');
}
