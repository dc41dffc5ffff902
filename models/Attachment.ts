import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import { ATTACHMENT_KINDS, STORAGE_KINDS, type AttachmentKind, type StorageKind } from './enums';
import { oneOf } from './validators';

/** A stored file (photo, imported schedule); kept outside public/ under a generated name. */
export class Attachment extends Model<
  InferAttributes<Attachment>,
  InferCreationAttributes<Attachment>
> {
  declare id: CreationOptional<number>;
  declare projectId: number;
  declare markupId: number | null;
  declare uploadedById: number | null;
  declare kind: AttachmentKind;
  declare originalName: string;
  declare storedName: string;
  declare mimeType: string;
  declare size: number;
  declare storage: CreationOptional<StorageKind>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): typeof Attachment {
    return Attachment.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        projectId: { type: DataTypes.INTEGER, allowNull: false },
        markupId: { type: DataTypes.INTEGER, allowNull: true },
        uploadedById: { type: DataTypes.INTEGER, allowNull: true },
        kind: {
          type: DataTypes.STRING(20),
          allowNull: false,
          validate: oneOf('kind', ATTACHMENT_KINDS),
        },
        originalName: {
          type: DataTypes.STRING(255),
          allowNull: false,
          validate: { notEmpty: { msg: 'originalName must not be empty.' } },
        },
        storedName: {
          type: DataTypes.STRING(255),
          allowNull: false,
          unique: true,
          // Generated names only: no path separators, no leading dot.
          validate: {
            is: {
              args: /^[A-Za-z0-9][A-Za-z0-9._-]*$/,
              msg: 'storedName must be a generated file name.',
            },
          },
        },
        mimeType: { type: DataTypes.STRING(100), allowNull: false },
        size: {
          type: DataTypes.INTEGER,
          allowNull: false,
          validate: { min: { args: [0], msg: 'size must be 0 or more bytes.' } },
        },
        storage: {
          type: DataTypes.STRING(10),
          allowNull: false,
          defaultValue: 'disk',
          validate: oneOf('storage', STORAGE_KINDS),
        },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, modelName: 'Attachment', tableName: 'attachments' },
    );
  }
}
