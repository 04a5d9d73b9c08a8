import type { QueryInterface } from 'sequelize';
import * as initial from './20261201-0001-initial';
import * as capturedMails from './20261201-0002-captured-mails';
import * as library from './20261201-0501-library';
import * as inventories from './20261201-0502-inventories';
import * as batchRuns from './20261201-0503-batch-runs';
import * as trainingAndTeamMail from './20261201-0601-training-and-team-mail';
import * as setupListIndexes from './20261201-0701-setup-list-indexes';
import * as batchPartCorrections from './20261203-0801-batch-part-corrections';
import * as setupReleasedVersion from './20261204-0901-setup-released-version';
import * as problemGrade from './20261204-1001-problem-grade';

export interface Migration {
  readonly name: string;
  up(qi: QueryInterface): Promise<void>;
  down(qi: QueryInterface): Promise<void>;
}

/** Every migration, oldest first. Add new ones at the end. */
export const migrations: readonly Migration[] = [
  { name: '20261201-0001-initial', ...initial },
  { name: '20261201-0002-captured-mails', ...capturedMails },
  { name: '20261201-0601-training-and-team-mail', ...trainingAndTeamMail },
  { name: '20261201-0501-library', ...library },
  { name: '20261201-0502-inventories', ...inventories },
  { name: '20261201-0503-batch-runs', ...batchRuns },
  { name: '20261201-0701-setup-list-indexes', ...setupListIndexes },
  { name: '20261203-0801-batch-part-corrections', ...batchPartCorrections },
  { name: '20261204-0901-setup-released-version', ...setupReleasedVersion },
  { name: '20261204-1001-problem-grade', ...problemGrade },
];
