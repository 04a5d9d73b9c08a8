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

/** Shortest and longest password anyone may choose. */
export const PASSWORD_MIN = 10;
export const PASSWORD_MAX = 200;

/** Messages of the password rule, the same on the server and in the forms. */
export const PASSWORD_MESSAGES = {
  min: `Use at least ${PASSWORD_MIN} characters.`,
  max: `Use at most ${PASSWORD_MAX} characters.`,
  blank: 'Use letters, digits or signs, not only spaces.',
} as const;

/**
 * What is wrong with a chosen password, or null: the rule of every place a password is chosen
 * (invitation, reset, any change). Spaces count, but a password of spaces only is refused.
 */
export function newPasswordProblem(password: string): string | null {
  if (password.length < PASSWORD_MIN) return PASSWORD_MESSAGES.min;
  if (password.length > PASSWORD_MAX) return PASSWORD_MESSAGES.max;
  if (password.trim() === '') return PASSWORD_MESSAGES.blank;
  return null;
}

/** Same rule everywhere a password is chosen (invitation, reset). */
export const newPassword = z
  .string({ error: 'Choose a password.' })
  .min(PASSWORD_MIN, PASSWORD_MESSAGES.min)
  .max(PASSWORD_MAX, PASSWORD_MESSAGES.max)
  .refine((p) => p.trim() !== '', PASSWORD_MESSAGES.blank);
