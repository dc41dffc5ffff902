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
import type { Terminal } from './Terminal';

/** A terminal rail in a cabinet; `order` sorts the strips of a cabinet for display. */
export class Strip extends Model<InferAttributes<Strip>, InferCreationAttributes<Strip>> {
  declare id: CreationOptional<number>;
  declare cabinetId: number;
  /** Strip tag, unique in the cabinet, e.g. 'X3'. */
  declare tag: string;
  declare name: string | null;
  declare order: CreationOptional<number>;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare terminals?: NonAttribute<Terminal[]>;

  static initModel(sequelize: Sequelize): typeof Strip {
    return Strip.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        cabinetId: { type: DataTypes.INTEGER, allowNull: false },
        tag: {
          type: DataTypes.STRING(20),
          allowNull: false,
          validate: { notEmpty: { msg: 'tag must not be empty.' } },
        },
        name: { type: DataTypes.STRING(200), allowNull: true },
        order: {
          type: DataTypes.INTEGER,
          allowNull: false,
          defaultValue: 0,
          validate: { isInt: { msg: 'order must be an integer.' } },
        },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
        version: versionColumn,
      },
      {
        sequelize,
        modelName: 'Strip',
        tableName: 'strips',
        version: true,
        indexes: [{ unique: true, fields: ['cabinetId', 'tag'] }],
      },
    );
  }
}
