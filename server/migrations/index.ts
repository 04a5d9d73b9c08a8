import type { QueryInterface } from 'sequelize';
import * as initial from './20261201-0001-initial';
import * as capturedMails from './20261201-0002-captured-mails';

export interface Migration {
  readonly name: string;
  up(qi: QueryInterface): Promise<void>;
  down(qi: QueryInterface): Promise<void>;
}

/** Every migration, oldest first. Add new ones at the end. */
export const migrations: readonly Migration[] = [
  { name: '20261201-0001-initial', ...initial },
  { name: '20261201-0002-captured-mails', ...capturedMails },
];
