import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';

/** An e-mail the app sent (or tried to), shown on the local outbox page. */
export class OutboxMessage extends Model<
  InferAttributes<OutboxMessage>,
  InferCreationAttributes<OutboxMessage>
> {
  declare id: CreationOptional<number>;
  declare to: string;
  declare subject: string;
  declare text: string;
  declare html: string | null;
  declare sentAt: Date | null;
  /** Message-ID returned by the mail transport. */
  declare messageId: string | null;
  declare error: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): typeof OutboxMessage {
    return OutboxMessage.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        to: {
          type: DataTypes.STRING(254),
          allowNull: false,
          validate: { isEmail: { msg: 'to must be a valid e-mail address.' } },
        },
        subject: { type: DataTypes.STRING(300), allowNull: false },
        text: { type: DataTypes.TEXT, allowNull: false },
        html: { type: DataTypes.TEXT, allowNull: true },
        sentAt: { type: DataTypes.DATE, allowNull: true },
        messageId: { type: DataTypes.STRING(300), allowNull: true },
        error: { type: DataTypes.TEXT, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, modelName: 'OutboxMessage', tableName: 'outbox_messages' },
    );
  }
}
