import type { Knex } from 'knex';

/**
 * A site's disinfectants (`products`) and its turnover protocols, one row per version
 * (`protocol_versions`: per DICOM modality or `*`, numbered from 1, effective from a date, the
 * content as JSON). Both shape every plan, so triggers raise the `setup` day version on every
 * change (the plan cache and ETags move). A turnover remembers the version it was planned with.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('products', (t) => {
    t.increments('id').primary();
    t.string('name', 80).notNullable();
    t.string('kind', 16).notNullable();
    t.double('contact_minutes').notNullable();
    t.double('stays_wet_minutes').nullable();
    t.string('registration', 80).notNullable().defaultTo('');
    t.string('notes', 500).notNullable().defaultTo('');
    t.string('retired_at', 40).nullable();
    t.string('created_at', 40).notNullable();
    t.string('updated_at', 40).notNullable();
  });
  // PostgreSQL: no NOCASE, so the index is on lower(name); the contact time is a CHECK constraint.
  const postgres = knex.client.config.client === 'pg';
  if (postgres) {
    await knex.raw('CREATE UNIQUE INDEX products_active_name ON products (lower(name)) WHERE retired_at IS NULL');
    await knex.raw("ALTER TABLE products ADD CONSTRAINT products_contact_positive CHECK (contact_minutes > 0)");
  } else await knex.raw('CREATE UNIQUE INDEX products_active_name ON products (name COLLATE NOCASE) WHERE retired_at IS NULL');
  if (!postgres) await knex.raw('CREATE TRIGGER products_contact_positive BEFORE INSERT ON products WHEN NEW.contact_minutes <= 0 BEGIN SELECT RAISE(ABORT, \'contact_minutes must be > 0\'); END');
  if (!postgres) await knex.raw('CREATE TRIGGER products_contact_positive_update BEFORE UPDATE ON products WHEN NEW.contact_minutes <= 0 BEGIN SELECT RAISE(ABORT, \'contact_minutes must be > 0\'); END');

  await knex.schema.createTable('protocol_versions', (t) => {
    t.increments('id').primary();
    t.string('modality', 16).notNullable();
    t.integer('version').notNullable();
    t.string('effective_from', 10).notNullable();
    t.text('body').notNullable();
    t.integer('created_by').nullable().references('users.id');
    t.string('created_at', 40).notNullable();
    t.string('note', 500).notNullable().defaultTo('');
    t.unique(['modality', 'version']);
  });

  const bump = "INSERT INTO day_versions (day, version) VALUES ('setup', 1) ON CONFLICT(day) DO UPDATE SET version = version + 1;";
  for (const table of ['products', 'protocol_versions']) {
    if (postgres) await knex.raw(`CREATE TRIGGER ${table}_day_version AFTER INSERT OR UPDATE OR DELETE ON ${table} FOR EACH ROW EXECUTE FUNCTION day_version_bump_setup()`);
    else for (const action of ['INSERT', 'UPDATE', 'DELETE']) {
      await knex.raw(`CREATE TRIGGER ${table}_day_version_${action.toLowerCase()} AFTER ${action} ON ${table} BEGIN ${bump} END`);
    }
  }

  // No REFERENCES: SQLite's DROP COLUMN (down) refuses a column in a foreign key; ids are never deleted.
  await knex.raw('ALTER TABLE turnovers ADD COLUMN protocol_version_id INTEGER NULL');
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw('ALTER TABLE turnovers DROP COLUMN protocol_version_id');
  // PostgreSQL: DROP TRIGGER needs the table; dropping the tables drops their triggers and the CHECK.
  if (knex.client.config.client === 'pg') {
    await knex.schema.dropTable('protocol_versions');
    await knex.schema.dropTable('products');
    return;
  }
  for (const table of ['products', 'protocol_versions']) {
    for (const action of ['insert', 'update', 'delete']) await knex.raw(`DROP TRIGGER IF EXISTS ${table}_day_version_${action}`);
  }
  await knex.schema.dropTable('protocol_versions');
  await knex.raw('DROP TRIGGER IF EXISTS products_contact_positive');
  await knex.raw('DROP TRIGGER IF EXISTS products_contact_positive_update');
  await knex.schema.dropTable('products');
}
