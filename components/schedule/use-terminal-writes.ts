'use client';

import { useQueryClient } from '@tanstack/react-query';
import { useCallback } from 'react';
import { ApiError, keys, projectApi, type TerminalUpdate } from './api';
import type { TerminalRow } from './types';

type TerminalsPage = { items: TerminalRow[]; total: number };

export interface ConflictItem {
  id: number;
  /** The row as this browser last knew it (what the edit was based on). */
  base: TerminalRow | undefined;
  /** The row as it now stands on the server. */
  current: TerminalRow;
  mine: TerminalUpdate['changes'];
  changedBy: { name: string; at?: string } | null;
}

export type WriteOutcome =
  | { ok: true; rows: TerminalRow[] }
  | {
      ok: false;
      kind: 'conflict';
      message: string;
      conflicts: ConflictItem[];
      updates: TerminalUpdate[];
    }
  | {
      ok: false;
      kind: 'invalid';
      message: string;
      fieldErrors: Record<number, Record<string, string>>;
    }
  | { ok: false; kind: 'other'; message: string };

/**
 * Terminal writes with an optimistic cache: the table shows the edit at once, the server's
 * answer replaces it, and any refusal rolls the cache back to what it was — the caller then
 * shows why, keeping the user's values so nothing typed is lost.
 */
export function useTerminalWrites(
  projectId: number,
  cabinetId: number,
  labels: {
    stripTag: (id: number) => string | undefined;
    channelTag: (id: number | null) => string | null;
  },
) {
  const queryClient = useQueryClient();
  const key = keys.terminals(projectId, cabinetId);

  const save = useCallback(
    async (updates: TerminalUpdate[]): Promise<WriteOutcome> => {
      if (updates.length === 0) return { ok: true, rows: [] };
      const api = projectApi(projectId);
      await queryClient.cancelQueries({ queryKey: key });
      const before = queryClient.getQueryData<TerminalsPage>(key);
      const byId = new Map(updates.map((u) => [u.id, u]));
      if (before) {
        queryClient.setQueryData<TerminalsPage>(key, {
          ...before,
          items: before.items.map((row) => {
            const u = byId.get(row.id);
            if (!u) return row;
            const next = { ...row, ...u.changes };
            if (u.changes.stripId !== undefined)
              next.stripTag = labels.stripTag(u.changes.stripId) ?? row.stripTag;
            if (u.changes.channelId !== undefined)
              next.channelTag = labels.channelTag(u.changes.channelId);
            return next;
          }),
        });
      }
      try {
        const rows =
          updates.length === 1
            ? [await api.updateTerminal(updates[0].id, updates[0].version, updates[0].changes)]
            : (await api.bulkUpdateTerminals(updates)).items;
        const fresh = new Map(rows.map((r) => [r.id, r]));
        queryClient.setQueryData<TerminalsPage>(key, (old) =>
          old ? { ...old, items: old.items.map((r) => fresh.get(r.id) ?? r) } : old,
        );
        void queryClient.invalidateQueries({ queryKey: key });
        void queryClient.invalidateQueries({ queryKey: keys.strips(projectId, cabinetId) });
        void queryClient.invalidateQueries({ queryKey: keys.channels(projectId, cabinetId) });
        return { ok: true, rows };
      } catch (error) {
        if (before) queryClient.setQueryData(key, before);
        const baseById = new Map((before?.items ?? []).map((r) => [r.id, r]));
        if (error instanceof ApiError && error.status === 409) {
          const list =
            error.conflicts.length > 0
              ? error.conflicts
              : error.current
                ? [{ id: updates[0].id, current: error.current, changedBy: error.changedBy }]
                : [];
          const conflicts = list.map((c) => ({
            id: c.id,
            base: baseById.get(c.id),
            current: c.current as TerminalRow,
            mine: byId.get(c.id)?.changes ?? {},
            changedBy: c.changedBy ?? null,
          }));
          return { ok: false, kind: 'conflict', message: error.message, conflicts, updates };
        }
        if (error instanceof ApiError && error.status === 422) {
          return {
            ok: false,
            kind: 'invalid',
            message: error.message,
            fieldErrors: mapFieldErrors(error, updates),
          };
        }
        return {
          ok: false,
          kind: 'other',
          message: error instanceof Error ? error.message : String(error),
        };
      }
    },
    // eslint-disable-next-line react-hooks/exhaustive-deps
    [projectId, cabinetId, queryClient, labels],
  );

  /** Put the server's rows into the cache as they stand (after "reload theirs"). */
  const adopt = useCallback(
    (rows: TerminalRow[]) => {
      const fresh = new Map(rows.map((r) => [r.id, r]));
      queryClient.setQueryData<TerminalsPage>(key, (old) =>
        old ? { ...old, items: old.items.map((r) => fresh.get(r.id) ?? r) } : old,
      );
      void queryClient.invalidateQueries({ queryKey: key });
    },
    // eslint-disable-next-line react-hooks/exhaustive-deps
    [projectId, cabinetId, queryClient],
  );

  return { save, adopt };
}

/**
 * 422 field errors → terminal id → field → message. Bulk keys read
 * "updates.<i>.changes.<field>"; a single update's keys are the field itself.
 */
function mapFieldErrors(
  error: ApiError,
  updates: TerminalUpdate[],
): Record<number, Record<string, string>> {
  const out: Record<number, Record<string, string>> = {};
  for (const [key, messages] of Object.entries(error.fieldErrors)) {
    const bulk = /^updates\.(\d+)\.(?:changes\.)?(.+)$/.exec(key);
    const update = bulk ? updates[Number(bulk[1])] : updates.length === 1 ? updates[0] : undefined;
    const field = bulk ? bulk[2] : key;
    if (!update) continue;
    (out[update.id] ??= {})[field] = messages[0] ?? 'invalid';
  }
  if (Object.keys(out).length === 0 && updates.length === 1)
    out[updates[0].id] = { _: error.message };
  return out;
}
