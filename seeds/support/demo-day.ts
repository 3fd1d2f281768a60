import type { Knex } from 'knex';

/** Today's invented day list; filled in with the day-plan core. */
export async function seedDemoDay(_knex: Knex, _now: Date): Promise<void> {}
