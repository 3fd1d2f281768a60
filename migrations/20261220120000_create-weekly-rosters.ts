import type { Knex } from 'knex';

/**
 * The default roster of each ISO weekday (1 Monday … 7 Sunday): who is on shift, their hours,
 * breaks and rooms, as one JSON list of rows (`RosterRow[]`, shared/api/roster.ts), written whole
 * by Setup. Rooms are named by id inside the rows, so a renamed or retired room needs no change
 * here. A weekday without a row has no default roster. The default shapes every day without a
 * roster of its own, so triggers raise the `setup` day version, as `room_hours` does.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('weekly_rosters', (t) => {
    t.integer('weekday').primary();
    t.text('rows').notNullable();
    t.string('updated_at', 40).notNullable();
    t.integer('updated_by').nullable().references('id').inTable('users');
  });
  // PostgreSQL: the weekday rule as a CHECK, the setup version by the shared plpgsql function.
  if (knex.client.config.client === 'pg') {
    await knex.raw('ALTER TABLE weekly_rosters ADD CONSTRAINT weekly_rosters_weekday_check CHECK (weekday BETWEEN 1 AND 7)');
    await knex.raw('CREATE TRIGGER weekly_rosters_day_version AFTER INSERT OR UPDATE OR DELETE ON weekly_rosters FOR EACH ROW EXECUTE FUNCTION day_version_bump_setup()');
    return;
  }
  await knex.raw(
    'CREATE TRIGGER weekly_rosters_weekday_check BEFORE INSERT ON weekly_rosters WHEN NEW.weekday NOT BETWEEN 1 AND 7 ' +
      "BEGIN SELECT RAISE(ABORT, 'weekday must be 1 (Monday) to 7 (Sunday)'); END",
  );
  const bump = "INSERT INTO day_versions (day, version) VALUES ('setup', 1) ON CONFLICT(day) DO UPDATE SET version = version + 1;";
  for (const action of ['INSERT', 'UPDATE', 'DELETE']) {
    await knex.raw(`CREATE TRIGGER weekly_rosters_day_version_${action.toLowerCase()} AFTER ${action} ON weekly_rosters BEGIN ${bump} END`);
  }
}

export async function down(knex: Knex): Promise<void> {
  if (knex.client.config.client === 'pg') {
    await knex.schema.dropTable('weekly_rosters');
    return;
  }
  for (const action of ['insert', 'update', 'delete']) await knex.raw(`DROP TRIGGER IF EXISTS weekly_rosters_day_version_${action}`);
  await knex.raw('DROP TRIGGER IF EXISTS weekly_rosters_weekday_check');
  await knex.schema.dropTable('weekly_rosters');
}
