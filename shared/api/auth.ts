/** The five roles; what each may do is enforced on the server for every route. */
export const ROLES = ['admin', 'scheduler', 'charge', 'tech', 'frontdesk'] as const;
export type Role = (typeof ROLES)[number];

/** Each role as people read it, e.g. "Charge technologist"; the client and the server's messages say the same. */
export const ROLE_LABELS: Readonly<Record<Role, string>> = {
  admin: 'Admin',
  scheduler: 'Scheduler',
  charge: 'Charge technologist',
  tech: 'Technologist',
  frontdesk: 'Front desk',
};

export interface SessionUser {
  username: string;
  role: Role;
  displayName?: string;
  /** A reset password: the client sends the user to their profile to choose their own. */
  mustChangePassword?: boolean;
}

export interface LoginResponse {
  user: SessionUser;
}

export interface DemoAccounts {
  password: string;
  accounts: { username: string; role: Role }[];
}
