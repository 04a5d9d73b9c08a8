/**
 * Which tables a team archive holds, how each one's rows are chosen for a team, and which columns
 * point at other rows (remapped to new ids on import). Parents come before children.
 */

/** The format name written into team.json; the importer refuses any other. */
export const TEAM_ARCHIVE_FORMAT = 'slantwise.team-archive/1';

/** One exported table. */
export interface TeamTable {
  readonly table: string;
  /** SQL condition choosing the team's rows; `:teamId` is replaced safely. */
  readonly where: string;
  /** Column → table whose new id replaces the value on import. */
  readonly refs: Readonly<Record<string, string>>;
  /** Columns never exported (secrets). */
  readonly omit?: readonly string[];
}

const TEAM_SETUPS = 'SELECT id FROM setups WHERE teamId = :teamId';
const TEAM_WORK = 'SELECT w.id FROM assignment_work w JOIN assignments a ON a.id = w.assignmentId WHERE a.teamId = :teamId';

export const TEAM_TABLES: readonly TeamTable[] = [
  { table: 'teams', where: 'id = :teamId', refs: {} },
  // Members keep their bcrypt password hashes, so they can sign in after a restore.
  { table: 'users', where: 'teamId = :teamId', refs: { teamId: 'teams' } },
  // Block boxes before set-ups: a set-up's inputs may name a box ("box:<id>"), rewritten on import.
  { table: 'inventory_sets', where: 'teamId = :teamId', refs: { teamId: 'teams' } },
  { table: 'inventory_blocks', where: 'setId IN (SELECT id FROM inventory_sets WHERE teamId = :teamId)', refs: { setId: 'inventory_sets' } },
  { table: 'setups', where: 'teamId = :teamId', refs: { teamId: 'teams', ownerId: 'users', releasedById: 'users' } },
  { table: 'setup_revisions', where: `setupId IN (${TEAM_SETUPS})`, refs: { setupId: 'setups', userId: 'users' } },
  { table: 'attachments', where: 'teamId = :teamId', refs: { teamId: 'teams', setupId: 'setups', uploadedById: 'users' } },
  { table: 'batch_runs', where: 'teamId = :teamId', refs: { teamId: 'teams', setupId: 'setups', startedById: 'users', closedById: 'users' } },
  { table: 'batch_parts', where: 'runId IN (SELECT id FROM batch_runs WHERE teamId = :teamId)', refs: { runId: 'batch_runs', operatorId: 'users', correctedById: 'users' } },
  // Only the sha256 of an invitation's token is stored; even that stays out of the archive.
  { table: 'invitations', where: 'teamId = :teamId', refs: { teamId: 'teams', invitedById: 'users' }, omit: ['tokenHash'] },
  { table: 'assignments', where: 'teamId = :teamId', refs: { teamId: 'teams', createdById: 'users' } },
  { table: 'assignment_work', where: 'assignmentId IN (SELECT id FROM assignments WHERE teamId = :teamId)', refs: { assignmentId: 'assignments', userId: 'users' } },
  { table: 'training_problems', where: `workId IN (${TEAM_WORK})`, refs: { workId: 'assignment_work', gradedById: 'users' } },
  {
    table: 'training_attempts',
    where: `problemId IN (SELECT p.id FROM training_problems p WHERE p.workId IN (${TEAM_WORK}))`,
    refs: { problemId: 'training_problems' },
  },
];

/** Tables deliberately left out of every archive, and why. */
export const NOT_EXPORTED: Readonly<Record<string, string>> = {
  sessions: 'sign-ins belong to one instance; members sign in again',
  login_failures: 'throttling counters, not team data',
  password_resets: 'single-use reset tokens must not outlive the instance',
  captured_mails: 'the dev mailbox of the local SMTP catcher',
  migrations: 'the schema history of the instance itself',
};
