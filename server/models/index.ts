import type { Sequelize } from 'sequelize';
import { CapturedMail } from './captured-mail';
import { LoginFailure } from './login-failure';
import { Session } from './session';
import { Setup } from './setup';
import { Team } from './team';
import { User } from './user';

export { CapturedMail, LoginFailure, Session, Setup, Team, User };

/** Defines every model on the instance and wires the associations in one place. */
export function initModels(sequelize: Sequelize): void {
  Team.initModel(sequelize);
  User.initModel(sequelize);
  Setup.initModel(sequelize);
  Session.initModel(sequelize);
  LoginFailure.initModel(sequelize);
  CapturedMail.initModel(sequelize);

  Team.hasMany(User, { foreignKey: 'teamId' });
  User.belongsTo(Team, { foreignKey: 'teamId' });
  Team.hasMany(Setup, { foreignKey: 'teamId' });
  Setup.belongsTo(Team, { foreignKey: 'teamId' });
  Setup.belongsTo(User, { as: 'owner', foreignKey: 'ownerId' });
}
