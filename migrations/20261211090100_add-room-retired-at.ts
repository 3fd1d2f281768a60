import type { Knex } from 'knex';

/** When a room was retired (`active` false): it leaves the board and plan but its history stays. */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('rooms', (t) => {
    t.string('retired_at', 40).nullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('rooms', (t) => {
    t.dropColumn('retired_at');
  });
}
