import type { Role } from '../../shared/api/auth';

/** Demo sign-ins, one per role; they exist only in demo mode and share one published password. Names are invented. */
export const DEMO_PASSWORD = 'turnwise-demo';

export const DEMO_ACCOUNTS: { username: string; role: Role; displayName: string }[] = [
  { username: 'admin', role: 'admin', displayName: 'Sam Whitlock' },
  { username: 'scheduler', role: 'scheduler', displayName: 'Noor Haddad' },
  { username: 'charge', role: 'charge', displayName: 'Jules Okoro' },
  { username: 'tech', role: 'tech', displayName: 'Mika Lindahl' },
  { username: 'frontdesk', role: 'frontdesk', displayName: 'Dee Alvarez' },
];
