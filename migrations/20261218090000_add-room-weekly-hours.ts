import type { Knex } from 'knex';

/**
 * Opening hours per ISO weekday (1 Monday … 7 Sunday): a row says when the room opens and closes
 * that weekday, or that it is closed all day. A weekday without a row keeps the room's usual
 * `opens_at` / `closes_at`, so existing rooms (and rooms added through `POST /api/rooms`, seeds
 * and the import's tests) plan exactly as before without a data migration; Setup writes all seven
 * rows when an admin saves the week. A closing at or before the opening is after midnight, as the
 * engine reads it. The hours shape every day's plan, so triggers raise the `setup` day version.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('room_hours', (t) => {
    t.integer('room_id').notNullable().references('id').inTable('rooms');
    t.integer('weekday').notNullable();
    t.boolean('closed').notNullable().defaultTo(false);
    t.string('opens_at', 5).notNullable();
    t.string('closes_at', 5).notNullable();
    t.primary(['room_id', 'weekday']);
  });
  // PostgreSQL: the weekday rule as a CHECK, the setup version by the shared plpgsql function.
  if (knex.client.config.client === 'pg') {
    await knex.raw('ALTER TABLE room_hours ADD CONSTRAINT room_hours_weekday_check CHECK (weekday BETWEEN 1 AND 7)');
    await knex.raw('CREATE TRIGGER room_hours_day_version AFTER INSERT OR UPDATE OR DELETE ON room_hours FOR EACH ROW EXECUTE FUNCTION day_version_bump_setup()');
    return;
  }
  await knex.raw(
    'CREATE TRIGGER room_hours_weekday_check BEFORE INSERT ON room_hours WHEN NEW.weekday NOT BETWEEN 1 AND 7 ' +
      "BEGIN SELECT RAISE(ABORT, 'weekday must be 1 (Monday) to 7 (Sunday)'); END",
  );
  const bump = "INSERT INTO day_versions (day, version) VALUES ('setup', 1) ON CONFLICT(day) DO UPDATE SET version = version + 1;";
  for (const action of ['INSERT', 'UPDATE', 'DELETE']) {
    await knex.raw(`CREATE TRIGGER room_hours_day_version_${action.toLowerCase()} AFTER ${action} ON room_hours BEGIN ${bump} END`);
  }
}

export async function down(knex: Knex): Promise<void> {
  if (knex.client.config.client === 'pg') {
    await knex.schema.dropTable('room_hours');
    return;
  }
  for (const action of ['insert', 'update', 'delete']) await knex.raw(`DROP TRIGGER IF EXISTS room_hours_day_version_${action}`);
  await knex.raw('DROP TRIGGER IF EXISTS room_hours_weekday_check');
  await knex.schema.dropTable('room_hours');
}
