import type { Knex } from 'knex';
import type { DemoAccounts, Role } from '../../shared/api/auth';

/**
 * The sign-in page's demo accounts as the demo seed wrote them (still active users only), or
 * null when there are none (not seeded, or every one deactivated).
 */
export async function listDemoAccounts(db: Knex): Promise<DemoAccounts | null> {
  const rows: { username: string; password: string; role: Role }[] = await db('demo_accounts as d')
    .join('users as u', 'u.username', 'd.username')
    .where('u.active', true)
    .orderBy('d.sort_order')
    .select('d.username', 'd.password', 'u.role');
  if (rows.length === 0) return null;
  // the seed gives every demo account the same password; the page shows it once
  return { password: rows[0]!.password, accounts: rows.map(({ username, role }) => ({ username, role })) };
}
