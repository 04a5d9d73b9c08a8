import type { Sequelize } from 'sequelize';
import { CapturedMail } from './captured-mail';
import { LoginFailure } from './login-failure';
import { Session } from './session';
import { Setup } from './setup';
import { Team } from './team';
import { User } from './user';
import { Invitation } from './invitation';
import { PasswordReset } from './password-reset';
import { Assignment } from './assignment';
import { AssignmentWork } from './assignment-work';
import { TrainingProblem } from './training-problem';
import { TrainingAttempt } from './training-attempt';
import { Attachment } from './attachment';
import { BatchPart, BatchRun } from './batch-run';
import { InventoryBlock, InventorySet } from './inventory';
import { SetupRevision } from './setup-revision';

export { CapturedMail, LoginFailure, Session, Setup, Team, User };
export { Invitation, PasswordReset, Assignment, AssignmentWork, TrainingProblem, TrainingAttempt };
export { Attachment, BatchPart, BatchRun, InventoryBlock, InventorySet, SetupRevision };

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

  // Team e-mail and training (issue 6).
  Invitation.initModel(sequelize);
  PasswordReset.initModel(sequelize);
  Assignment.initModel(sequelize);
  AssignmentWork.initModel(sequelize);
  TrainingProblem.initModel(sequelize);
  TrainingAttempt.initModel(sequelize);
  Invitation.belongsTo(Team, { as: 'team', foreignKey: 'teamId' });
  Invitation.belongsTo(User, { as: 'invitedBy', foreignKey: 'invitedById' });
  PasswordReset.belongsTo(User, { foreignKey: 'userId' });
  Assignment.belongsTo(Team, { foreignKey: 'teamId' });
  Assignment.belongsTo(User, { as: 'createdBy', foreignKey: 'createdById' });
  Assignment.hasMany(AssignmentWork, { as: 'work', foreignKey: 'assignmentId' });
  AssignmentWork.belongsTo(Assignment, { as: 'assignment', foreignKey: 'assignmentId' });
  AssignmentWork.belongsTo(User, { as: 'user', foreignKey: 'userId' });
  AssignmentWork.hasMany(TrainingProblem, { as: 'problems', foreignKey: 'workId' });
  TrainingProblem.hasMany(TrainingAttempt, { as: 'attempts', foreignKey: 'problemId' });

  // Set-up library, inventories and batch runs (issue 5).
  SetupRevision.initModel(sequelize);
  Attachment.initModel(sequelize);
  InventorySet.initModel(sequelize);
  InventoryBlock.initModel(sequelize);
  BatchRun.initModel(sequelize);
  BatchPart.initModel(sequelize);
  Setup.belongsTo(User, { as: 'releasedBy', foreignKey: 'releasedById' });
  SetupRevision.belongsTo(User, { as: 'user', foreignKey: 'userId' });
  Attachment.belongsTo(User, { as: 'uploadedBy', foreignKey: 'uploadedById' });
  InventorySet.hasMany(InventoryBlock, { as: 'blocks', foreignKey: 'setId' });
  BatchRun.belongsTo(User, { as: 'startedBy', foreignKey: 'startedById' });
  BatchRun.belongsTo(User, { as: 'closedBy', foreignKey: 'closedById' });
  BatchRun.hasMany(BatchPart, { as: 'parts', foreignKey: 'runId' });
  BatchPart.belongsTo(User, { as: 'operator', foreignKey: 'operatorId' });
  BatchPart.belongsTo(User, { as: 'correctedBy', foreignKey: 'correctedById' });
}
