import type { InferAttributes, Sequelize } from 'sequelize';
import { Attachment } from './Attachment';
import { AuditLog } from './AuditLog';
import { AuditRun } from './AuditRun';
import { Cabinet } from './Cabinet';
import { Channel } from './Channel';
import { Decision } from './Decision';
import { Finding } from './Finding';
import { GuardRecipe } from './GuardRecipe';
import { Invitation } from './Invitation';
import { Markup } from './Markup';
import { OutboxMessage } from './OutboxMessage';
import { Project } from './Project';
import { ProjectMember } from './ProjectMember';
import { Strip } from './Strip';
import { Terminal } from './Terminal';
import { User } from './User';

export {
  Attachment,
  AuditLog,
  AuditRun,
  Cabinet,
  Channel,
  Decision,
  Finding,
  GuardRecipe,
  Invitation,
  Markup,
  OutboxMessage,
  Project,
  ProjectMember,
  Strip,
  Terminal,
  User,
};
export { AppendOnlyError } from './AuditLog';
export { PROJECT_SETTING_DEFAULTS, type LikelihoodWeights } from './Project';
export * from './enums';

export const models = {
  User,
  ProjectMember,
  Invitation,
  Project,
  Cabinet,
  Strip,
  Terminal,
  Channel,
  GuardRecipe,
  AuditRun,
  Finding,
  Decision,
  Markup,
  Attachment,
  AuditLog,
  OutboxMessage,
} as const;
export type Models = typeof models;

/** Generic forms: Attributes<Terminal>, CreationAttributes<Terminal>. */
export type {
  InferAttributes as Attributes,
  InferCreationAttributes as CreationAttributes,
} from 'sequelize';

/** Plain attribute types, derived from the model classes (never retyped by hand). */
export type UserAttributes = InferAttributes<User>;
export type ProjectMemberAttributes = InferAttributes<ProjectMember>;
export type InvitationAttributes = InferAttributes<Invitation>;
export type ProjectAttributes = InferAttributes<Project>;
export type CabinetAttributes = InferAttributes<Cabinet>;
export type StripAttributes = InferAttributes<Strip>;
export type TerminalAttributes = InferAttributes<Terminal>;
export type ChannelAttributes = InferAttributes<Channel>;
export type GuardRecipeAttributes = InferAttributes<GuardRecipe>;
export type AuditRunAttributes = InferAttributes<AuditRun>;
export type FindingAttributes = InferAttributes<Finding>;
export type DecisionAttributes = InferAttributes<Decision>;
export type MarkupAttributes = InferAttributes<Markup>;
export type AttachmentAttributes = InferAttributes<Attachment>;
export type AuditLogAttributes = InferAttributes<AuditLog>;
export type OutboxMessageAttributes = InferAttributes<OutboxMessage>;

function associate(): void {
  User.hasMany(ProjectMember, { foreignKey: 'userId', as: 'memberships' });
  ProjectMember.belongsTo(User, { foreignKey: 'userId', as: 'user' });
  Project.hasMany(ProjectMember, { foreignKey: 'projectId', as: 'members' });
  ProjectMember.belongsTo(Project, { foreignKey: 'projectId', as: 'project' });
  Project.hasMany(Invitation, { foreignKey: 'projectId', as: 'invitations' });
  Invitation.belongsTo(Project, { foreignKey: 'projectId', as: 'project' });
  Invitation.belongsTo(User, { foreignKey: 'invitedById', as: 'invitedBy' });

  Project.hasMany(Cabinet, { foreignKey: 'projectId', as: 'cabinets' });
  Cabinet.belongsTo(Project, { foreignKey: 'projectId', as: 'project' });
  Cabinet.hasMany(Strip, { foreignKey: 'cabinetId', as: 'strips' });
  Strip.belongsTo(Cabinet, { foreignKey: 'cabinetId', as: 'cabinet' });
  Strip.hasMany(Terminal, { foreignKey: 'stripId', as: 'terminals' });
  Terminal.belongsTo(Strip, { foreignKey: 'stripId', as: 'strip' });

  Project.hasMany(Channel, { foreignKey: 'projectId', as: 'channels' });
  Channel.belongsTo(Project, { foreignKey: 'projectId', as: 'project' });
  Cabinet.hasMany(Channel, { foreignKey: 'cabinetId', as: 'channels' });
  Channel.belongsTo(Cabinet, { foreignKey: 'cabinetId', as: 'cabinet' });
  Channel.belongsTo(Terminal, { foreignKey: 'signalTerminalId', as: 'signalTerminal' });
  Channel.belongsTo(Terminal, { foreignKey: 'returnTerminalId', as: 'returnTerminal' });
  Terminal.belongsTo(Channel, { foreignKey: 'channelId', as: 'channel', constraints: false });
  Project.hasMany(GuardRecipe, { foreignKey: 'projectId', as: 'guardRecipes' });
  GuardRecipe.belongsTo(Project, { foreignKey: 'projectId', as: 'project' });
  Channel.belongsTo(GuardRecipe, { foreignKey: 'guardRecipeId', as: 'guardRecipe' });
  GuardRecipe.hasMany(Channel, { foreignKey: 'guardRecipeId', as: 'channels' });

  Project.hasMany(AuditRun, { foreignKey: 'projectId', as: 'auditRuns' });
  AuditRun.belongsTo(Project, { foreignKey: 'projectId', as: 'project' });
  AuditRun.belongsTo(User, { foreignKey: 'createdById', as: 'createdBy' });
  AuditRun.belongsTo(User, { foreignKey: 'signedById', as: 'signedBy' });
  AuditRun.hasMany(Finding, { foreignKey: 'auditRunId', as: 'findings' });
  Finding.belongsTo(AuditRun, { foreignKey: 'auditRunId', as: 'auditRun' });
  Finding.belongsTo(Channel, { foreignKey: 'channelId', as: 'channel' });
  Finding.belongsTo(Terminal, { foreignKey: 'hazardTerminalId', as: 'hazardTerminal' });
  Finding.hasOne(Decision, { foreignKey: 'findingId', as: 'decision' });
  Decision.belongsTo(Finding, { foreignKey: 'findingId', as: 'finding' });
  Decision.belongsTo(User, { foreignKey: 'reviewerId', as: 'reviewer' });

  Project.hasMany(Markup, { foreignKey: 'projectId', as: 'markups' });
  Markup.belongsTo(Project, { foreignKey: 'projectId', as: 'project' });
  Markup.belongsTo(Terminal, { foreignKey: 'terminalId', as: 'terminal' });
  Markup.belongsTo(User, { foreignKey: 'authorId', as: 'author' });
  Markup.belongsTo(User, { foreignKey: 'decidedById', as: 'decidedBy' });
  Markup.hasMany(Attachment, { foreignKey: 'markupId', as: 'attachments' });
  Attachment.belongsTo(Markup, { foreignKey: 'markupId', as: 'markup' });
  Attachment.belongsTo(Project, { foreignKey: 'projectId', as: 'project' });
  Attachment.belongsTo(User, { foreignKey: 'uploadedById', as: 'uploadedBy' });
}

/**
 * Binds every model class to `sequelize` and wires the associations. Calling it again with
 * another instance rebinds the classes (tests, scripts); the app calls it once via getDb().
 */
export function initModels(sequelize: Sequelize): Models {
  for (const model of Object.values(models)) model.initModel(sequelize);
  associate();
  return models;
}
