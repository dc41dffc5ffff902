'use client';

import { Button } from '@/components/ui/button';
import { Modal } from './modal';
import { COLUMN_BY_ID, SCHEDULE_COLUMNS, describeDifferences } from './columns';
import type { TerminalRow } from './types';
import type { ConflictItem } from './use-terminal-writes';

function formatWhen(iso: string | undefined) {
  if (!iso) return 'just now';
  const d = new Date(iso);
  return Number.isNaN(d.getTime()) ? iso : d.toLocaleString();
}

/** Who changed it, when the server says (`changedBy` on the conflict, or `updatedByName` on the record). */
function who(item: ConflictItem) {
  const name =
    item.changedBy?.name ??
    (item.current as TerminalRow & { updatedByName?: string | null }).updatedByName;
  return name ? name : 'someone else';
}

/** My edit, named by our column names, read from the changes I sent. */
function describeMine(item: ConflictItem): string[] {
  const probe = { ...(item.base ?? item.current), ...item.mine } as TerminalRow;
  return Object.keys(item.mine).map((field) => {
    const column = SCHEDULE_COLUMNS.find((c) => c.field === field);
    if (!column) return `${field}: ${String(item.mine[field as keyof typeof item.mine])}`;
    const value =
      column.id === 'strip' || column.id === 'channel'
        ? String(item.mine[field as keyof typeof item.mine] ?? '—')
        : column.text(probe);
    return `${COLUMN_BY_ID.get(column.id)!.id}: “${value || '—'}”`;
  });
}

/**
 * Someone saved the same terminal first. Show what they changed and what I tried, then let me
 * take theirs or put mine on top of theirs. The dialog cannot be dismissed without a choice, so no
 * edit disappears unnoticed.
 */
export function ConflictDialog({
  open,
  message,
  items,
  onReloadTheirs,
  onKeepMine,
}: {
  open: boolean;
  message: string;
  items: ConflictItem[];
  onReloadTheirs: () => void;
  onKeepMine: () => void;
}) {
  return (
    <Modal
      open={open}
      title="Someone else saved this first"
      onClose={() => undefined}
      dismissable={false}
    >
      <div className="space-y-3 text-sm" data-testid="conflict-dialog">
        <p role="alert">
          {message || 'The terminal changed since you opened it.'} Nothing of yours was saved yet,
          and nothing of yours is lost: choose below.
        </p>
        <ul className="space-y-3">
          {items.map((item) => {
            const theirs = item.base ? describeDifferences(item.base, item.current) : [];
            return (
              <li key={item.id} className="rounded-sm border border-line p-3">
                <p className="font-medium">
                  <span className="font-mono">{item.current.label}</span> on strip{' '}
                  <span className="font-mono">{item.current.stripTag}</span> was changed by{' '}
                  {who(item)} at {formatWhen(item.changedBy?.at ?? item.current.updatedAt)} (version{' '}
                  {item.base?.version ?? '?'} → {item.current.version}).
                </p>
                <div className="mt-2 grid gap-2 md:grid-cols-2">
                  <div>
                    <p className="text-xs text-muted uppercase">Their change</p>
                    <ul className="font-mono text-xs">
                      {theirs.length ? (
                        theirs.map((t) => <li key={t}>{t}</li>)
                      ) : (
                        <li>(no visible field changed)</li>
                      )}
                    </ul>
                  </div>
                  <div>
                    <p className="text-xs text-muted uppercase">Your edit</p>
                    <ul className="font-mono text-xs">
                      {describeMine(item).map((t) => (
                        <li key={t}>{t}</li>
                      ))}
                    </ul>
                  </div>
                </div>
              </li>
            );
          })}
        </ul>
        <div className="flex flex-wrap justify-end gap-2 border-t border-line pt-3">
          <Button variant="secondary" onClick={onReloadTheirs}>
            Reload theirs
          </Button>
          <Button onClick={onKeepMine}>Keep mine and save again</Button>
        </div>
        <p className="text-xs text-muted">
          “Keep mine” writes only the fields you edited over their version; their other changes
          stay.
        </p>
      </div>
    </Modal>
  );
}
