import type { Knex } from 'knex';

/**
 * The append-only cleaning log an infection-prevention auditor reads. Each entry copies what
 * it states (room name, accession, product name, the user's names) so it reads the same after
 * a rename or a re-imported day list. A correction is a new entry pointing at the one it
 * corrects. Contact time achieved is only known when the turnover completes, after the step's
 * entry was written: it goes into `cleaning_log_contact`, itself append-only, and the log read
 * joins it onto the step's entry. Triggers refuse every UPDATE and DELETE on both tables, so
 * not even a raw SQL statement can rewrite history.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('cleaning_log', (t) => {
    t.increments('id').primary();
    t.string('at', 40).notNullable();
    t.bigInteger('at_ms').notNullable();
    t.string('day', 10).notNullable();
    t.integer('room_id').notNullable().references('id').inTable('rooms');
    t.string('room_name', 40).notNullable();
    // no foreign key: the log outlives the live turnover rows
    t.integer('turnover_id').nullable();
    t.string('exam_accession', 64).nullable();
    t.string('clean_type', 16).notNullable();
    t.string('kind', 24).notNullable();
    t.string('step_key', 40).nullable();
    t.string('step_label', 120).nullable();
    t.string('product_key', 40).nullable();
    t.string('product_name', 120).nullable();
    t.integer('contact_required_minutes').nullable();
    t.string('early_reason', 500).nullable();
    t.string('note', 500).nullable();
    t.integer('corrects_id').nullable().references('id').inTable('cleaning_log');
    t.integer('user_id').notNullable().references('id').inTable('users');
    t.string('username', 64).notNullable();
    t.string('display_name', 120).notNullable();
    t.index(['day', 'room_id']);
    t.index(['turnover_id']);
  });
  await knex.schema.createTable('cleaning_log_contact', (t) => {
    t.integer('entry_id').primary().references('id').inTable('cleaning_log');
    t.integer('achieved_minutes').notNullable();
    t.string('recorded_at', 40).notNullable();
  });
  // PostgreSQL: one plpgsql function refuses the row change, fired before each UPDATE or DELETE.
  if (knex.client.config.client === 'pg') {
    await knex.raw(
      `CREATE FUNCTION append_only_refuse() RETURNS trigger LANGUAGE plpgsql AS $$ ` +
        `BEGIN RAISE EXCEPTION '% is append-only: add a correction instead', TG_TABLE_NAME; END $$`,
    );
    for (const table of ['cleaning_log', 'cleaning_log_contact']) {
      await knex.raw(`CREATE TRIGGER ${table}_append_only BEFORE UPDATE OR DELETE ON ${table} FOR EACH ROW EXECUTE FUNCTION append_only_refuse()`);
    }
    return;
  }
  for (const table of ['cleaning_log', 'cleaning_log_contact']) {
    for (const action of ['UPDATE', 'DELETE']) {
      await knex.raw(
        `CREATE TRIGGER ${table}_no_${action.toLowerCase()} BEFORE ${action} ON ${table} ` +
          `BEGIN SELECT RAISE(ABORT, '${table} is append-only: add a correction instead'); END`,
      );
    }
  }
}

export async function down(knex: Knex): Promise<void> {
  // DROP TABLE removes the triggers with the table and fires none of them.
  await knex.schema.dropTable('cleaning_log_contact');
  await knex.schema.dropTable('cleaning_log');
  if (knex.client.config.client === 'pg') await knex.raw('DROP FUNCTION append_only_refuse()');
}
