/**
 * Optimistic concurrency for editable records. Each such model has a `version` column and the
 * Sequelize option `version: true`: a save checks the version it loaded and bumps it. The
 * client sends back the version it edited; a mismatch (or a save that loses a race) becomes a
 * ConflictError carrying the record as it now stands, so the later editor is told, not
 * silently overwritten.
 */
import {
  OptimisticLockError,
  UniqueConstraintError,
  ValidationError as SequelizeValidationError,
  ForeignKeyConstraintError,
  type Attributes,
  type Model,
  type ModelStatic,
  type Transaction,
} from 'sequelize';
import { ConflictError, NotFoundError, ValidationError } from '@/lib/errors';

type Versioned = Model & { id: number; version: number };

const PROTECTED_FIELDS = ['id', 'version', 'createdAt', 'updatedAt'] as const;

/**
 * Turns a Sequelize validation/constraint error into a domain error naming the fields;
 * anything else is returned unchanged.
 */
export function translateDbError(err: unknown): unknown {
  if (err instanceof UniqueConstraintError) {
    const fields = Object.keys(err.fields ?? {});
    const fieldErrors = Object.fromEntries(fields.map((f) => [f, [`${f} is already in use.`]]));
    const message = fields.length ? `Already in use: ${fields.join(', ')}.` : 'A record with these values already exists.';
    return new ValidationError(message, fieldErrors);
  }
  if (err instanceof ForeignKeyConstraintError) {
    const field = typeof err.fields === 'object' && err.fields ? Object.keys(err.fields).join(', ') : '';
    return new ValidationError(
      field ? `${field} refers to a record that does not exist (or is still in use).` : 'A referenced record does not exist or is still in use.',
      field ? { [field]: ['refers to a missing record, or the record is still in use.'] } : {},
    );
  }
  if (err instanceof SequelizeValidationError) {
    const fieldErrors: Record<string, string[]> = {};
    for (const item of err.errors) {
      const key = item.path ?? 'record';
      (fieldErrors[key] ??= []).push(item.message);
    }
    return new ValidationError(err.errors.map((e) => e.message).join(' '), fieldErrors);
  }
  return err;
}

function modelName(model: ModelStatic<Model>): string {
  return model.name;
}

export interface VersionedOptions {
  transaction?: Transaction;
}

/**
 * Applies `changes` to record `id` if it is still at `expectedVersion`; returns the saved
 * record (its version bumped). Throws NotFoundError, ConflictError (with the current record),
 * or ValidationError (which fields, why); on any error nothing is changed.
 */
export async function updateVersioned<M extends Versioned>(
  model: ModelStatic<M>,
  id: number,
  expectedVersion: number,
  changes: Partial<Attributes<M>>,
  options: VersionedOptions = {},
): Promise<M> {
  if (!Number.isInteger(expectedVersion) || expectedVersion < 0) {
    throw new ValidationError('version must be the whole number the record was read at.', {
      version: ['must be a whole number ≥ 0.'],
    });
  }
  const forbidden = PROTECTED_FIELDS.filter((f) => f in changes);
  if (forbidden.length > 0) {
    throw new ValidationError(`These fields cannot be changed directly: ${forbidden.join(', ')}.`, Object.fromEntries(
      forbidden.map((f) => [f, ['cannot be changed directly.']]),
    ));
  }
  const record = await model.findByPk(id, { transaction: options.transaction });
  if (!record) throw new NotFoundError(`${modelName(model)} ${id} not found.`);
  if (record.version !== expectedVersion) throw staleError(model, record, expectedVersion);

  record.set(changes as Parameters<M['set']>[0]);
  try {
    return await record.save({ transaction: options.transaction });
  } catch (err) {
    if (err instanceof OptimisticLockError) {
      // Someone saved between our read and our write.
      const current = await model.findByPk(id, { transaction: options.transaction });
      if (!current) throw new NotFoundError(`${modelName(model)} ${id} not found.`);
      throw staleError(model, current, expectedVersion);
    }
    throw translateDbError(err);
  }
}

/** Deletes record `id` only if it is still at `expectedVersion`. */
export async function destroyVersioned<M extends Versioned>(
  model: ModelStatic<M>,
  id: number,
  expectedVersion: number,
  options: VersionedOptions = {},
): Promise<void> {
  const record = await model.findByPk(id, { transaction: options.transaction });
  if (!record) throw new NotFoundError(`${modelName(model)} ${id} not found.`);
  if (record.version !== expectedVersion) throw staleError(model, record, expectedVersion);
  // The WHERE on version closes the gap between the read above and this delete.
  const where = { id, version: expectedVersion } as unknown as NonNullable<Parameters<ModelStatic<M>['destroy']>[0]>['where'];
  let removed: number;
  try {
    removed = await model.destroy({ where, transaction: options.transaction });
  } catch (err) {
    throw translateDbError(err);
  }
  if (removed === 0) {
    const current = await model.findByPk(id, { transaction: options.transaction });
    if (!current) throw new NotFoundError(`${modelName(model)} ${id} not found.`);
    throw staleError(model, current, expectedVersion);
  }
}

function staleError(model: ModelStatic<Model>, current: Versioned, expectedVersion: number): ConflictError {
  return new ConflictError(
    `${modelName(model)} ${current.id} was changed by someone else (now version ${current.version}, you edited version ${expectedVersion}). Reload it and apply your change again.`,
    current.toJSON(),
  );
}
