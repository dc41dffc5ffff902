import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from 'sequelize';
import type { Verdict } from '@/lib/stress/types';
import {
  EXPOSURE_MECHANISMS,
  FINDING_KINDS,
  VERDICTS,
  type ExposureMechanism,
  type FindingKind,
} from './enums';
import { oneOf } from './validators';
import type { Decision } from './Decision';

/** One channel × one stress case (or one segregation / colour issue) of an audit run. */
export class Finding extends Model<InferAttributes<Finding>, InferCreationAttributes<Finding>> {
  declare id: CreationOptional<number>;
  declare auditRunId: number;
  declare channelId: number | null;
  declare kind: FindingKind;
  /** The audit's case id for stress findings (e.g. 'mains-line:line-earth', a surge or ESD case). */
  declare stressCase: string | null;
  declare mechanism: ExposureMechanism | null;
  declare hazardTerminalId: number | null;
  declare verdict: Verdict;
  declare reason: string;
  declare margin: number | null;
  declare figures: unknown;
  /** Stable identity across runs (e.g. 'stress:TT-2104:ac:X3:13'), for deltas between runs. */
  declare key: string;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare decision?: NonAttribute<Decision | null>;

  static initModel(sequelize: Sequelize): typeof Finding {
    return Finding.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        auditRunId: { type: DataTypes.INTEGER, allowNull: false },
        channelId: { type: DataTypes.INTEGER, allowNull: true },
        kind: {
          type: DataTypes.STRING(20),
          allowNull: false,
          validate: oneOf('kind', FINDING_KINDS),
        },
        stressCase: { type: DataTypes.STRING(60), allowNull: true },
        mechanism: {
          type: DataTypes.STRING(20),
          allowNull: true,
          validate: oneOf('mechanism', EXPOSURE_MECHANISMS),
        },
        hazardTerminalId: { type: DataTypes.INTEGER, allowNull: true },
        verdict: {
          type: DataTypes.STRING(20),
          allowNull: false,
          validate: oneOf('verdict', VERDICTS),
        },
        reason: { type: DataTypes.TEXT, allowNull: false },
        margin: { type: DataTypes.DOUBLE, allowNull: true },
        figures: { type: DataTypes.JSON, allowNull: true },
        key: {
          type: DataTypes.STRING(255),
          allowNull: false,
          validate: { notEmpty: { msg: 'key must not be empty.' } },
        },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      {
        sequelize,
        modelName: 'Finding',
        tableName: 'findings',
        indexes: [{ unique: true, fields: ['auditRunId', 'key'] }],
      },
    );
  }
}
