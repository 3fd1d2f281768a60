import type { Knex } from 'knex';
import { seed as seedReference } from '../seeds/01-reference-data';
import { seed as seedDemoCentre } from '../seeds/02-demo-centre';

/** What every install needs (idempotent). */
export async function seedReferenceData(db: Knex): Promise<void> {
  await seedReference(db);
}

/** The invented demo centre and today's day list (idempotent; demo mode only). */
export async function seedDemo(db: Knex, now: Date, options: { day?: boolean; history?: boolean } = {}): Promise<void> {
  await seedDemoCentre(db, now, options);
}
