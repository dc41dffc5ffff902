'use client';

import { useQuery, useQueryClient } from '@tanstack/react-query';
import Link from 'next/link';
import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { Panel, PanelTitle } from '@/components/ui/panel';
import { keys, projectApi } from './api';
import { CabinetForm } from './forms/cabinet-form';
import { Modal } from './modal';
import type { Cabinet } from './types';

/** The project's cabinets with their counts; writers add, rename and remove empty ones. */
export function CabinetList({
  projectId,
  canWrite,
  initial,
}: {
  projectId: number;
  canWrite: boolean;
  initial: Cabinet[];
}) {
  const api = projectApi(projectId);
  const queryClient = useQueryClient();
  const { data } = useQuery({
    queryKey: keys.cabinets(projectId),
    queryFn: () => api.listCabinets(),
    initialData: { items: initial },
  });
  const [editing, setEditing] = useState<Cabinet | 'new' | null>(null);
  const [failure, setFailure] = useState<string | null>(null);
  const cabinets = data.items;

  const remove = async (cabinet: Cabinet) => {
    if (!window.confirm(`Delete cabinet ${cabinet.tag}?`)) return;
    setFailure(null);
    try {
      await api.deleteCabinet(cabinet.id, cabinet.version);
    } catch (error) {
      setFailure(error instanceof Error ? error.message : String(error));
    } finally {
      void queryClient.invalidateQueries({ queryKey: keys.cabinets(projectId) });
    }
  };

  return (
    <Panel>
      <PanelTitle
        aside={
          canWrite ? (
            <Button size="sm" onClick={() => setEditing('new')}>
              New cabinet
            </Button>
          ) : (
            <span className="text-xs text-muted">read-only for your role</span>
          )
        }
      >
        Cabinets
      </PanelTitle>
      {failure ? (
        <p
          role="alert"
          className="mb-3 rounded-sm border border-danger bg-danger-soft p-2 text-sm text-danger"
        >
          {failure}
        </p>
      ) : null}
      {cabinets.length === 0 ? (
        <p className="text-sm text-muted">
          No cabinets yet.
          {canWrite
            ? ' Add the first one, then its strips, then import or enter its terminals.'
            : ''}
        </p>
      ) : (
        <table className="w-full text-sm">
          <thead className="text-left text-xs text-muted uppercase">
            <tr>
              <th className="py-1 font-medium">Tag</th>
              <th className="py-1 font-medium">Name</th>
              <th className="hidden py-1 font-medium sm:table-cell">Location</th>
              <th className="py-1 text-right font-medium">Strips</th>
              <th className="py-1 text-right font-medium">Terminals</th>
              <th className="py-1 text-right font-medium">Channels</th>
              {canWrite ? <th className="py-1" aria-label="Actions" /> : null}
            </tr>
          </thead>
          <tbody>
            {cabinets.map((c) => (
              <tr key={c.id} className="border-t border-line">
                <td className="py-2 font-mono">
                  <Link
                    href={`/projects/${projectId}/cabinets/${c.id}`}
                    className="text-accent hover:underline"
                  >
                    {c.tag}
                  </Link>
                </td>
                <td className="py-2">
                  <Link
                    href={`/projects/${projectId}/cabinets/${c.id}`}
                    className="hover:underline"
                  >
                    {c.name}
                  </Link>
                </td>
                <td className="hidden py-2 text-muted sm:table-cell">{c.location}</td>
                <td className="py-2 text-right font-mono">{c.stripCount}</td>
                <td className="py-2 text-right font-mono">{c.terminalCount}</td>
                <td className="py-2 text-right font-mono">{c.channelCount}</td>
                {canWrite ? (
                  <td className="py-2 text-right whitespace-nowrap">
                    <Button size="sm" variant="ghost" onClick={() => setEditing(c)}>
                      Edit
                    </Button>
                    <Button
                      size="sm"
                      variant="ghost"
                      onClick={() => void remove(c)}
                      disabled={c.stripCount > 0}
                      title={c.stripCount > 0 ? 'Remove its strips first' : undefined}
                    >
                      Delete
                    </Button>
                  </td>
                ) : null}
              </tr>
            ))}
          </tbody>
        </table>
      )}
      <Modal
        open={editing !== null}
        title={editing === 'new' ? 'New cabinet' : `Cabinet ${editing?.tag ?? ''}`}
        onClose={() => setEditing(null)}
      >
        {editing !== null ? (
          <CabinetForm
            projectId={projectId}
            cabinet={editing === 'new' ? undefined : editing}
            onDone={() => setEditing(null)}
          />
        ) : null}
      </Modal>
    </Panel>
  );
}
