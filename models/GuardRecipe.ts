import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import { versionColumn } from './validators';
import type { Guard } from '@/lib/stress/types';
import { guardShapeProblems } from '@/lib/presets/guard-shape';

/** A named protection network in a project's library; channels refer to one. */
export class GuardRecipe extends Model<
  InferAttributes<GuardRecipe>,
  InferCreationAttributes<GuardRecipe>
> {
  declare id: CreationOptional<number>;
  declare projectId: number;
  declare name: string;
  declare description: string | null;
  /** The network in SI numbers, exactly lib/stress/types.ts `Guard`. */
  declare guard: Guard;
  /** Copied from a shipped preset (typical values — verify against the part's datasheet). */
  declare isPreset: CreationOptional<boolean>;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): typeof GuardRecipe {
    return GuardRecipe.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        projectId: { type: DataTypes.INTEGER, allowNull: false },
        name: {
          type: DataTypes.STRING(120),
          allowNull: false,
          validate: { notEmpty: { msg: 'name must not be empty.' } },
        },
        description: { type: DataTypes.TEXT, allowNull: true },
        guard: {
          type: DataTypes.JSON,
          allowNull: false,
          validate: {
            isGuard(value: unknown) {
              const problems = guardShapeProblems(value);
              if (problems.length > 0) throw new Error(problems.join(' '));
            },
          },
        },
        isPreset: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
        version: versionColumn,
      },
      {
        sequelize,
        modelName: 'GuardRecipe',
        tableName: 'guard_recipes',
        version: true,
        indexes: [{ unique: true, fields: ['projectId', 'name'] }],
      },
    );
  }
}
