import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from 'sequelize';
import { overridesShapeProblems, type GuardOverrides } from '@/lib/presets/overrides';
import { SIGNAL_TYPES, type SignalType } from './enums';
import { oneOf, versionColumn } from './validators';
import type { GuardRecipe } from './GuardRecipe';
import type { Terminal } from './Terminal';

/** One sensitive input; no recipe means no guard at all (the engine calls it unprotected). */
export class Channel extends Model<InferAttributes<Channel>, InferCreationAttributes<Channel>> {
  declare id: CreationOptional<number>;
  declare projectId: number;
  declare cabinetId: number;
  /** I/O tag, unique in the project, e.g. 'TT-2104'. */
  declare tag: string;
  declare name: string | null;
  declare signalType: SignalType;
  declare signalTerminalId: number | null;
  declare returnTerminalId: number | null;
  declare guardRecipeId: number | null;
  declare guardOverrides: GuardOverrides | null;
  declare notes: string | null;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare guardRecipe?: NonAttribute<GuardRecipe | null>;
  declare signalTerminal?: NonAttribute<Terminal | null>;
  declare returnTerminal?: NonAttribute<Terminal | null>;

  static initModel(sequelize: Sequelize): typeof Channel {
    return Channel.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        projectId: { type: DataTypes.INTEGER, allowNull: false },
        cabinetId: { type: DataTypes.INTEGER, allowNull: false },
        tag: {
          type: DataTypes.STRING(40),
          allowNull: false,
          validate: { notEmpty: { msg: 'tag must not be empty.' } },
        },
        name: { type: DataTypes.STRING(200), allowNull: true },
        signalType: {
          type: DataTypes.STRING(20),
          allowNull: false,
          validate: oneOf('signalType', SIGNAL_TYPES),
        },
        signalTerminalId: { type: DataTypes.INTEGER, allowNull: true },
        returnTerminalId: { type: DataTypes.INTEGER, allowNull: true },
        guardRecipeId: { type: DataTypes.INTEGER, allowNull: true },
        guardOverrides: {
          type: DataTypes.JSON,
          allowNull: true,
          validate: {
            isOverrides(value: unknown) {
              const problems = overridesShapeProblems(value);
              if (problems.length > 0) throw new Error(problems.join(' '));
            },
          },
        },
        notes: { type: DataTypes.TEXT, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
        version: versionColumn,
      },
      {
        sequelize,
        modelName: 'Channel',
        tableName: 'channels',
        version: true,
        indexes: [{ unique: true, fields: ['projectId', 'tag'] }],
        validate: {
          distinctTerminals(this: Channel) {
            if (this.signalTerminalId != null && this.signalTerminalId === this.returnTerminalId) {
              throw new Error('signalTerminalId and returnTerminalId must be different terminals.');
            }
          },
        },
      },
    );
  }
}
