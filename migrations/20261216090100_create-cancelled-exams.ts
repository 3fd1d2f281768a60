import type { Knex } from 'knex';

/**
 * An exam leaves the day list when it is cancelled by hand or dropped by an import. Calendar
 * feeds must still tell subscribers (`STATUS:CANCELLED` with a higher `SEQUENCE`), so a trigger
 * keeps what the exam was, with the version it had, in the same statement that removes it.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('cancelled_exams', (t) => {
    t.increments('id').primary();
    t.integer('exam_id').notNullable();
    t.string('day', 10).notNullable();
    t.string('accession', 64).notNullable();
    t.integer('room_id').notNullable();
    t.string('start_at', 40).notNullable();
    t.integer('duration_minutes').notNullable();
    t.string('procedure', 200).notNullable();
    t.integer('version').notNullable();
    t.index(['day', 'room_id']);
    t.index(['exam_id']);
  });
  // PostgreSQL: the same row trigger, through a plpgsql function.
  if (knex.client.config.client === 'pg') {
    await knex.raw(`create function exams_keep_cancelled() returns trigger language plpgsql as $$ begin
      insert into cancelled_exams (exam_id, day, accession, room_id, start_at, duration_minutes, procedure, version)
      values (old.id, old.day, old.accession, old.room_id, old.start_at, old.duration_minutes, old.procedure, old.version);
      return null;
    end $$`);
    await knex.raw('create trigger exams_keep_cancelled after delete on exams for each row execute function exams_keep_cancelled()');
    return;
  }
  await knex.raw(`create trigger exams_keep_cancelled after delete on exams
    begin
      insert into cancelled_exams (exam_id, day, accession, room_id, start_at, duration_minutes, procedure, version)
      values (old.id, old.day, old.accession, old.room_id, old.start_at, old.duration_minutes, old.procedure, old.version);
    end`);
}

export async function down(knex: Knex): Promise<void> {
  if (knex.client.config.client === 'pg') {
    await knex.raw('drop trigger if exists exams_keep_cancelled on exams');
    await knex.raw('drop function if exists exams_keep_cancelled()');
  } else await knex.raw('drop trigger if exists exams_keep_cancelled');
  await knex.schema.dropTable('cancelled_exams');
}
