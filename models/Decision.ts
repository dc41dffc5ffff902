import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import { DECISION_OUTCOMES, type DecisionOutcome } from './enums';
import { oneOf, versionColumn } from './validators';

/** The reviewer's call on one finding (one per finding; changed through a versioned update). */
export class Decision extends Model<InferAttributes<Decision>, InferCreationAttributes<Decision>> {
  declare id: CreationOptional<number>;
  declare findingId: number;
  declare reviewerId: number;
  declare outcome: DecisionOutcome;
  declare justification: string | null;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): typeof Decision {
    return Decision.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        findingId: { type: DataTypes.INTEGER, allowNull: false, unique: true },
        reviewerId: { type: DataTypes.INTEGER, allowNull: false },
        outcome: {
          type: DataTypes.STRING(20),
          allowNull: false,
          validate: oneOf('outcome', DECISION_OUTCOMES),
        },
        justification: { type: DataTypes.TEXT, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
        version: versionColumn,
      },
      {
        sequelize,
        modelName: 'Decision',
        tableName: 'decisions',
        version: true,
        validate: {
          acceptNeedsJustification(this: Decision) {
            if (this.outcome === 'accept' && !this.justification?.trim()) {
              throw new Error('justification is required to accept a finding.');
            }
          },
        },
      },
    );
  }
}
