import { z } from 'zod';
import { ROLES, type Role } from './auth';

/**
 * The password policy, stated in the UI beside every password field. Length is what makes a
 * password hard to guess (no composition rules; common practice, no source); 12 matches
 * `npm run create-admin`.
 */
export const PASSWORD_MIN_LENGTH = 12;
export const PASSWORD_MAX_LENGTH = 200;

const password = z
  .string()
  .min(PASSWORD_MIN_LENGTH, `use at least ${PASSWORD_MIN_LENGTH} characters`)
  .max(PASSWORD_MAX_LENGTH, `use at most ${PASSWORD_MAX_LENGTH} characters`);
const username = z
  .string()
  .trim()
  .regex(/^[A-Za-z0-9._-]{2,64}$/, 'use 2–64 letters, digits, dots, dashes or underscores');
const displayName = z.string().trim().min(1, 'a user needs a name').max(120, 'use at most 120 characters');
const email = z.string().trim().max(254, 'use at most 254 characters').pipe(z.email('not an e-mail address'));
const role = z.enum(ROLES, { message: `use one of ${ROLES.join(', ')}` });

/** `POST /api/users`: the first password is the admin's to hand over; the user changes it at first sign-in. */
export const newUserSchema = z.object({ username, displayName, email, role, password });
export type NewUser = z.output<typeof newUserSchema>;

/** `PATCH /api/users/:id`: any of name, e-mail and role. */
export const userChangeSchema = z
  .object({ displayName: displayName.optional(), email: email.optional(), role: role.optional() })
  .refine((c) => c.displayName !== undefined || c.email !== undefined || c.role !== undefined, 'change at least one of displayName, email, role');
export type UserChange = z.output<typeof userChangeSchema>;

/** `POST /api/users/:id/password`: a new first password; the user must change it at next sign-in. */
export const passwordResetSchema = z.object({ password });

/** `PUT /api/profile/password`: one's own password. */
export const passwordChangeSchema = z.object({
  currentPassword: z.string().min(1, 'enter your current password').max(PASSWORD_MAX_LENGTH),
  newPassword: password,
});
export type PasswordChange = z.output<typeof passwordChangeSchema>;

/** A user as Setup and the profile page see it (never the password hash). */
export interface UserAccount {
  id: number;
  username: string;
  displayName: string;
  /** Older accounts (and `create-admin`'s) may have none. */
  email: string | null;
  role: Role;
  active: boolean;
  /** Set by a reset: every call but the profile's is refused until the user picks a password. */
  mustChangePassword: boolean;
  createdAt: string;
}
