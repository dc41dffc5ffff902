/**
 * The append-only audit trail: every write to project data leaves one entry (who, what,
 * which record, the change). Written inside the caller's transaction so a rolled-back write
 * leaves no entry behind.
 */
import type { Transaction } from 'sequelize';
import { getDb } from '@/lib/db';

export interface AuditEntry {
  actorId: number | null;
  projectId: number | null;
  /** Verb, '<entity>.<what>', e.g. 'terminal.update', 'schedule.import'. */
  action: string;
  entity: string;
  entityId: number | null;
  detail?: unknown;
}

export async function logAction(entry: AuditEntry, transaction?: Transaction): Promise<void> {
  const { models } = getDb();
  await models.AuditLog.create(
    {
      actorId: entry.actorId,
      projectId: entry.projectId,
      action: entry.action,
      entity: entry.entity,
      entityId: entry.entityId,
      detail: entry.detail ?? null,
    },
    { transaction },
  );
}

/**
 * The fields that `changes` would alter on `before`, as { field: [old, new] } — what an
 * update entry records.
 */
export function diffFields(
  before: Record<string, unknown>,
  changes: Record<string, unknown>,
): Record<string, [unknown, unknown]> {
  const out: Record<string, [unknown, unknown]> = {};
  for (const [key, value] of Object.entries(changes)) {
    if (value === undefined) continue;
    const old = before[key] ?? null;
    if (JSON.stringify(old) !== JSON.stringify(value)) out[key] = [old, value];
  }
  return out;
}
