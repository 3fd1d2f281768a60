import type { Knex } from 'knex';
import { DEFAULT_SETTINGS } from '../shared/api/settings';

/** Settings every install needs; existing values are never overwritten. */
export async function seed(knex: Knex): Promise<void> {
  for (const [key, value] of Object.entries(DEFAULT_SETTINGS)) {
    await knex('settings').insert({ key, value: JSON.stringify(value) }).onConflict('key').ignore();
  }
}
