import type { Knex } from 'knex';

/**
 * A counter per day that rises with every change to the day's exams or turnover staffing, and
 * one more, under the key `setup`, that rises with every change to the rooms or the settings
 * (they shape every day's plan). The plan cache keys on both, and an import commit compares the
 * day's with its preview's. Triggers keep them, so no write path (a service, undo, a raw
 * statement) can change a day and leave its version behind.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('day_versions', (t) => {
    t.string('day', 10).primary();
    t.integer('version').notNullable();
  });
  if (knex.client.config.client === 'pg') return postgresTriggers(knex);
  const bump = (day: string) =>
    `INSERT INTO day_versions (day, version) VALUES (${day}, 1) ON CONFLICT(day) DO UPDATE SET version = version + 1;`;
  const staffDay = (row: 'NEW' | 'OLD') => `(SELECT day FROM exams WHERE id = ${row}.to_exam_id)`;
  await knex.raw(`CREATE TRIGGER exams_day_version_insert AFTER INSERT ON exams BEGIN ${bump('NEW.day')} END`);
  await knex.raw(`CREATE TRIGGER exams_day_version_delete AFTER DELETE ON exams BEGIN ${bump('OLD.day')} END`);
  // An exam moved to another day changes both days.
  await knex.raw(
    `CREATE TRIGGER exams_day_version_update AFTER UPDATE ON exams BEGIN ${bump('NEW.day')} ` +
      `INSERT INTO day_versions (day, version) SELECT OLD.day, 1 WHERE OLD.day <> NEW.day ON CONFLICT(day) DO UPDATE SET version = version + 1; END`,
  );
  await knex.raw(`CREATE TRIGGER gap_staffing_day_version_insert AFTER INSERT ON gap_staffing WHEN ${staffDay('NEW')} IS NOT NULL BEGIN ${bump(staffDay('NEW'))} END`);
  await knex.raw(`CREATE TRIGGER gap_staffing_day_version_update AFTER UPDATE ON gap_staffing WHEN ${staffDay('NEW')} IS NOT NULL BEGIN ${bump(staffDay('NEW'))} END`);
  for (const table of ['rooms', 'settings']) {
    for (const action of ['INSERT', 'UPDATE', 'DELETE']) {
      await knex.raw(`CREATE TRIGGER ${table}_day_version_${action.toLowerCase()} AFTER ${action} ON ${table} BEGIN ${bump("'setup'")} END`);
    }
  }
  await knex.raw(`CREATE TRIGGER gap_staffing_day_version_delete AFTER DELETE ON gap_staffing WHEN ${staffDay('OLD')} IS NOT NULL BEGIN ${bump(staffDay('OLD'))} END`);
}

/**
 * PostgreSQL: the same row triggers, as plpgsql functions. `day_version_bump_setup()` is also
 * what later migrations' tables that shape the plan fire on PostgreSQL.
 */
async function postgresTriggers(knex: Knex): Promise<void> {
  await knex.raw(`CREATE FUNCTION day_version_bump(d text) RETURNS void LANGUAGE plpgsql AS $$ BEGIN
      INSERT INTO day_versions (day, version) VALUES (d, 1) ON CONFLICT (day) DO UPDATE SET version = day_versions.version + 1;
    END $$`);
  await knex.raw(`CREATE FUNCTION day_version_bump_setup() RETURNS trigger LANGUAGE plpgsql AS $$ BEGIN
      PERFORM day_version_bump('setup'); RETURN NULL;
    END $$`);
  // An exam moved to another day changes both days.
  await knex.raw(`CREATE FUNCTION exams_day_version() RETURNS trigger LANGUAGE plpgsql AS $$ BEGIN
      IF TG_OP = 'DELETE' THEN PERFORM day_version_bump(OLD.day); RETURN NULL; END IF;
      PERFORM day_version_bump(NEW.day);
      IF TG_OP = 'UPDATE' AND OLD.day <> NEW.day THEN PERFORM day_version_bump(OLD.day); END IF;
      RETURN NULL;
    END $$`);
  await knex.raw(`CREATE FUNCTION gap_staffing_day_version() RETURNS trigger LANGUAGE plpgsql AS $$ DECLARE d text; BEGIN
      IF TG_OP = 'DELETE' THEN SELECT day INTO d FROM exams WHERE id = OLD.to_exam_id;
      ELSE SELECT day INTO d FROM exams WHERE id = NEW.to_exam_id; END IF;
      IF d IS NOT NULL THEN PERFORM day_version_bump(d); END IF;
      RETURN NULL;
    END $$`);
  await knex.raw('CREATE TRIGGER exams_day_version AFTER INSERT OR UPDATE OR DELETE ON exams FOR EACH ROW EXECUTE FUNCTION exams_day_version()');
  await knex.raw('CREATE TRIGGER gap_staffing_day_version AFTER INSERT OR UPDATE OR DELETE ON gap_staffing FOR EACH ROW EXECUTE FUNCTION gap_staffing_day_version()');
  for (const table of ['rooms', 'settings']) {
    await knex.raw(`CREATE TRIGGER ${table}_day_version AFTER INSERT OR UPDATE OR DELETE ON ${table} FOR EACH ROW EXECUTE FUNCTION day_version_bump_setup()`);
  }
}

export async function down(knex: Knex): Promise<void> {
  if (knex.client.config.client === 'pg') {
    for (const table of ['exams', 'gap_staffing', 'rooms', 'settings']) await knex.raw(`DROP TRIGGER IF EXISTS ${table}_day_version ON ${table}`);
    for (const fn of ['exams_day_version', 'gap_staffing_day_version', 'day_version_bump_setup']) await knex.raw(`DROP FUNCTION IF EXISTS ${fn}()`);
    await knex.raw('DROP FUNCTION IF EXISTS day_version_bump(text)');
    await knex.schema.dropTable('day_versions');
    return;
  }
  for (const table of ['exams', 'gap_staffing', 'rooms', 'settings']) {
    for (const action of ['insert', 'update', 'delete']) await knex.raw(`DROP TRIGGER IF EXISTS ${table}_day_version_${action}`);
  }
  await knex.schema.dropTable('day_versions');
}
