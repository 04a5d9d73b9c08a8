import type { QueryInterface } from 'sequelize';

/**
 * Indexes for the library list: each common filter (area, status, owner) with the default sort
 * (most recently changed first), so a page is read in index order without sorting the team's rows.
 */
export async function up(qi: QueryInterface): Promise<void> {
  await qi.addIndex('setups', ['teamId', 'kind', 'status', 'updatedAt', 'id'], { name: 'setups_team_kind_status_updated' });
  await qi.addIndex('setups', ['teamId', 'status', 'updatedAt', 'id'], { name: 'setups_team_status_updated' });
  await qi.addIndex('setups', ['teamId', 'ownerId', 'updatedAt', 'id'], { name: 'setups_team_owner_updated' });
}

export async function down(qi: QueryInterface): Promise<void> {
  await qi.removeIndex('setups', 'setups_team_kind_status_updated');
  await qi.removeIndex('setups', 'setups_team_status_updated');
  await qi.removeIndex('setups', 'setups_team_owner_updated');
}
