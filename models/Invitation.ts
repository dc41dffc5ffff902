import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import { PROJECT_ROLES, type ProjectRole } from './enums';
import { oneOf } from './validators';

export class Invitation extends Model<
  InferAttributes<Invitation>,
  InferCreationAttributes<Invitation>
> {
  declare id: CreationOptional<number>;
  declare email: string;
  declare projectId: number;
  declare role: ProjectRole;
  /** Random secret sent in the invitation link (store a hash here if links must not be recoverable). */
  declare token: string;
  declare expiresAt: Date;
  declare acceptedAt: Date | null;
  declare invitedById: number | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): typeof Invitation {
    return Invitation.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        email: {
          type: DataTypes.STRING(254),
          allowNull: false,
          set(value: string) {
            this.setDataValue(
              'email',
              typeof value === 'string' ? value.trim().toLowerCase() : value,
            );
          },
          validate: { isEmail: { msg: 'email must be a valid e-mail address.' } },
        },
        projectId: { type: DataTypes.INTEGER, allowNull: false },
        role: {
          type: DataTypes.STRING(20),
          allowNull: false,
          validate: oneOf('role', PROJECT_ROLES),
        },
        token: {
          type: DataTypes.STRING(128),
          allowNull: false,
          unique: true,
          validate: { len: { args: [20, 128], msg: 'token must be 20 to 128 characters.' } },
        },
        expiresAt: { type: DataTypes.DATE, allowNull: false },
        acceptedAt: { type: DataTypes.DATE, allowNull: true },
        invitedById: { type: DataTypes.INTEGER, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      {
        sequelize,
        modelName: 'Invitation',
        tableName: 'invitations',
        indexes: [{ fields: ['projectId'] }, { fields: ['invitedById'] }, { fields: ['email'] }],
      },
    );
  }
}
