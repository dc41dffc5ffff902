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
  FAULT_MODES,
  OVERVOLTAGE_CATEGORIES,
  SURGE_COUPLINGS,
  WIRE_COLOUR_CONVENTIONS,
  type FaultMode,
  type OvervoltageCategory,
  type SurgeCoupling,
  type WireColourConvention,
} from './enums';
import { isPlainObject, oneOf, versionColumn } from './validators';
import type { Cabinet } from './Cabinet';
import type { ProjectMember } from './ProjectMember';

/** Weight per likelihood class of an exposure (e.g. { likely: 1, plausible: 0.5 }); null = engine defaults. */
export type LikelihoodWeights = Record<string, number>;

/**
 * Defaults of the project settings and where each comes from. Shared with forms, so kept
 * as plain numbers here.
 */
export const PROJECT_SETTING_DEFAULTS = {
  mainsSystem: '230/400V 50Hz',
  nominalVoltage: 230,
  frequency: 50,
  /** IEC 60038: supply voltage within ±10 % of nominal at the supply terminals. */
  supplyTolerance: 0.1,
  /** IEC 61131-2: 24 V DC supplies within −15 %/+20 %, so 28.8 V at most. */
  dcSupplyMax: 28.8,
  /** Common practice, no source: 40 °C inside a closed cabinet in a warm plant room. */
  ambientC: 40,
  overvoltageCategory: 'II' as OvervoltageCategory,
  /** IEC 61000-4-5 level 2 (1 kV) for signal ports of industrial equipment is common practice. */
  surgeLevelKv: 1,
  surgeCoupling: 'line-earth' as SurgeCoupling,
  /** IEC 61000-4-2 level 2 contact discharge (4 kV). */
  esdLevelKv: 4,
  /** Common practice: 0.5 of rated power, 0.8 of rated voltage. */
  powerDerating: 0.5,
  voltageDerating: 0.8,
  wireColourConvention: 'iec60204-1' as WireColourConvention,
  faultMode: 'line-earth' as FaultMode,
} as const;

function fraction(field: string) {
  return {
    isFraction(value: number) {
      if (typeof value !== 'number' || !Number.isFinite(value) || value <= 0 || value > 1) {
        throw new Error(`${field} must be a fraction greater than 0 and at most 1.`);
      }
    },
  };
}

function positive(field: string) {
  return {
    isPositive(value: number) {
      if (typeof value !== 'number' || !Number.isFinite(value) || value <= 0) {
        throw new Error(`${field} must be a positive number.`);
      }
    },
  };
}

export class Project extends Model<InferAttributes<Project>, InferCreationAttributes<Project>> {
  declare id: CreationOptional<number>;
  declare name: string;
  /** Short job code, unique, e.g. 'BRN-24-031'. */
  declare code: string;
  declare client: string | null;
  declare site: string | null;
  declare mainsSystem: CreationOptional<string>;
  declare nominalVoltage: CreationOptional<number>;
  declare frequency: CreationOptional<number>;
  declare supplyTolerance: CreationOptional<number>;
  declare dcSupplyMax: CreationOptional<number>;
  declare ambientC: CreationOptional<number>;
  declare overvoltageCategory: CreationOptional<OvervoltageCategory>;
  declare surgeLevelKv: CreationOptional<number>;
  declare surgeCoupling: CreationOptional<SurgeCoupling>;
  declare esdLevelKv: CreationOptional<number>;
  declare powerDerating: CreationOptional<number>;
  declare voltageDerating: CreationOptional<number>;
  declare wireColourConvention: CreationOptional<WireColourConvention>;
  declare faultMode: CreationOptional<FaultMode>;
  declare likelihoodWeights: LikelihoodWeights | null;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare cabinets?: NonAttribute<Cabinet[]>;
  declare members?: NonAttribute<ProjectMember[]>;

  static initModel(sequelize: Sequelize): typeof Project {
    const d = PROJECT_SETTING_DEFAULTS;
    return Project.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        name: {
          type: DataTypes.STRING(200),
          allowNull: false,
          validate: { notEmpty: { msg: 'name must not be empty.' } },
        },
        code: {
          type: DataTypes.STRING(40),
          allowNull: false,
          unique: true,
          validate: {
            is: {
              args: /^[A-Za-z0-9][A-Za-z0-9._-]*$/,
              msg: 'code may hold letters, digits, ".", "_" and "-".',
            },
          },
        },
        client: { type: DataTypes.STRING(200), allowNull: true },
        site: { type: DataTypes.STRING(200), allowNull: true },
        mainsSystem: { type: DataTypes.STRING(40), allowNull: false, defaultValue: d.mainsSystem },
        nominalVoltage: {
          type: DataTypes.DOUBLE,
          allowNull: false,
          defaultValue: d.nominalVoltage,
          validate: positive('nominalVoltage'),
        },
        frequency: {
          type: DataTypes.DOUBLE,
          allowNull: false,
          defaultValue: d.frequency,
          validate: positive('frequency'),
        },
        supplyTolerance: {
          type: DataTypes.DOUBLE,
          allowNull: false,
          defaultValue: d.supplyTolerance,
          validate: fraction('supplyTolerance'),
        },
        dcSupplyMax: {
          type: DataTypes.DOUBLE,
          allowNull: false,
          defaultValue: d.dcSupplyMax,
          validate: positive('dcSupplyMax'),
        },
        ambientC: {
          type: DataTypes.DOUBLE,
          allowNull: false,
          defaultValue: d.ambientC,
          validate: {
            min: { args: [-40], msg: 'ambientC must be at least −40 °C.' },
            max: { args: [125], msg: 'ambientC must be at most 125 °C.' },
          },
        },
        overvoltageCategory: {
          type: DataTypes.STRING(3),
          allowNull: false,
          defaultValue: d.overvoltageCategory,
          validate: oneOf('overvoltageCategory', OVERVOLTAGE_CATEGORIES),
        },
        surgeLevelKv: {
          type: DataTypes.DOUBLE,
          allowNull: false,
          defaultValue: d.surgeLevelKv,
          validate: positive('surgeLevelKv'),
        },
        surgeCoupling: {
          type: DataTypes.STRING(20),
          allowNull: false,
          defaultValue: d.surgeCoupling,
          validate: oneOf('surgeCoupling', SURGE_COUPLINGS),
        },
        esdLevelKv: {
          type: DataTypes.DOUBLE,
          allowNull: false,
          defaultValue: d.esdLevelKv,
          validate: positive('esdLevelKv'),
        },
        powerDerating: {
          type: DataTypes.DOUBLE,
          allowNull: false,
          defaultValue: d.powerDerating,
          validate: fraction('powerDerating'),
        },
        voltageDerating: {
          type: DataTypes.DOUBLE,
          allowNull: false,
          defaultValue: d.voltageDerating,
          validate: fraction('voltageDerating'),
        },
        wireColourConvention: {
          type: DataTypes.STRING(20),
          allowNull: false,
          defaultValue: d.wireColourConvention,
          validate: oneOf('wireColourConvention', WIRE_COLOUR_CONVENTIONS),
        },
        faultMode: {
          type: DataTypes.STRING(20),
          allowNull: false,
          defaultValue: d.faultMode,
          validate: oneOf('faultMode', FAULT_MODES),
        },
        likelihoodWeights: {
          type: DataTypes.JSON,
          allowNull: true,
          validate: {
            isWeights(value: unknown) {
              if (value === null || value === undefined) return;
              if (!isPlainObject(value))
                throw new Error('likelihoodWeights must be an object of numbers.');
              for (const [key, weight] of Object.entries(value)) {
                if (typeof weight !== 'number' || !Number.isFinite(weight) || weight < 0) {
                  throw new Error(`likelihoodWeights.${key} must be a number ≥ 0.`);
                }
              }
            },
          },
        },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
        version: versionColumn,
      },
      { sequelize, modelName: 'Project', tableName: 'projects', version: true },
    );
  }
}
