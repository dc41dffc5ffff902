import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from 'sequelize';
import { PROJECT_ROLES, type ProjectRole } from './enums';
import { oneOf } from './validators';
import type { Project } from './Project';
import type { User } from './User';

/** A user's role on one project (roles are per project; admin is global, on User). */
export class ProjectMember extends Model<
  InferAttributes<ProjectMember>,
  InferCreationAttributes<ProjectMember>
> {
  declare id: CreationOptional<number>;
  declare userId: number;
  declare projectId: number;
  declare role: ProjectRole;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare user?: NonAttribute<User>;
  declare project?: NonAttribute<Project>;

  static initModel(sequelize: Sequelize): typeof ProjectMember {
    return ProjectMember.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        userId: { type: DataTypes.INTEGER, allowNull: false },
        projectId: { type: DataTypes.INTEGER, allowNull: false },
        role: {
          type: DataTypes.STRING(20),
          allowNull: false,
          validate: oneOf('role', PROJECT_ROLES),
        },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      {
        sequelize,
        modelName: 'ProjectMember',
        tableName: 'project_members',
        indexes: [{ unique: true, fields: ['userId', 'projectId'] }, { fields: ['projectId'] }],
      },
    );
  }
}
