import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';

export class AppendOnlyError extends Error {
  constructor(operation: string) {
    super(`The audit log is append-only: ${operation} is not allowed.`);
    this.name = 'AppendOnlyError';
  }
}

/**
 * Who did what, when. Append-only: every update and destroy path through the model throws.
 * actorId and projectId carry no foreign-key constraint on purpose, so history outlives the
 * records it mentions.
 */
export class AuditLog extends Model<InferAttributes<AuditLog>, InferCreationAttributes<AuditLog>> {
  declare id: CreationOptional<number>;
  declare actorId: number | null;
  declare projectId: number | null;
  /** Verb, e.g. 'terminal.update', 'audit.sign'. */
  declare action: string;
  declare entity: string;
  declare entityId: number | null;
  declare detail: unknown;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): typeof AuditLog {
    const refuse = (operation: string) => () => {
      throw new AppendOnlyError(operation);
    };
    return AuditLog.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        actorId: { type: DataTypes.INTEGER, allowNull: true },
        projectId: { type: DataTypes.INTEGER, allowNull: true },
        action: {
          type: DataTypes.STRING(60),
          allowNull: false,
          validate: { notEmpty: { msg: 'action must not be empty.' } },
        },
        entity: {
          type: DataTypes.STRING(40),
          allowNull: false,
          validate: { notEmpty: { msg: 'entity must not be empty.' } },
        },
        entityId: { type: DataTypes.INTEGER, allowNull: true },
        detail: { type: DataTypes.JSON, allowNull: true },
        createdAt: DataTypes.DATE,
      },
      {
        sequelize,
        modelName: 'AuditLog',
        tableName: 'audit_logs',
        updatedAt: false,
        hooks: {
          beforeUpdate: refuse('update'),
          beforeBulkUpdate: refuse('update'),
          beforeDestroy: refuse('destroy'),
          beforeBulkDestroy: refuse('destroy'),
          beforeUpsert: refuse('upsert'),
          beforeRestore: refuse('restore'),
          beforeBulkRestore: refuse('restore'),
        },
      },
    );
  }
}
