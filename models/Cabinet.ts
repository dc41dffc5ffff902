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
import type { Strip } from './Strip';

export class Cabinet extends Model<InferAttributes<Cabinet>, InferCreationAttributes<Cabinet>> {
  declare id: CreationOptional<number>;
  declare projectId: number;
  /** Cabinet tag, unique in the project, e.g. '+CP1'. */
  declare tag: string;
  declare name: string;
  declare location: string | null;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare strips?: NonAttribute<Strip[]>;

  static initModel(sequelize: Sequelize): typeof Cabinet {
    return Cabinet.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        projectId: { type: DataTypes.INTEGER, allowNull: false },
        tag: {
          type: DataTypes.STRING(40),
          allowNull: false,
          validate: { notEmpty: { msg: 'tag must not be empty.' } },
        },
        name: {
          type: DataTypes.STRING(200),
          allowNull: false,
          validate: { notEmpty: { msg: 'name must not be empty.' } },
        },
        location: { type: DataTypes.STRING(200), allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
        version: versionColumn,
      },
      {
        sequelize,
        modelName: 'Cabinet',
        tableName: 'cabinets',
        version: true,
        indexes: [{ unique: true, fields: ['projectId', 'tag'] }],
      },
    );
  }
}
