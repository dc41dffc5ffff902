import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from 'sequelize';
import { AUDIT_RUN_STATUSES, REVIEW_STATES, type AuditRunStatus, type ReviewState } from './enums';
import { oneOf } from './validators';
import type { Finding } from './Finding';

/**
 * A frozen, hashed snapshot of an audit's inputs and results. `snapshot` and `summary` are
 * whatever lib/audit produces; `inputHash` identifies the inputs so identical runs are spotted.
 */
export class AuditRun extends Model<InferAttributes<AuditRun>, InferCreationAttributes<AuditRun>> {
  declare id: CreationOptional<number>;
  declare projectId: number;
  declare createdById: number | null;
  declare status: CreationOptional<AuditRunStatus>;
  /** 0…1 while running. */
  declare progress: CreationOptional<number>;
  declare inputHash: string | null;
  declare snapshot: unknown;
  declare summary: unknown;
  declare error: string | null;
  declare startedAt: Date | null;
  declare finishedAt: Date | null;
  declare reviewState: CreationOptional<ReviewState>;
  declare signedById: number | null;
  declare signedAt: Date | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare findings?: NonAttribute<Finding[]>;

  static initModel(sequelize: Sequelize): typeof AuditRun {
    return AuditRun.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        projectId: { type: DataTypes.INTEGER, allowNull: false },
        createdById: { type: DataTypes.INTEGER, allowNull: true },
        status: {
          type: DataTypes.STRING(20),
          allowNull: false,
          defaultValue: 'queued',
          validate: oneOf('status', AUDIT_RUN_STATUSES),
        },
        progress: {
          type: DataTypes.DOUBLE,
          allowNull: false,
          defaultValue: 0,
          validate: {
            min: { args: [0], msg: 'progress must be between 0 and 1.' },
            max: { args: [1], msg: 'progress must be between 0 and 1.' },
          },
        },
        inputHash: { type: DataTypes.STRING(128), allowNull: true },
        snapshot: { type: DataTypes.JSON, allowNull: true },
        summary: { type: DataTypes.JSON, allowNull: true },
        error: { type: DataTypes.TEXT, allowNull: true },
        startedAt: { type: DataTypes.DATE, allowNull: true },
        finishedAt: { type: DataTypes.DATE, allowNull: true },
        reviewState: {
          type: DataTypes.STRING(20),
          allowNull: false,
          defaultValue: 'draft',
          validate: oneOf('reviewState', REVIEW_STATES),
        },
        signedById: { type: DataTypes.INTEGER, allowNull: true },
        signedAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      {
        sequelize,
        modelName: 'AuditRun',
        tableName: 'audit_runs',
        validate: {
          signedHasSigner(this: AuditRun) {
            if (
              this.reviewState === 'signed' &&
              (this.signedById == null || this.signedAt == null)
            ) {
              throw new Error('a signed audit run needs signedById and signedAt.');
            }
          },
        },
      },
    );
  }
}
