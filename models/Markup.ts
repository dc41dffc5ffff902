import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from 'sequelize';
import { MARKUP_KINDS, MARKUP_STATUSES, type MarkupKind, type MarkupStatus } from './enums';
import { oneOf, versionColumn } from './validators';
import type { Attachment } from './Attachment';

/** An as-built change recorded on site; the as-built schedule is the design plus accepted markups. */
export class Markup extends Model<InferAttributes<Markup>, InferCreationAttributes<Markup>> {
  declare id: CreationOptional<number>;
  declare projectId: number;
  declare terminalId: number | null;
  declare authorId: number;
  declare kind: MarkupKind;
  /** The fields as they were (design), and as found/built; shapes depend on `kind`. */
  declare before: unknown;
  declare after: unknown;
  declare note: string | null;
  declare status: CreationOptional<MarkupStatus>;
  declare decidedById: number | null;
  declare decidedAt: Date | null;
  /** Idempotency key from the tablet, so a replayed offline submission is stored once. */
  declare clientId: string | null;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare attachments?: NonAttribute<Attachment[]>;

  static initModel(sequelize: Sequelize): typeof Markup {
    return Markup.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        projectId: { type: DataTypes.INTEGER, allowNull: false },
        terminalId: { type: DataTypes.INTEGER, allowNull: true },
        authorId: { type: DataTypes.INTEGER, allowNull: false },
        kind: {
          type: DataTypes.STRING(20),
          allowNull: false,
          validate: oneOf('kind', MARKUP_KINDS),
        },
        before: { type: DataTypes.JSON, allowNull: true },
        after: { type: DataTypes.JSON, allowNull: true },
        note: { type: DataTypes.TEXT, allowNull: true },
        status: {
          type: DataTypes.STRING(20),
          allowNull: false,
          defaultValue: 'proposed',
          validate: oneOf('status', MARKUP_STATUSES),
        },
        decidedById: { type: DataTypes.INTEGER, allowNull: true },
        decidedAt: { type: DataTypes.DATE, allowNull: true },
        clientId: {
          type: DataTypes.STRING(64),
          allowNull: true,
          unique: true,
          validate: { len: { args: [8, 64], msg: 'clientId must be 8 to 64 characters.' } },
        },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
        version: versionColumn,
      },
      {
        sequelize,
        modelName: 'Markup',
        tableName: 'markups',
        version: true,
        validate: {
          decidedHasDecider(this: Markup) {
            if (this.status !== 'proposed' && this.decidedById == null) {
              throw new Error(`a ${this.status} markup needs decidedById.`);
            }
          },
        },
      },
    );
  }
}
