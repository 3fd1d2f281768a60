import type { Knex } from 'knex';

/**
 * A day's own roster (`RosterRow[]` as JSON, shared/api/roster.ts), written whole by the Day
 * plan's roster editor or the roster file of an import; it replaces the weekday's default for
 * that date (an empty list: nobody on shift). Rooms are named by id inside the rows. A roster
 * change is a change of the day: triggers raise that day's version, so the plan cache, its ETag
 * and an import preview's check all see it.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('day_rosters', (t) => {
    t.string('day', 10).primary();
    t.text('rows').notNullable();
    t.string('updated_at', 40).notNullable();
    t.integer('updated_by').nullable().references('id').inTable('users');
  });
  // PostgreSQL: one plpgsql function for the three row events (SQLite: a trigger each).
  if (knex.client.config.client === 'pg') {
    await knex.raw(`CREATE FUNCTION day_rosters_day_version() RETURNS trigger LANGUAGE plpgsql AS $$ BEGIN
        IF TG_OP = 'DELETE' THEN PERFORM day_version_bump(OLD.day); RETURN NULL; END IF;
        PERFORM day_version_bump(NEW.day);
        IF TG_OP = 'UPDATE' AND OLD.day <> NEW.day THEN PERFORM day_version_bump(OLD.day); END IF;
        RETURN NULL;
      END $$`);
    await knex.raw('CREATE TRIGGER day_rosters_day_version AFTER INSERT OR UPDATE OR DELETE ON day_rosters FOR EACH ROW EXECUTE FUNCTION day_rosters_day_version()');
    return;
  }
  const bump = (day: string) =>
    `INSERT INTO day_versions (day, version) VALUES (${day}, 1) ON CONFLICT(day) DO UPDATE SET version = version + 1;`;
  await knex.raw(`CREATE TRIGGER day_rosters_day_version_insert AFTER INSERT ON day_rosters BEGIN ${bump('NEW.day')} END`);
  await knex.raw(`CREATE TRIGGER day_rosters_day_version_update AFTER UPDATE ON day_rosters BEGIN ${bump('NEW.day')} END`);
  await knex.raw(`CREATE TRIGGER day_rosters_day_version_delete AFTER DELETE ON day_rosters BEGIN ${bump('OLD.day')} END`);
}

export async function down(knex: Knex): Promise<void> {
  if (knex.client.config.client === 'pg') {
    await knex.raw('DROP TRIGGER IF EXISTS day_rosters_day_version ON day_rosters');
    await knex.raw('DROP FUNCTION IF EXISTS day_rosters_day_version()');
    await knex.schema.dropTable('day_rosters');
    return;
  }
  for (const action of ['insert', 'update', 'delete']) await knex.raw(`DROP TRIGGER IF EXISTS day_rosters_day_version_${action}`);
  await knex.schema.dropTable('day_rosters');
}
