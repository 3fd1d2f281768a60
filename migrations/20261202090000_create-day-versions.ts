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

export async function down(knex: Knex): Promise<void> {
  for (const table of ['exams', 'gap_staffing', 'rooms', 'settings']) {
    for (const action of ['insert', 'update', 'delete']) await knex.raw(`DROP TRIGGER IF EXISTS ${table}_day_version_${action}`);
  }
  await knex.schema.dropTable('day_versions');
}
