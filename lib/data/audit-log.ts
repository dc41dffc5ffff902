import type { Transaction } from 'sequelize';
import { getDb } from '@/lib/db';

export interface LogEntry {
  actorId: number | null;
  projectId: number | null;
  /** Dotted verb, e.g. 'terminal.update', 'settings.update', 'audit.run'. */
  action: string;
  entity: string;
  entityId: number | null;
  detail?: unknown;
}

/** Appends one entry to the append-only audit log, inside the caller's transaction when given. */
export async function logAction(entry: LogEntry, transaction?: Transaction): Promise<void> {
  const { models } = getDb();
  await models.AuditLog.create({ ...entry, detail: entry.detail ?? null }, { transaction });
}
