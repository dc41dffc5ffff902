import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from 'sequelize';
import {
  CIRCUIT_CLASSES,
  CURRENT_KINDS,
  HAZARD_KINDS,
  type CircuitClass,
  type CurrentKind,
  type HazardKind,
} from './enums';
import { oneOf, versionColumn } from './validators';
import type { Strip } from './Strip';

function nonNegative(field: string) {
  return {
    isNonNegative(value: number | null) {
      if (value === null || value === undefined) return;
      if (typeof value !== 'number' || !Number.isFinite(value) || value < 0) {
        throw new Error(`${field} must be a number ≥ 0.`);
      }
    },
  };
}

/**
 * One terminal (one level of one block) on a strip. Stacked levels of a multi-level block
 * share `position` and `blockId` and differ in `level`; (stripId, position, level) is unique.
 */
export class Terminal extends Model<InferAttributes<Terminal>, InferCreationAttributes<Terminal>> {
  declare id: CreationOptional<number>;
  declare stripId: number;
  /** 1-based position along the strip; barriers and end plates occupy a position too. */
  declare position: number;
  /** 1 = bottom level of a multi-level block. */
  declare level: CreationOptional<number>;
  declare blockId: string | null;
  /** Printed marker, e.g. 'X3:14'. */
  declare label: string;
  /** The number on the terminal itself, e.g. '14' (look-alikes share it across strips). */
  declare terminalNumber: string | null;
  declare wireNumber: string | null;
  declare cableId: string | null;
  declare cableCore: string | null;
  declare connector: string | null;
  declare wireColour: string | null;
  declare circuitClass: CircuitClass;
  declare hazardKind: HazardKind | null;
  /** Nominal voltage of the conductor (V, RMS for AC). */
  declare nominalVoltage: number | null;
  declare currentKind: CurrentKind | null;
  declare frequency: number | null;
  /** Source impedance of the hazard (Ω); null = the engine's default for its kind. */
  declare sourceImpedance: number | null;
  /** Jumper or comb id: terminals with the same group are (or can be) bridged. */
  declare bridgeGroup: string | null;
  declare channelId: number | null;
  declare notes: string | null;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare strip?: NonAttribute<Strip>;

  static initModel(sequelize: Sequelize): typeof Terminal {
    return Terminal.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        stripId: { type: DataTypes.INTEGER, allowNull: false },
        position: {
          type: DataTypes.INTEGER,
          allowNull: false,
          validate: {
            isInt: { msg: 'position must be a whole number.' },
            min: { args: [1], msg: 'position must be 1 or more.' },
          },
        },
        level: {
          type: DataTypes.INTEGER,
          allowNull: false,
          defaultValue: 1,
          validate: {
            isInt: { msg: 'level must be a whole number.' },
            min: { args: [1], msg: 'level must be 1 or more.' },
            max: { args: [6], msg: 'level must be at most 6.' },
          },
        },
        blockId: { type: DataTypes.STRING(40), allowNull: true },
        label: {
          type: DataTypes.STRING(40),
          allowNull: false,
          validate: { notEmpty: { msg: 'label must not be empty.' } },
        },
        terminalNumber: { type: DataTypes.STRING(20), allowNull: true },
        wireNumber: { type: DataTypes.STRING(40), allowNull: true },
        cableId: { type: DataTypes.STRING(40), allowNull: true },
        cableCore: { type: DataTypes.STRING(20), allowNull: true },
        connector: { type: DataTypes.STRING(40), allowNull: true },
        wireColour: { type: DataTypes.STRING(30), allowNull: true },
        circuitClass: {
          type: DataTypes.STRING(20),
          allowNull: false,
          validate: oneOf('circuitClass', CIRCUIT_CLASSES),
        },
        hazardKind: {
          type: DataTypes.STRING(20),
          allowNull: true,
          validate: oneOf('hazardKind', HAZARD_KINDS),
        },
        nominalVoltage: {
          type: DataTypes.DOUBLE,
          allowNull: true,
          validate: nonNegative('nominalVoltage'),
        },
        currentKind: {
          type: DataTypes.STRING(2),
          allowNull: true,
          validate: oneOf('currentKind', CURRENT_KINDS),
        },
        frequency: { type: DataTypes.DOUBLE, allowNull: true, validate: nonNegative('frequency') },
        sourceImpedance: {
          type: DataTypes.DOUBLE,
          allowNull: true,
          validate: nonNegative('sourceImpedance'),
        },
        bridgeGroup: { type: DataTypes.STRING(40), allowNull: true },
        channelId: { type: DataTypes.INTEGER, allowNull: true },
        notes: { type: DataTypes.TEXT, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
        version: versionColumn,
      },
      {
        sequelize,
        modelName: 'Terminal',
        tableName: 'terminals',
        version: true,
        indexes: [{ unique: true, fields: ['stripId', 'position', 'level'] }],
        validate: {
          hazardFacts(this: Terminal) {
            if (this.circuitClass === 'hazard') {
              if (!this.hazardKind) throw new Error('hazardKind is required on a hazard terminal.');
              if (this.nominalVoltage === null || this.nominalVoltage === undefined) {
                throw new Error('nominalVoltage is required on a hazard terminal.');
              }
              if (!this.currentKind)
                throw new Error('currentKind is required on a hazard terminal.');
            } else if (this.hazardKind) {
              throw new Error(
                `hazardKind is only for hazard terminals (this one is ${this.circuitClass}).`,
              );
            }
            if (this.currentKind === 'ac' && this.circuitClass === 'hazard' && !this.frequency) {
              throw new Error('frequency is required on an AC hazard terminal.');
            }
          },
        },
      },
    );
  }
}
