import type { Role } from '../../shared/api/auth';

/** Demo sign-ins, one per role; they exist only in demo mode and share one published password. */
export const DEMO_PASSWORD = 'turnwise-demo';

export const DEMO_ACCOUNTS: { username: string; role: Role; displayName: string }[] = [
  { username: 'admin', role: 'admin', displayName: 'Demo admin' },
  { username: 'scheduler', role: 'scheduler', displayName: 'Demo scheduler' },
  { username: 'charge', role: 'charge', displayName: 'Demo charge technologist' },
  { username: 'tech', role: 'tech', displayName: 'Demo technologist' },
  { username: 'frontdesk', role: 'frontdesk', displayName: 'Demo front desk' },
];
