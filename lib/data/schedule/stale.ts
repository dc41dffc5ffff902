/**
 * Who saved the newer version: a stale edit is told "changed by <name> at <time>" (from the
 * audit log), so the later editor knows whom to ask before merging.
 */
import type { Transaction } from 'sequelize';
import { getDb } from '@/lib/db';
import { ConflictError } from '@/lib/errors';

export interface ChangedBy {
  name: string;
  at: string;
}

/** A write based on an old version; `changedBy` names the last writer when the log knows it. */
export class StaleRecordError extends ConflictError {
  constructor(
    message: string,
    current: unknown,
    readonly changedBy: ChangedBy | null,
  ) {
    super(message, current);
  }
}

// Log entries are written in the same transaction as the record, a few ms apart.
const CLOCK_SLACK_MS = 2000;

/**
 * The last logged write of a record, or null. When `updatedAt` is given, an entry older than
 * that is not the write that made the current version (e.g. a schedule import, logged per
 * cabinet), so null is answered rather than the wrong name.
 */
export async function lastChange(
  entity: string,
  entityId: number,
  updatedAt?: Date | string | null,
  transaction?: Transaction,
): Promise<ChangedBy | null> {
  const { models } = getDb();
  const entry = await models.AuditLog.findOne({ where: { entity, entityId }, order: [['id', 'DESC']], transaction });
  if (!entry) return null;
  if (updatedAt && entry.createdAt.getTime() + CLOCK_SLACK_MS < new Date(updatedAt).getTime()) return null;
  const user = entry.actorId === null ? null : await models.User.findByPk(entry.actorId, { attributes: ['name'], transaction });
  return { name: user?.name ?? 'someone else', at: entry.createdAt.toISOString() };
}

/**
 * Runs a versioned write (lib/data/versioned.ts); a stale version becomes StaleRecordError
 * carrying `current` (or the richer row `currentRow` gives) and who changed it.
 */
export async function staleChecked<T>(
  entity: string,
  id: number,
  write: () => Promise<T>,
  transaction?: Transaction,
  currentRow?: () => Promise<unknown>,
): Promise<T> {
  try {
    return await write();
  } catch (err) {
    if (!(err instanceof ConflictError) || err instanceof StaleRecordError) throw err;
    const current = currentRow ? await currentRow() : err.current;
    const updatedAt = (current as { updatedAt?: Date | string } | undefined)?.updatedAt ?? null;
    throw new StaleRecordError(err.message, current, await lastChange(entity, id, updatedAt, transaction));
  }
}
