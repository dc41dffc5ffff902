import { DataTypes, type ModelValidateOptions } from 'sequelize';

/** Model-level check that a string column holds one of a closed list. */
export function oneOf(field: string, values: readonly string[]): ModelValidateOptions {
  return {
    isIn: {
      args: [values as string[]],
      msg: `${field} must be one of: ${values.join(', ')}.`,
    },
  };
}

export function isPlainObject(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

/**
 * Optimistic-locking counter. Declared explicitly (for the typed attributes) and enabled
 * with the model option `version: true`, so every instance save checks and bumps it.
 */
export const versionColumn = {
  type: DataTypes.INTEGER,
  allowNull: false,
  defaultValue: 0,
} as const;
