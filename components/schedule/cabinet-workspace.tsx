'use client';

import { useQuery } from '@tanstack/react-query';
import { useMemo, useState } from 'react';
import { Button, buttonVariants } from '@/components/ui/button';
import { Panel, PanelTitle } from '@/components/ui/panel';
import { StripDrawing, type DrawnExposure } from '@/components/strip/strip-drawing';
import { TerminalDetail } from '@/components/strip/terminal-detail';
import { cn } from '@/lib/utils';
import { keys, projectApi } from './api';
import { ChannelForm } from './forms/channel-form';
import { StripForm } from './forms/strip-form';
import { TerminalForm } from './forms/terminal-form';
import { ImportWizard } from './import-wizard';
import { Modal } from './modal';
import { ScheduleTable } from './schedule-table';
import type { Cabinet, ChannelRow, Strip, TerminalRow } from './types';

type Dialog =
  | { kind: 'strip'; strip?: Strip }
  | { kind: 'terminal'; terminal?: TerminalRow }
  | { kind: 'channel'; channel?: ChannelRow }
  | { kind: 'import' }
  | null;

/** The cabinet screen: strips drawn on top, the editable schedule below, channels beside. */
export function CabinetWorkspace({
  projectId,
  cabinet,
  canWrite,
}: {
  projectId: number;
  cabinet: Cabinet;
  canWrite: boolean;
}) {
  const api = projectApi(projectId);
  const strips = useQuery({
    queryKey: keys.strips(projectId, cabinet.id),
    queryFn: () => api.listStrips(cabinet.id),
  });
  const terminals = useQuery({
    queryKey: keys.terminals(projectId, cabinet.id),
    queryFn: () => api.listTerminals(cabinet.id),
  });
  const channels = useQuery({
    queryKey: keys.channels(projectId, cabinet.id),
    queryFn: () => api.listChannels(cabinet.id),
  });
  const [selectedId, setSelectedId] = useState<number | null>(null);
  const [overlay, setOverlay] = useState<'off' | 'likely' | 'all'>('off');
  const exposureMap = useQuery({
    queryKey: [...keys.exposures(projectId), terminals.dataUpdatedAt],
    queryFn: () => api.exposures(),
    enabled: overlay !== 'off',
  });
  const [dialog, setDialog] = useState<Dialog>(null);

  const stripList = useMemo(() => strips.data?.items ?? [], [strips.data]);
  const terminalList = useMemo(() => terminals.data?.items ?? [], [terminals.data]);
  const channelList = useMemo(() => channels.data?.items ?? [], [channels.data]);
  const selected = terminalList.find((t) => t.id === selectedId);
  const exposures = useMemo<DrawnExposure[]>(() => {
    if (overlay === 'off' || !exposureMap.data) return [];
    const here = new Set(terminalList.map((t) => t.id));
    return exposureMap.data.targets
      .flatMap((t) => t.exposures)
      .filter((e) => overlay === 'all' || e.likelihood === 'likely')
      .map((e) => ({
        from: Number(e.hazardTerminalId),
        to: Number(e.targetTerminalId),
        mechanism: e.mechanism,
        likelihood: e.likelihood,
      }))
      .filter((e) => here.has(e.from) && here.has(e.to));
  }, [overlay, exposureMap.data, terminalList]);
  const neighbours = selected
    ? terminalList
        .filter(
          (t) =>
            t.stripId === selected.stripId &&
            t.id !== selected.id &&
            Math.abs(t.position - selected.position) <= 1,
        )
        .sort((a, b) => a.position - b.position || a.level - b.level)
    : [];

  const loadError = strips.error ?? terminals.error ?? channels.error;
  const close = () => setDialog(null);

  return (
    <div className="space-y-6">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <p className="font-mono text-xs text-muted">Cabinet</p>
          <h2 className="text-lg font-semibold">
            <span className="font-mono">{cabinet.tag}</span> · {cabinet.name}
          </h2>
          {cabinet.location ? <p className="text-sm text-muted">{cabinet.location}</p> : null}
        </div>
        <div className="flex flex-wrap gap-2">
          {canWrite ? (
            <>
              <Button size="sm" variant="secondary" onClick={() => setDialog({ kind: 'strip' })}>
                Add strip
              </Button>
              <Button
                size="sm"
                variant="secondary"
                disabled={stripList.length === 0}
                onClick={() => setDialog({ kind: 'terminal' })}
              >
                Add terminal
              </Button>
              <Button size="sm" variant="secondary" onClick={() => setDialog({ kind: 'channel' })}>
                Add channel
              </Button>
              <Button size="sm" onClick={() => setDialog({ kind: 'import' })}>
                Import CSV / XLSX
              </Button>
            </>
          ) : null}
          <a
            className={cn(buttonVariants({ variant: 'secondary', size: 'sm' }))}
            href={api.exportUrl(cabinet.id, 'csv')}
            download
          >
            Export CSV
          </a>
          <a
            className={cn(buttonVariants({ variant: 'secondary', size: 'sm' }))}
            href={api.exportUrl(cabinet.id, 'xlsx')}
            download
          >
            Export XLSX
          </a>
        </div>
      </div>

      {loadError ? (
        <p
          role="alert"
          className="rounded-sm border border-danger bg-danger-soft p-3 text-sm text-danger"
        >
          The schedule could not be loaded: {loadError.message}{' '}
          <button
            type="button"
            className="underline"
            onClick={() => {
              void strips.refetch();
              void terminals.refetch();
              void channels.refetch();
            }}
          >
            Try again
          </button>
        </p>
      ) : null}

      <Panel className="p-3 sm:p-5">
        <PanelTitle
          aside={
            <span className="text-xs text-muted">
              {stripList.length} strips · {terminalList.length} terminals · tap a terminal for its
              details
            </span>
          }
        >
          Strips
        </PanelTitle>
        {strips.isPending || terminals.isPending ? (
          <p className="text-sm text-muted" role="status">
            Loading the strips…
          </p>
        ) : (
          <StripDrawing
            strips={stripList}
            terminals={terminalList}
            exposures={exposures}
            selectedId={selectedId}
            onSelect={setSelectedId}
          />
        )}
        <div className="mt-2 flex flex-wrap items-center gap-2 text-xs">
          <label className="flex items-center gap-1">
            Exposure paths:
            <select
              value={overlay}
              onChange={(e) => setOverlay(e.target.value as typeof overlay)}
              className="h-8 rounded-sm border border-line bg-panel px-1 text-xs"
            >
              <option value="off">hidden</option>
              <option value="likely">likely only</option>
              <option value="all">all</option>
            </select>
          </label>
          {overlay !== 'off' ? (
            <span className="text-muted" role="status">
              {exposureMap.isFetching
                ? 'mapping exposures…'
                : exposureMap.error
                  ? `could not map exposures: ${exposureMap.error.message}`
                  : `${exposures.length} paths from a hazard to a channel terminal (solid: likely, dashed: plausible, dotted: remote); hover a line for its mechanism`}
            </span>
          ) : null}
        </div>
        {canWrite && stripList.length > 0 ? (
          <div className="mt-2 flex flex-wrap gap-1 text-xs">
            <span className="text-muted">Edit strip:</span>
            {stripList.map((s) => (
              <button
                key={s.id}
                type="button"
                className="rounded-sm border border-line px-2 py-0.5 font-mono hover:border-ink"
                onClick={() => setDialog({ kind: 'strip', strip: s })}
              >
                {s.tag}
              </button>
            ))}
          </div>
        ) : null}
      </Panel>

      {selected ? (
        <TerminalDetail
          terminal={selected}
          channel={channelList.find((c) => c.id === selected.channelId)}
          neighbours={neighbours}
          canWrite={canWrite}
          onEdit={() => setDialog({ kind: 'terminal', terminal: selected })}
          onClose={() => setSelectedId(null)}
        />
      ) : null}

      <div className="grid gap-6 2xl:grid-cols-[1fr_18rem]">
        <Panel className="min-w-0 p-3 sm:p-5">
          <PanelTitle>Terminal schedule</PanelTitle>
          {terminals.isPending ? (
            <p className="text-sm text-muted" role="status">
              Loading the schedule…
            </p>
          ) : (
            <ScheduleTable
              projectId={projectId}
              cabinetId={cabinet.id}
              terminals={terminalList}
              strips={stripList}
              channels={channelList}
              canWrite={canWrite}
              selectedTerminalId={selectedId}
              onSelectTerminal={setSelectedId}
            />
          )}
        </Panel>
        <Panel className="p-3 sm:p-5">
          <PanelTitle aside={<span className="text-xs text-muted">{channelList.length}</span>}>
            Channels
          </PanelTitle>
          {channelList.length === 0 ? (
            <p className="text-sm text-muted">No channels in this cabinet yet.</p>
          ) : (
            <ul className="max-h-[60vh] divide-y divide-line overflow-auto text-sm">
              {channelList.map((c) => (
                <li key={c.id} className="flex items-start justify-between gap-2 py-2">
                  <div className="min-w-0">
                    <p className="font-mono font-medium">{c.tag}</p>
                    <p className="truncate text-xs text-muted">
                      {c.signalType} · {c.signalTerminalLabel ?? 'no terminal'}
                      {c.returnTerminalLabel ? ` / ${c.returnTerminalLabel}` : ''} ·{' '}
                      {c.guardRecipeName ? (
                        c.guardRecipeName
                      ) : (
                        <span className="text-danger">no guard</span>
                      )}
                      {c.guardOverrides ? ' (as-built overrides)' : ''}
                    </p>
                  </div>
                  <Button
                    size="sm"
                    variant="ghost"
                    onClick={() => setDialog({ kind: 'channel', channel: c })}
                  >
                    {canWrite ? 'Edit' : 'View'}
                  </Button>
                </li>
              ))}
            </ul>
          )}
        </Panel>
      </div>

      <Modal
        open={dialog?.kind === 'strip'}
        title={
          dialog?.kind === 'strip' && dialog.strip ? `Strip ${dialog.strip.tag}` : 'Add a strip'
        }
        onClose={close}
      >
        {dialog?.kind === 'strip' ? (
          <StripForm
            projectId={projectId}
            cabinetId={cabinet.id}
            strip={dialog.strip}
            onDone={close}
          />
        ) : null}
      </Modal>
      <Modal
        open={dialog?.kind === 'terminal'}
        title={
          dialog?.kind === 'terminal' && dialog.terminal
            ? `Terminal ${dialog.terminal.label}`
            : 'Add a terminal'
        }
        onClose={close}
        wide
      >
        {dialog?.kind === 'terminal' ? (
          <TerminalForm
            projectId={projectId}
            cabinetId={cabinet.id}
            strips={stripList}
            channels={channelList}
            terminal={dialog.terminal}
            onDone={(saved) => {
              close();
              if (saved) setSelectedId(saved.id);
            }}
          />
        ) : null}
      </Modal>
      <Modal
        open={dialog?.kind === 'channel'}
        title={
          dialog?.kind === 'channel' && dialog.channel
            ? `Channel ${dialog.channel.tag}`
            : 'Add a channel'
        }
        onClose={close}
        wide
      >
        {dialog?.kind === 'channel' ? (
          <ChannelForm
            projectId={projectId}
            cabinetId={cabinet.id}
            terminals={terminalList}
            channel={dialog.channel}
            readOnly={!canWrite}
            onDone={close}
          />
        ) : null}
      </Modal>
      <Modal
        open={dialog?.kind === 'import'}
        title={`Import terminals into ${cabinet.tag}`}
        onClose={close}
        wide
      >
        {dialog?.kind === 'import' ? (
          <ImportWizard
            projectId={projectId}
            cabinetId={cabinet.id}
            cabinetTag={cabinet.tag}
            onClose={close}
          />
        ) : null}
      </Modal>
    </div>
  );
}
