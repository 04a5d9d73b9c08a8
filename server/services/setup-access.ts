import { HttpError } from '../middleware/http-error';
import { Setup } from '../models/setup';
import { User } from '../models/user';

/** The people a set-up response names (owner and releaser). */
export const SETUP_PEOPLE = [
  { model: User, as: 'owner', attributes: ['id', 'name'] },
  { model: User, as: 'releasedBy', attributes: ['id', 'name'] },
];

/** The 404 of a set-up id that is not (visibly) in the user's team. */
export const NOT_IN_TEAM = 'No set-up with that id in your team.';

/** A set-up of the user's team that the user may see, or a 404 (never a hint that it exists). */
export async function findVisibleSetup(id: number, user: User): Promise<Setup> {
  const setup = await Setup.findOne({ where: { id, teamId: user.teamId }, include: SETUP_PEOPLE });
  if (!setup || !canSeeSetup(user, setup)) throw new HttpError(404, NOT_IN_TEAM);
  return setup;
}

/**
 * Who may see a team set-up: leads and admins see all; machinists and apprentices see released
 * and archived team set-ups, drafts revising a set-up that was released (its runs and sheet are in
 * use), and their own drafts.
 */
export function canSeeSetup(user: User, setup: Pick<Setup, 'teamId' | 'ownerId' | 'status' | 'releasedVersion'>): boolean {
  if (setup.teamId !== user.teamId) return false;
  if (user.role === 'admin' || user.role === 'lead') return true;
  return setup.ownerId === user.id || setup.status !== 'draft' || (setup.releasedVersion ?? null) !== null;
}

/** Who may change or delete a set-up: its owner, or a lead or admin of the team. */
export function canChangeSetup(user: User, setup: Setup): boolean {
  if (setup.teamId !== user.teamId) return false;
  return user.role === 'admin' || user.role === 'lead' || setup.ownerId === user.id;
}

/**
 * Why a set-up may not be deleted by anyone, or null: only a draft that was never released may go.
 * A released or archived set-up, or one that was released once (its sheet and runs were in use),
 * is archived by a lead instead, so the shop's record stays. (A set-up with batch runs is refused
 * too; the route counts them.)
 */
export function deleteRefusal(setup: Pick<Setup, 'status' | 'releasedVersion'>): string | null {
  if (setup.status === 'released') return 'This set-up is released, so it cannot be deleted. Archive it instead (a lead or an admin archives set-ups).';
  if (setup.status === 'archived') return 'This set-up is archived and stays on record, so it cannot be deleted.';
  if ((setup.releasedVersion ?? null) !== null) return `Version ${setup.releasedVersion} of this set-up was released, so it cannot be deleted. Archive it instead (a lead or an admin archives set-ups).`;
  return null;
}

/** Who may release or archive a set-up: a lead or an admin of the team (not the owner as such). */
export function canReleaseSetup(user: User, setup: Setup): boolean {
  return setup.teamId === user.teamId && (user.role === 'admin' || user.role === 'lead');
}
