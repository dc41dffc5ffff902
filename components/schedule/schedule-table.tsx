'use client';

import {
  flexRender,
  getCoreRowModel,
  getFilteredRowModel,
  getSortedRowModel,
  useReactTable,
  type ColumnDef,
  type FilterFn,
  type SortingState,
  type VisibilityState,
} from '@tanstack/react-table';
import { useVirtualizer } from '@tanstack/react-virtual';
import { usePathname, useSearchParams } from 'next/navigation';
import {
  memo,
  useCallback,
  useEffect,
  useLayoutEffect,
  useMemo,
  useRef,
  useState,
  type KeyboardEvent,
} from 'react';
import { Button } from '@/components/ui/button';
import { CIRCUIT_CLASSES } from '@/models/enums';
import { cn } from '@/lib/utils';
import { ClassMark } from '@/components/strip/class-glyph';
import type { TerminalUpdate } from './api';
import {
  COLUMN_BY_ID,
  DEFAULT_HIDDEN,
  SCHEDULE_COLUMNS,
  parseClipboardGrid,
  type LookupContext,
  type ScheduleColumn,
} from './columns';
import { ConflictDialog } from './conflict-dialog';
import type { ChannelRow, Strip, TerminalRow } from './types';
import { useTerminalWrites, type ConflictItem } from './use-terminal-writes';
import { validateTerminalChanges } from './validate';

const NATURAL = new Intl.Collator('en', { numeric: true, sensitivity: 'base' });
const ROW_HEIGHT = 34;
const ERROR_LINE = 22;
const ROW_NUMBER_WIDTH = 48;

type RowErrors = Record<number, Record<string, string>>;
interface ActiveCell {
  row: number;
  col: number;
}

const matchesText: FilterFn<TerminalRow> = (row, _columnId, value: string) => {
  const needle = value.trim().toLowerCase();
  if (!needle) return true;
  return SCHEDULE_COLUMNS.some((c) => c.text(row.original).toLowerCase().includes(needle));
};

/**
 * The cabinet's terminal schedule: sort, filter and column choice live in the URL; cells are
 * edited in place with the keyboard, or many at once by pasting a block from a spreadsheet.
 * Every write is all-or-nothing; refused values stay on screen beside the reason.
 */
export function ScheduleTable({
  projectId,
  cabinetId,
  terminals,
  strips,
  channels,
  canWrite,
  selectedTerminalId,
  onSelectTerminal,
}: {
  projectId: number;
  cabinetId: number;
  terminals: TerminalRow[];
  strips: Strip[];
  channels: ChannelRow[];
  canWrite: boolean;
  selectedTerminalId?: number | null;
  onSelectTerminal?: (id: number) => void;
}) {
  const pathname = usePathname();
  const search = useSearchParams();

  // ---- view state (?q=&class=&strip=&sort=&dir=&hide=): read from the URL once, held here
  // so controls answer at once, and written back to the URL so the view can be shared.
  const [view, setView] = useState(
    () => Object.fromEntries(search.entries()) as Record<string, string>,
  );
  const q = view.q ?? '';
  const classFilter = view.class ?? '';
  const stripFilter = view.strip ?? '';
  const sortId = view.sort ?? null;
  const sortDir = view.dir === 'desc' ? 'desc' : 'asc';
  const hideParam = view.hide;
  const hidden = useMemo(
    () => (hideParam !== undefined ? hideParam.split(',').filter(Boolean) : DEFAULT_HIDDEN),
    [hideParam],
  );
  const setParams = useCallback((patch: Record<string, string | null>) => {
    setView((current) => {
      const next = { ...current };
      for (const [k, v] of Object.entries(patch)) {
        if (v === null || v === '') delete next[k];
        else next[k] = v;
      }
      return next;
    });
  }, []);
  // The History API keeps the URL shareable without a server round trip: the page's data
  // does not depend on the view.
  useEffect(() => {
    const qs = new URLSearchParams(view).toString();
    if (qs !== window.location.search.replace(/^\?/, '')) {
      window.history.replaceState(null, '', qs ? `${pathname}?${qs}` : pathname);
    }
  }, [view, pathname]);
  // Typing in the search box filters at once; the URL follows a moment later.
  const [qDraft, setQDraft] = useState(q);
  useEffect(() => {
    if (qDraft === q) return;
    const t = setTimeout(() => setParams({ q: qDraft }), 250);
    return () => clearTimeout(t);
  }, [qDraft, q, setParams]);

  // Stable identities: react-table recomputes its row models (and would reset its own state)
  // whenever these change, so a fresh array each render would loop.
  const sorting: SortingState = useMemo(
    () => (sortId ? [{ id: sortId, desc: sortDir === 'desc' }] : []),
    [sortId, sortDir],
  );
  const visibility: VisibilityState = useMemo(
    () => Object.fromEntries(SCHEDULE_COLUMNS.map((c) => [c.id, !hidden.includes(c.id)])),
    [hidden],
  );
  const columnFilters = useMemo(
    () => [
      ...(classFilter ? [{ id: 'circuit_class', value: classFilter }] : []),
      ...(stripFilter ? [{ id: 'strip', value: stripFilter }] : []),
    ],
    [classFilter, stripFilter],
  );

  const lookup: LookupContext = useMemo(
    () => ({
      stripsByTag: new Map(strips.map((s) => [s.tag, s.id])),
      channelsByTag: new Map(channels.map((c) => [c.tag, c.id])),
    }),
    [strips, channels],
  );
  const labels = useMemo(
    () => ({
      stripTag: (id: number) => strips.find((s) => s.id === id)?.tag,
      channelTag: (id: number | null) =>
        id === null ? null : (channels.find((c) => c.id === id)?.tag ?? null),
    }),
    [strips, channels],
  );
  const { save, adopt } = useTerminalWrites(projectId, cabinetId, labels);

  // Natural order of a schedule: strip order, then position, then level.
  const stripOrder = useMemo(() => new Map(strips.map((s) => [s.id, s.order])), [strips]);
  const ordered = useMemo(
    () =>
      [...terminals].sort(
        (a, b) =>
          (stripOrder.get(a.stripId) ?? 0) - (stripOrder.get(b.stripId) ?? 0) ||
          a.stripTag.localeCompare(b.stripTag) ||
          a.position - b.position ||
          a.level - b.level,
      ),
    [terminals, stripOrder],
  );

  const columns = useMemo<ColumnDef<TerminalRow>[]>(
    () =>
      SCHEDULE_COLUMNS.map((c) => ({
        id: c.id,
        header: c.id,
        accessorFn: (row) => c.sortValue(row),
        // Natural order, as a schedule reads: X3:2 before X3:10, blanks first.
        sortingFn: (a, b, id) => {
          const x = a.getValue<string | number>(id);
          const y = b.getValue<string | number>(id);
          return typeof x === 'number' && typeof y === 'number'
            ? x - y
            : NATURAL.compare(String(x), String(y));
        },
        size: c.width,
        filterFn:
          c.id === 'circuit_class'
            ? (row, _id, value: string) => row.original.circuitClass === value
            : c.id === 'strip'
              ? (row, _id, value: string) => String(row.original.stripId) === value
              : undefined,
      })),
    [],
  );

  const table = useReactTable({
    data: ordered,
    columns,
    state: {
      sorting,
      columnVisibility: visibility,
      globalFilter: qDraft,
      columnFilters,
    },
    // No paging here (the rows are virtualised): nothing for the table to reset on its own.
    autoResetAll: false,
    globalFilterFn: matchesText,
    getRowId: (row) => String(row.id),
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getFilteredRowModel: getFilteredRowModel(),
    onSortingChange: (updater) => {
      const next = typeof updater === 'function' ? updater(sorting) : updater;
      setParams({
        sort: next[0]?.id ?? null,
        dir: next[0] ? (next[0].desc ? 'desc' : 'asc') : null,
      });
    },
  });

  const rows = table.getRowModel().rows;
  // Same order and choice as the table's visible leaf columns, with a stable identity for the memoised rows.
  const visibleColumns: ScheduleColumn[] = useMemo(
    () => SCHEDULE_COLUMNS.filter((c) => !hidden.includes(c.id)),
    [hidden],
  );

  // ---- selection, editing, errors
  const [active, setActive] = useState<ActiveCell | null>(null);
  const [editing, setEditingState] = useState<string | null>(null);
  // Mirrors `editing` so Enter/Tab and the blur that follows commit once, not twice.
  const editingRef = useRef<string | null>(null);
  const setEditing = (value: string | null) => {
    editingRef.current = value;
    setEditingState(value);
  };
  const [rowErrors, setRowErrors] = useState<RowErrors>({});
  /** Values the user typed that were refused; shown in the cell until fixed or dropped. */
  const [pending, setPending] = useState<Record<number, Record<string, string>>>({});
  const [notice, setNotice] = useState<{ tone: 'error' | 'info'; text: string } | null>(null);
  const [conflict, setConflict] = useState<{
    message: string;
    items: ConflictItem[];
    updates: TerminalUpdate[];
  } | null>(null);
  const [saving, setSaving] = useState(false);

  const scrollRef = useRef<HTMLDivElement>(null);
  const gridRef = useRef<HTMLDivElement>(null);
  const virtualizer = useVirtualizer({
    count: rows.length,
    getScrollElement: () => scrollRef.current,
    estimateSize: (index) => {
      const id = rows[index]?.original.id;
      return ROW_HEIGHT + (id !== undefined && rowErrors[id] ? ERROR_LINE : 0);
    },
    overscan: 8,
  });
  useEffect(() => virtualizer.measure(), [rowErrors, virtualizer]);

  // The selected terminal from the strip drawing: bring its row into view.
  useEffect(() => {
    if (selectedTerminalId == null) return;
    const index = rows.findIndex((r) => r.original.id === selectedTerminalId);
    if (index >= 0) {
      setActive((a) => ({ row: index, col: a?.col ?? 0 }));
      virtualizer.scrollToIndex(index, { align: 'center' });
    }
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [selectedTerminalId]);

  const clampActive = (cell: ActiveCell): ActiveCell => ({
    row: Math.max(0, Math.min(rows.length - 1, cell.row)),
    col: Math.max(0, Math.min(visibleColumns.length - 1, cell.col)),
  });
  const move = (dr: number, dc: number) => {
    setActive((a) => {
      const next = clampActive(a ? { row: a.row + dr, col: a.col + dc } : { row: 0, col: 0 });
      virtualizer.scrollToIndex(next.row);
      return next;
    });
  };

  const applyOutcome = async (
    updates: TerminalUpdate[],
    typed: Record<number, Record<string, string>>,
  ) => {
    setSaving(true);
    const outcome = await save(updates);
    setSaving(false);
    if (outcome.ok) {
      setPending((p) => dropKeys(p, typed));
      setRowErrors((e) => dropKeys(e, typed));
      setNotice(
        updates.length > 1
          ? { tone: 'info', text: `${updates.length} terminals saved together.` }
          : null,
      );
      return;
    }
    setPending((p) => mergeNested(p, typed));
    if (outcome.kind === 'conflict') {
      setConflict({ message: outcome.message, items: outcome.conflicts, updates: outcome.updates });
    } else if (outcome.kind === 'invalid') {
      const byColumn: RowErrors = {};
      for (const [id, fields] of Object.entries(outcome.fieldErrors)) {
        for (const [field, message] of Object.entries(fields)) {
          const column = SCHEDULE_COLUMNS.find((c) => c.field === field)?.id ?? '_';
          (byColumn[Number(id)] ??= {})[column] = message;
        }
      }
      setRowErrors((e) => ({ ...e, ...byColumn }));
      setNotice({ tone: 'error', text: `Not saved: ${outcome.message}` });
    } else {
      setNotice({ tone: 'error', text: `Not saved: ${outcome.message}` });
    }
  };

  /** Parse typed/pasted text for a set of cells; all must read before anything is sent. */
  const buildUpdates = (cells: { row: TerminalRow; column: ScheduleColumn; text: string }[]) => {
    const changesById = new Map<number, { row: TerminalRow; changes: TerminalUpdate['changes'] }>();
    const errors: RowErrors = {};
    const typed: Record<number, Record<string, string>> = {};
    for (const { row, column, text } of cells) {
      (typed[row.id] ??= {})[column.id] = text;
      const parsed = column.parse(text, lookup);
      if (!parsed.ok) {
        (errors[row.id] ??= {})[column.id] = parsed.message;
        continue;
      }
      const entry = changesById.get(row.id) ?? { row, changes: {} };
      Object.assign(entry.changes, parsed.changes);
      changesById.set(row.id, entry);
    }
    for (const { row, changes } of changesById.values()) {
      for (const [field, message] of Object.entries(validateTerminalChanges(row, changes))) {
        const column = SCHEDULE_COLUMNS.find((c) => c.field === field)?.id ?? '_';
        (errors[row.id] ??= {})[column] = message;
      }
    }
    const updates: TerminalUpdate[] = [...changesById.values()]
      .filter(({ row, changes }) =>
        Object.entries(changes).some(([k, v]) => row[k as keyof TerminalRow] !== v),
      )
      .map(({ row, changes }) => ({ id: row.id, version: row.version, changes }));
    return { updates, errors, typed };
  };

  const commitCells = async (
    cells: { row: TerminalRow; column: ScheduleColumn; text: string }[],
  ) => {
    const { updates, errors, typed } = buildUpdates(cells);
    if (Object.keys(errors).length > 0) {
      setPending((p) => mergeNested(p, typed));
      setRowErrors((e) => ({ ...dropKeys(e, typed), ...errors }));
      const n = Object.values(errors).reduce((sum, e) => sum + Object.keys(e).length, 0);
      setNotice({
        tone: 'error',
        text: `${n} ${n === 1 ? 'cell needs' : 'cells need'} attention; nothing was saved. Fix the marked cells or press Escape on them to drop your value.`,
      });
      return;
    }
    if (updates.length === 0) {
      setPending((p) => dropKeys(p, typed));
      setRowErrors((e) => dropKeys(e, typed));
      return;
    }
    await applyOutcome(updates, typed);
  };

  const activeRow = active ? rows[active.row]?.original : undefined;
  const activeColumn = active ? visibleColumns[active.col] : undefined;
  const cellText = (row: TerminalRow, column: ScheduleColumn) =>
    pending[row.id]?.[column.id] ?? column.text(row);

  const startEdit = (initial?: string) => {
    if (!canWrite) {
      setNotice({ tone: 'info', text: 'Your role sees this schedule read-only.' });
      return;
    }
    if (!activeRow || !activeColumn) return;
    setEditing(initial ?? cellText(activeRow, activeColumn));
  };

  const finishEdit = async (then: () => void) => {
    const text = editingRef.current;
    if (text === null || !activeRow || !activeColumn) return;
    setEditing(null);
    then();
    gridRef.current?.focus();
    if (text === cellText(activeRow, activeColumn) && !pending[activeRow.id]?.[activeColumn.id])
      return;
    await commitCells([{ row: activeRow, column: activeColumn, text }]);
  };

  const cancelEdit = () => {
    setEditing(null);
    gridRef.current?.focus();
  };

  const dropPendingCell = () => {
    if (!activeRow || !activeColumn) return;
    const only = { [activeRow.id]: { [activeColumn.id]: '' } };
    setPending((p) => dropKeys(p, only));
    setRowErrors((e) => dropKeys(e, only));
  };

  const onGridKeyDown = (e: KeyboardEvent<HTMLDivElement>) => {
    if (editing !== null) return;
    switch (e.key) {
      case 'ArrowDown':
        e.preventDefault();
        return move(1, 0);
      case 'ArrowUp':
        e.preventDefault();
        return move(-1, 0);
      case 'ArrowRight':
        e.preventDefault();
        return move(0, 1);
      case 'ArrowLeft':
        e.preventDefault();
        return move(0, -1);
      case 'Tab':
        if (!active) return;
        e.preventDefault();
        return move(0, e.shiftKey ? -1 : 1);
      case 'Enter':
      case 'F2':
        e.preventDefault();
        if (!active) return move(0, 0);
        return startEdit();
      case 'Escape':
        return dropPendingCell();
      case 'Delete':
      case 'Backspace':
        if (!canWrite || !activeRow || !activeColumn) return;
        e.preventDefault();
        void commitCells([{ row: activeRow, column: activeColumn, text: '' }]);
        return;
      default:
        if (e.key.length === 1 && !e.ctrlKey && !e.metaKey && !e.altKey && active) {
          e.preventDefault();
          startEdit(e.key);
        }
    }
  };

  const onPaste = (e: React.ClipboardEvent<HTMLDivElement>) => {
    if (editing !== null) return;
    e.preventDefault();
    if (!canWrite) {
      setNotice({
        tone: 'info',
        text: 'Your role sees this schedule read-only; nothing was pasted.',
      });
      return;
    }
    if (!active) {
      setNotice({
        tone: 'info',
        text: 'Select the cell where the pasted block should start, then paste.',
      });
      return;
    }
    const grid = parseClipboardGrid(e.clipboardData.getData('text/plain'));
    if (grid.length === 0) return;
    const width = Math.max(...grid.map((r) => r.length));
    if (active.row + grid.length > rows.length || active.col + width > visibleColumns.length) {
      setNotice({
        tone: 'error',
        text: `The pasted block is ${grid.length} × ${width} but only ${rows.length - active.row} rows and ${visibleColumns.length - active.col} columns lie from the selected cell; nothing was changed.`,
      });
      return;
    }
    const cells = grid.flatMap((line, i) =>
      line.map((text, j) => ({
        row: rows[active.row + i].original,
        column: visibleColumns[active.col + j],
        text,
      })),
    );
    void commitCells(cells);
  };

  // ---- conflict resolution
  const reloadTheirs = () => {
    if (!conflict) return;
    adopt(conflict.items.map((c) => c.current));
    const ids = Object.fromEntries(conflict.updates.map((u) => [u.id, { all: '' }]));
    setPending((p) => omitIds(p, ids));
    setRowErrors((p) => omitIds(p, ids));
    setConflict(null);
    setNotice({ tone: 'info', text: 'Showing the saved values; your edits were set aside.' });
  };
  const keepMine = async () => {
    if (!conflict) return;
    const current = new Map(conflict.items.map((c) => [c.id, c.current]));
    const again = conflict.updates.map((u) => ({
      ...u,
      version: current.get(u.id)?.version ?? u.version,
    }));
    adopt(conflict.items.map((c) => c.current));
    setConflict(null);
    const typed = Object.fromEntries(
      Object.entries(pending).filter(([id]) => current.has(Number(id))),
    );
    await applyOutcome(again, typed);
  };

  // Rows are memoised; they get one stable object whose methods call the latest handlers.
  const latest = useRef({ finishEdit, move, cancelEdit, setEditing, onSelectTerminal, canWrite });
  useLayoutEffect(() => {
    latest.current = { finishEdit, move, cancelEdit, setEditing, onSelectTerminal, canWrite };
  });
  const rowActions = useMemo<RowActions>(
    () => ({
      select: (row, col) => setActive({ row, col }),
      editAt: (row, col, text) => {
        setActive({ row, col });
        if (latest.current.canWrite) latest.current.setEditing(text);
      },
      open: (id) => latest.current.onSelectTerminal?.(id),
      change: (value) => latest.current.setEditing(value),
      commit: (dr, dc) => void latest.current.finishEdit(() => latest.current.move(dr, dc)),
      cancel: () => latest.current.cancelEdit(),
    }),
    [],
  );

  const virtualItems = virtualizer.getVirtualItems();
  const paddingTop = virtualItems[0]?.start ?? 0;
  const paddingBottom = virtualizer.getTotalSize() - (virtualItems.at(-1)?.end ?? 0);
  const totalWidth = ROW_NUMBER_WIDTH + visibleColumns.reduce((s, c) => s + c.width, 0);
  const activeCellId =
    active && activeColumn && activeRow ? `cell-${activeRow.id}-${activeColumn.id}` : undefined;

  return (
    <div className="space-y-2">
      <div
        className="flex flex-wrap items-end gap-2"
        role="search"
        aria-label="Filter the schedule"
      >
        <label className="flex flex-col text-xs text-muted">
          Find
          <input
            type="search"
            value={qDraft}
            onChange={(e) => setQDraft(e.target.value)}
            placeholder="label, wire, cable…"
            className="h-9 w-52 rounded-sm border border-line bg-panel px-2 text-sm text-ink"
          />
        </label>
        <label className="flex flex-col text-xs text-muted">
          Circuit class
          <select
            value={classFilter}
            onChange={(e) => setParams({ class: e.target.value })}
            className="h-9 rounded-sm border border-line bg-panel px-2 text-sm text-ink"
          >
            <option value="">all</option>
            {CIRCUIT_CLASSES.map((c) => (
              <option key={c} value={c}>
                {c}
              </option>
            ))}
          </select>
        </label>
        <label className="flex flex-col text-xs text-muted">
          Strip
          <select
            value={stripFilter}
            onChange={(e) => setParams({ strip: e.target.value })}
            className="h-9 rounded-sm border border-line bg-panel px-2 text-sm text-ink"
          >
            <option value="">all</option>
            {strips.map((s) => (
              <option key={s.id} value={String(s.id)}>
                {s.tag}
              </option>
            ))}
          </select>
        </label>
        <details className="relative">
          <summary className="flex h-9 cursor-pointer list-none items-center rounded-sm border border-line bg-panel px-3 text-sm">
            Columns ({visibleColumns.length}/{SCHEDULE_COLUMNS.length})
          </summary>
          <fieldset className="absolute z-20 mt-1 grid w-64 grid-cols-2 gap-1 rounded-sm border border-line bg-panel p-2 text-sm shadow-md">
            <legend className="sr-only">Visible columns</legend>
            {SCHEDULE_COLUMNS.map((c) => (
              <label key={c.id} className="flex items-center gap-1 font-mono text-xs">
                <input
                  type="checkbox"
                  checked={!hidden.includes(c.id)}
                  onChange={(e) => {
                    const next = e.target.checked
                      ? hidden.filter((h) => h !== c.id)
                      : [...hidden, c.id];
                    setParams({ hide: next.join(',') || ',' });
                  }}
                />
                {c.id}
              </label>
            ))}
          </fieldset>
        </details>
        {(q || classFilter || stripFilter || sortId) && (
          <Button
            variant="ghost"
            size="sm"
            onClick={() => {
              setQDraft('');
              setParams({ q: null, class: null, strip: null, sort: null, dir: null });
            }}
          >
            Clear filters
          </Button>
        )}
        <p className="ml-auto text-xs text-muted" aria-live="polite">
          {rows.length} of {terminals.length} terminals
          {saving ? ' · saving…' : ''}
          {canWrite ? '' : ' · read-only for your role'}
        </p>
      </div>

      {notice ? (
        <p
          role={notice.tone === 'error' ? 'alert' : 'status'}
          className={cn(
            'flex items-start justify-between gap-2 rounded-sm border p-2 text-sm',
            notice.tone === 'error'
              ? 'border-danger bg-danger-soft text-danger'
              : 'border-line bg-paper text-ink',
          )}
        >
          <span>{notice.text}</span>
          <button
            type="button"
            className="text-muted"
            aria-label="Dismiss"
            onClick={() => setNotice(null)}
          >
            ✕
          </button>
        </p>
      ) : null}

      <div
        ref={scrollRef}
        className="h-[min(70vh,640px)] overflow-auto rounded-sm border border-line bg-panel"
        data-testid="schedule-scroll"
      >
        <div
          ref={gridRef}
          role="grid"
          aria-label="Terminal schedule"
          aria-rowcount={rows.length + 1}
          aria-colcount={visibleColumns.length}
          aria-readonly={!canWrite}
          aria-activedescendant={editing === null ? activeCellId : undefined}
          tabIndex={0}
          onKeyDown={onGridKeyDown}
          onPaste={onPaste}
          onFocus={() => {
            if (rows.length > 0) setActive((a) => a ?? { row: 0, col: 0 });
          }}
          className="outline-none"
          style={{ width: totalWidth }}
        >
          <table className="w-full table-fixed border-collapse text-sm" role="presentation">
            <colgroup>
              <col style={{ width: ROW_NUMBER_WIDTH }} />
              {visibleColumns.map((c) => (
                <col key={c.id} style={{ width: c.width }} />
              ))}
            </colgroup>
            <thead className="sticky top-0 z-10 bg-paper">
              <tr role="row">
                <th
                  className="border-b border-line px-1 text-right text-xs font-normal text-muted"
                  aria-label="Row"
                >
                  #
                </th>
                {table.getHeaderGroups()[0].headers.map((header) => {
                  const col = COLUMN_BY_ID.get(header.column.id as ScheduleColumn['id'])!;
                  const sorted = header.column.getIsSorted();
                  return (
                    <th
                      key={header.id}
                      role="columnheader"
                      aria-sort={
                        sorted === 'asc' ? 'ascending' : sorted === 'desc' ? 'descending' : 'none'
                      }
                      title={col.hint}
                      className="border-b border-line p-0 text-left font-mono text-xs font-medium"
                    >
                      <button
                        type="button"
                        tabIndex={-1}
                        onClick={header.column.getToggleSortingHandler()}
                        className={cn(
                          'flex h-8 w-full items-center gap-1 px-2 hover:bg-accent-soft',
                          col.align === 'right' && 'justify-end',
                        )}
                      >
                        {flexRender(header.column.columnDef.header, header.getContext())}
                        <span aria-hidden className="text-accent">
                          {sorted === 'asc' ? '▲' : sorted === 'desc' ? '▼' : ''}
                        </span>
                      </button>
                    </th>
                  );
                })}
              </tr>
            </thead>
            <tbody>
              {paddingTop > 0 ? (
                <tr aria-hidden>
                  <td style={{ height: paddingTop }} colSpan={visibleColumns.length + 1} />
                </tr>
              ) : null}
              {virtualItems.map((v) => {
                const row = rows[v.index].original;
                const isActiveRow = active?.row === v.index;
                return (
                  <ScheduleRow
                    key={row.id}
                    row={row}
                    index={v.index}
                    columns={visibleColumns}
                    activeCol={isActiveRow ? (active?.col ?? null) : null}
                    editing={isActiveRow ? editing : null}
                    errors={rowErrors[row.id]}
                    pending={pending[row.id]}
                    selected={selectedTerminalId === row.id}
                    canOpen={!!onSelectTerminal}
                    actions={rowActions}
                  />
                );
              })}
              {paddingBottom > 0 ? (
                <tr aria-hidden>
                  <td style={{ height: paddingBottom }} colSpan={visibleColumns.length + 1} />
                </tr>
              ) : null}
            </tbody>
          </table>
          {rows.length === 0 ? (
            <p className="p-4 text-sm text-muted">
              {terminals.length === 0
                ? 'No terminals in this cabinet yet.'
                : 'No terminal matches the filters.'}
            </p>
          ) : null}
        </div>
      </div>
      <p className="text-xs text-muted">
        {canWrite
          ? 'Arrows move · Enter or typing edits · Tab/Enter saves and moves · Escape cancels · paste a block copied from a spreadsheet into the selected cell to fill down and right (saved all together, or not at all).'
          : 'Arrows move through the schedule; your role reads it without editing.'}
      </p>

      <ConflictDialog
        open={conflict !== null}
        message={conflict?.message ?? ''}
        items={conflict?.items ?? []}
        onReloadTheirs={reloadTheirs}
        onKeepMine={() => void keepMine()}
      />
    </div>
  );
}

interface RowActions {
  select: (row: number, col: number) => void;
  editAt: (row: number, col: number, text: string) => void;
  open: (terminalId: number) => void;
  change: (value: string) => void;
  commit: (dr: number, dc: number) => void;
  cancel: () => void;
}

/** One schedule row (and its error line); memoised so scrolling renders only the rows that appear. */
const ScheduleRow = memo(function ScheduleRow({
  row,
  index,
  columns,
  activeCol,
  editing,
  errors,
  pending,
  selected,
  canOpen,
  actions,
}: {
  row: TerminalRow;
  index: number;
  columns: ScheduleColumn[];
  activeCol: number | null;
  editing: string | null;
  errors: Record<string, string> | undefined;
  pending: Record<string, string> | undefined;
  selected: boolean;
  canOpen: boolean;
  actions: RowActions;
}) {
  return (
    <>
      <tr
        role="row"
        aria-rowindex={index + 2}
        data-terminal-id={row.id}
        className={cn(
          'border-b border-line',
          activeCol !== null && 'bg-accent-soft/40',
          selected && 'bg-accent-soft',
          errors && 'bg-danger-soft/50',
        )}
        style={{ height: ROW_HEIGHT }}
      >
        <td className="px-1 text-right font-mono text-xs text-muted">
          {canOpen ? (
            <button
              type="button"
              tabIndex={-1}
              className="hover:text-accent"
              title="Show on the strip drawing"
              onClick={() => actions.open(row.id)}
            >
              {index + 1}
            </button>
          ) : (
            index + 1
          )}
        </td>
        {columns.map((column, colIndex) => {
          const isActive = activeCol === colIndex;
          const error = errors?.[column.id];
          const text = pending?.[column.id] ?? column.text(row);
          return (
            <td
              key={column.id}
              id={`cell-${row.id}-${column.id}`}
              role="gridcell"
              aria-selected={isActive}
              aria-invalid={error ? true : undefined}
              aria-describedby={error ? `err-${row.id}` : undefined}
              data-column={column.id}
              onMouseDown={() => actions.select(index, colIndex)}
              onDoubleClick={() => actions.editAt(index, colIndex, text)}
              className={cn(
                'truncate px-2 font-mono text-[13px]',
                column.align === 'right' && 'text-right',
                isActive && 'outline-2 -outline-offset-2 outline-accent',
                error && 'text-danger underline decoration-danger decoration-wavy',
              )}
            >
              {isActive && editing !== null ? (
                <CellEditor
                  column={column}
                  value={editing}
                  onChange={actions.change}
                  onCommit={actions.commit}
                  onCancel={actions.cancel}
                />
              ) : column.id === 'circuit_class' && !error ? (
                <span className="flex items-center gap-1">
                  <ClassMark value={row.circuitClass} />
                  {text}
                </span>
              ) : (
                text
              )}
            </td>
          );
        })}
      </tr>
      {errors ? (
        <tr aria-live="polite" className="bg-danger-soft/50" style={{ height: ERROR_LINE }}>
          <td />
          <td
            id={`err-${row.id}`}
            colSpan={columns.length}
            className="truncate px-2 text-xs text-danger"
            data-testid="row-error"
          >
            Row {index + 1} ({row.label}):{' '}
            {Object.entries(errors)
              .map(([col, message]) => (col === '_' ? message : `${col} — ${message}`))
              .join(' · ')}
          </td>
        </tr>
      ) : null}
    </>
  );
});

function CellEditor({
  column,
  value,
  onChange,
  onCommit,
  onCancel,
}: {
  column: ScheduleColumn;
  value: string;
  onChange: (v: string) => void;
  onCommit: (dr: number, dc: number) => void;
  onCancel: () => void;
}) {
  const ref = useRef<HTMLInputElement>(null);
  useEffect(() => {
    const input = ref.current;
    if (!input) return;
    input.focus();
    input.setSelectionRange(input.value.length, input.value.length);
  }, []);
  const listId = column.options ? `options-${column.id}` : undefined;
  return (
    <>
      <input
        ref={ref}
        aria-label={`Edit ${column.id}`}
        title={column.hint}
        value={value}
        list={listId}
        onChange={(e) => onChange(e.target.value)}
        onKeyDown={(e) => {
          e.stopPropagation();
          if (e.key === 'Enter') {
            e.preventDefault();
            onCommit(e.shiftKey ? -1 : 1, 0);
          } else if (e.key === 'Tab') {
            e.preventDefault();
            onCommit(0, e.shiftKey ? -1 : 1);
          } else if (e.key === 'Escape') {
            e.preventDefault();
            onCancel();
          }
        }}
        onBlur={() => onCommit(0, 0)}
        className="h-7 w-full rounded-[2px] border border-accent bg-panel px-1 font-mono text-[13px] text-ink outline-none"
      />
      {column.options ? (
        <datalist id={listId}>
          {column.options.map((o) => (
            <option key={o} value={o} />
          ))}
        </datalist>
      ) : null}
    </>
  );
}

function dropKeys<T>(
  map: Record<number, Record<string, T>>,
  keysOf: Record<number, Record<string, unknown>>,
) {
  const out: Record<number, Record<string, T>> = {};
  for (const [id, fields] of Object.entries(map)) {
    const drop = keysOf[Number(id)];
    const kept = Object.fromEntries(
      Object.entries(fields).filter(([k]) => !drop || !(k in drop)),
    ) as Record<string, T>;
    // A whole-row message ('_') is about the row as sent: any new attempt replaces it.
    if (drop) delete kept._;
    if (Object.keys(kept).length > 0) out[Number(id)] = kept;
  }
  return out;
}

function omitIds<T>(map: Record<number, T>, ids: Record<number, unknown>) {
  return Object.fromEntries(Object.entries(map).filter(([id]) => !(Number(id) in ids))) as Record<
    number,
    T
  >;
}

function mergeNested(
  a: Record<number, Record<string, string>>,
  b: Record<number, Record<string, string>>,
) {
  const out = { ...a };
  for (const [id, fields] of Object.entries(b))
    out[Number(id)] = { ...(out[Number(id)] ?? {}), ...fields };
  return out;
}
