import type { Setup } from '../models/setup';
import type { User } from '../models/user';

/**
 * Who may see a team set-up: leads and admins see all; machinists and apprentices see released
 * and archived team set-ups and their own drafts.
 */
export function canSeeSetup(user: User, setup: Setup): boolean {
  if (setup.teamId !== user.teamId) return false;
  if (user.role === 'admin' || user.role === 'lead') return true;
  return setup.ownerId === user.id || setup.status !== 'draft';
}

/** Who may change or delete a set-up: its owner, or a lead or admin of the team. */
export function canChangeSetup(user: User, setup: Setup): boolean {
  if (setup.teamId !== user.teamId) return false;
  return user.role === 'admin' || user.role === 'lead' || setup.ownerId === user.id;
}
