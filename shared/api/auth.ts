import { z } from 'zod';

/** The four roles of a team member, from most to least trusted. */
export const ROLES = ['admin', 'lead', 'machinist', 'apprentice'] as const;
export type Role = (typeof ROLES)[number];

/** What the API shows of a user. */
export interface PublicUser {
  id: number;
  email: string;
  name: string;
  role: Role;
}

export const loginBody = z.object({
  email: z.string({ error: 'Enter your e-mail address.' }).trim().min(1, 'Enter your e-mail address.').max(254, 'That e-mail address is too long.'),
  password: z.string({ error: 'Enter your password.' }).min(1, 'Enter your password.').max(200, 'That password is too long.'),
});
export type LoginBody = z.infer<typeof loginBody>;

/** Same rule everywhere a password is chosen (invitation, reset). */
export const newPassword = z
  .string({ error: 'Choose a password.' })
  .min(10, 'Use at least 10 characters.')
  .max(200, 'Use at most 200 characters.');
