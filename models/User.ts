import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from 'sequelize';
import { versionColumn } from './validators';
import type { ProjectMember } from './ProjectMember';

export class User extends Model<InferAttributes<User>, InferCreationAttributes<User>> {
  declare id: CreationOptional<number>;
  declare email: string;
  declare name: string;
  /** bcrypt hash (bcryptjs); never the password itself. */
  declare passwordHash: string;
  /** The global administrator role: users, invitations, membership. */
  declare isAdmin: CreationOptional<boolean>;
  declare active: CreationOptional<boolean>;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare memberships?: NonAttribute<ProjectMember[]>;

  static initModel(sequelize: Sequelize): typeof User {
    return User.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        email: {
          type: DataTypes.STRING(254),
          allowNull: false,
          unique: true,
          // Stored lower-case so uniqueness does not depend on the database's collation.
          set(value: string) {
            this.setDataValue(
              'email',
              typeof value === 'string' ? value.trim().toLowerCase() : value,
            );
          },
          validate: { isEmail: { msg: 'email must be a valid e-mail address.' } },
        },
        name: {
          type: DataTypes.STRING(120),
          allowNull: false,
          validate: { notEmpty: { msg: 'name must not be empty.' } },
        },
        passwordHash: {
          type: DataTypes.STRING(100),
          allowNull: false,
          validate: {
            isBcrypt(value: string) {
              if (!/^\$2[aby]\$\d{2}\$.{53}$/.test(value)) {
                throw new Error('passwordHash must be a bcrypt hash, not a password.');
              }
            },
          },
        },
        isAdmin: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
        version: versionColumn,
      },
      {
        sequelize,
        modelName: 'User',
        tableName: 'users',
        version: true,
        defaultScope: { attributes: { exclude: ['passwordHash'] } },
        scopes: { withPassword: { attributes: { include: ['passwordHash'] } } },
      },
    );
  }
}
