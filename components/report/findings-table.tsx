'use client';

import {
  createColumnHelper,
  flexRender,
  getCoreRowModel,
  useReactTable,
} from '@tanstack/react-table';
import Link from 'next/link';
import { useRouter } from 'next/navigation';
import { useMemo } from 'react';
import type { Verdict } from '@/lib/stress/types';
import { formatMargin } from '@/lib/report/format';
import { MECHANISM_LABEL } from '@/lib/report/vocabulary';
import { VerdictBadge } from './verdict-badge';

/** One row as the page hands it over (only what the table shows: the full figures stay on the server). */
export interface FindingRow {
  id: number;
  key: string;
  kind: 'stress' | 'segregation' | 'colour';
  verdict: Verdict;
  reason: string;
  margin: number | null;
  channelId: number | null;
  channelTag: string | null;
  cabinetTag: string | null;
  stripId: number | null;
  stripTag: string | null;
  caseLabel: string | null;
  mechanism: string | null;
  hazardLabel: string | null;
  /** Set when the row is new or changed since the previous run. */
  delta: 'new' | 'changed' | null;
}

const column = createColumnHelper<FindingRow>();

function hrefOf(projectId: number, r: FindingRow): string | null {
  if (r.channelId !== null)
    return `/projects/${projectId}/audit/channels/${r.channelId}?case=${encodeURIComponent(r.key)}#case`;
  if (r.stripId !== null) return `/projects/${projectId}/audit/strips/${r.stripId}`;
  return null;
}

/**
 * The findings, in the order the server sorted them. Each row opens its channel page (or its
 * strip, for segregation and colour checks): the first cell is a real link, so Tab reaches it
 * and Enter follows it; a click anywhere on the row does the same.
 */
export function FindingsTable({
  projectId,
  rows,
  marginSortHref,
  marginSortLabel,
}: {
  projectId: number;
  rows: FindingRow[];
  marginSortHref: string;
  marginSortLabel: string;
}) {
  const router = useRouter();
  const columns = useMemo(
    () => [
      column.accessor('verdict', {
        header: 'Verdict',
        cell: (c) => <VerdictBadge verdict={c.getValue()} />,
      }),
      column.accessor('channelTag', {
        header: 'Channel',
        cell: (c) => {
          const r = c.row.original;
          const href = hrefOf(projectId, r);
          const text = r.channelTag ?? (r.kind === 'stress' ? '—' : `strip ${r.stripTag ?? '?'}`);
          return href ? (
            <Link
              href={href}
              className="font-mono font-medium whitespace-nowrap underline-offset-2 hover:underline"
              data-finding-link
            >
              {text}
            </Link>
          ) : (
            <span className="font-mono">{text}</span>
          );
        },
      }),
      column.accessor('caseLabel', {
        header: 'Case',
        cell: (c) => {
          const r = c.row.original;
          return r.kind === 'stress'
            ? (c.getValue() ?? '—')
            : r.kind === 'segregation'
              ? 'Segregation'
              : 'Wire colour';
        },
      }),
      column.accessor('mechanism', {
        header: 'Exposure',
        cell: (c) => {
          const r = c.row.original;
          const m = c.getValue();
          return (
            <span>
              {m ? (MECHANISM_LABEL[m as keyof typeof MECHANISM_LABEL] ?? m) : '—'}
              {r.hazardLabel && (
                <span className="block font-mono text-xs text-muted">from {r.hazardLabel}</span>
              )}
            </span>
          );
        },
      }),
      column.accessor((r) => `${r.cabinetTag ?? ''}${r.stripTag ? ` / ${r.stripTag}` : ''}`, {
        id: 'where',
        header: 'Cabinet / strip',
        cell: (c) => <span className="font-mono whitespace-nowrap">{c.getValue() || '—'}</span>,
      }),
      column.accessor('margin', {
        header: () => (
          <Link
            href={marginSortHref}
            className="underline-offset-2 hover:underline"
            aria-label={`Margin, ${marginSortLabel}`}
          >
            Margin <span aria-hidden>{marginSortLabel.includes('ascending') ? '▲' : '▼'}</span>
          </Link>
        ),
        cell: (c) => (
          <span className="font-mono whitespace-nowrap">{formatMargin(c.getValue())}</span>
        ),
      }),
      column.accessor('reason', {
        header: 'Why',
        cell: (c) => {
          const r = c.row.original;
          return (
            <span className="text-sm">
              {r.delta && (
                <span className="mr-1 rounded-sm border border-accent px-1 text-xs text-accent">
                  {r.delta === 'new' ? 'new' : 'changed'}
                </span>
              )}
              {c.getValue()}
            </span>
          );
        },
      }),
    ],
    [projectId, marginSortHref, marginSortLabel],
  );

  const table = useReactTable({ data: rows, columns, getCoreRowModel: getCoreRowModel() });

  if (rows.length === 0)
    return <p className="py-6 text-sm text-muted">No findings match these filters.</p>;

  return (
    <div className="overflow-x-auto">
      <table className="w-full text-sm" aria-label="Findings">
        <thead className="text-left text-xs text-muted">
          {table.getHeaderGroups().map((g) => (
            <tr key={g.id}>
              {g.headers.map((h) => (
                <th
                  key={h.id}
                  scope="col"
                  aria-sort={
                    h.column.id === 'margin'
                      ? marginSortLabel.includes('ascending')
                        ? 'ascending'
                        : 'descending'
                      : undefined
                  }
                  className={`py-2 pr-3 font-medium whitespace-nowrap ${h.column.id === 'margin' ? 'text-right' : ''}`}
                >
                  {flexRender(h.column.columnDef.header, h.getContext())}
                </th>
              ))}
            </tr>
          ))}
        </thead>
        <tbody>
          {table.getRowModel().rows.map((row) => {
            const href = hrefOf(projectId, row.original);
            return (
              <tr
                key={row.id}
                className={`border-t border-line align-top ${href ? 'cursor-pointer hover:bg-accent-soft' : ''}`}
                onClick={(e) => {
                  if (!href || (e.target as HTMLElement).closest('a')) return;
                  router.push(href);
                }}
                data-verdict={row.original.verdict}
              >
                {row.getVisibleCells().map((cell) => (
                  <td
                    key={cell.id}
                    className={`py-1.5 pr-3 ${cell.column.id === 'margin' ? 'text-right' : ''} ${cell.column.id === 'reason' ? 'min-w-[18rem]' : ''}`}
                  >
                    {flexRender(cell.column.columnDef.cell, cell.getContext())}
                  </td>
                ))}
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}
