import type { Knex } from 'knex';
import { hashPassword } from '../server/services/passwords';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from './support/demo-accounts';
import { seedDemoDay } from './support/demo-day';
import { seedDemoHistory } from './support/demo-history';
import { seedDemoRules } from './support/demo-rules';
import { seedShiftTasks } from './support/demo-shift-tasks';

/**
 * An invented outpatient centre: three MR rooms and one CT room, a user for every role, its
 * products and protocols (stored as data, as a real site's would be), and a
 * day list for the current day (so the demo always shows today), and each room's default shift
 * tasks. Idempotent: what exists stays.
 */
export const DEMO_SITE = { siteName: 'Turnwise Demo Imaging Centre', timezone: 'America/Chicago', snugMarginMinutes: 3 };

export const DEMO_ROOMS = [
  { name: 'MR 1', modality: 'MR', air_changes_per_hour: 6, staff: 1, opens_at: '07:00', closes_at: '19:00', sort_order: 1 },
  { name: 'MR 2', modality: 'MR', air_changes_per_hour: 12, staff: 1, opens_at: '07:00', closes_at: '19:00', sort_order: 2 },
  { name: 'MR 3', modality: 'MR', air_changes_per_hour: 8, staff: 2, opens_at: '07:00', closes_at: '19:00', sort_order: 3 },
  { name: 'CT 1', modality: 'CT', air_changes_per_hour: 12, staff: 1, opens_at: '07:00', closes_at: '19:00', sort_order: 4 },
];

export async function seed(knex: Knex, now: Date = new Date(), options: { day?: boolean; history?: boolean } = {}): Promise<void> {
  const created = now.toISOString();
  const isFresh = (await knex('users').count({ n: '*' }))[0]!['n'] === 0;
  if (isFresh) {
    for (const [key, value] of Object.entries(DEMO_SITE)) {
      await knex('settings').insert({ key, value: JSON.stringify(value) }).onConflict('key').merge();
    }
  }
  for (const [i, account] of DEMO_ACCOUNTS.entries()) {
    // the sign-in page lists them from here in demo mode (the server never imports this seed)
    await knex('demo_accounts').insert({ username: account.username, password: DEMO_PASSWORD, sort_order: i }).onConflict('username').ignore();
    const exists = await knex('users').where({ username: account.username }).first();
    if (exists) continue;
    await knex('users').insert({
      username: account.username,
      display_name: account.displayName,
      password_hash: await hashPassword(DEMO_PASSWORD),
      role: account.role,
      active: true,
      created_at: created,
    });
  }
  for (const room of DEMO_ROOMS) {
    await knex('rooms').insert({ ...room, created_at: created }).onConflict('name').ignore();
  }
  await seedDemoRules(knex, now);
  await seedShiftTasks(knex, now);
  if (options.day ?? true) await seedDemoDay(knex, now);
  if (options.history) await seedDemoHistory(knex, now);
}
