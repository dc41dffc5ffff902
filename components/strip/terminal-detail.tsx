'use client';

import { Button } from '@/components/ui/button';
import type { ChannelRow, TerminalRow } from '@/components/schedule/types';
import { ClassMark } from './class-glyph';
import { voltageText } from './strip-drawing';

/** The facts of one terminal, opened from the drawing (or the table's row number). */
export function TerminalDetail({
  terminal,
  channel,
  neighbours,
  canWrite,
  onEdit,
  onClose,
}: {
  terminal: TerminalRow;
  channel?: ChannelRow;
  neighbours: TerminalRow[];
  canWrite: boolean;
  onEdit: () => void;
  onClose: () => void;
}) {
  const facts: [string, string | null][] = [
    [
      'Strip / position',
      `${terminal.stripTag} · ${terminal.position}${terminal.level > 1 ? ` · level ${terminal.level}` : ''}`,
    ],
    ['Block', terminal.blockId],
    ['Terminal no.', terminal.terminalNumber],
    ['Wire no.', terminal.wireNumber],
    [
      'Cable / core',
      terminal.cableId
        ? `${terminal.cableId}${terminal.cableCore ? ` / ${terminal.cableCore}` : ''}`
        : null,
    ],
    ['Connector', terminal.connector],
    ['Colour', terminal.wireColour],
    ['Hazard kind', terminal.hazardKind],
    ['Voltage', voltageText(terminal) || null],
    ['Frequency', terminal.frequency ? `${terminal.frequency} Hz` : null],
    [
      'Source impedance',
      terminal.sourceImpedance !== null ? `${terminal.sourceImpedance} Ω` : null,
    ],
    ['Bridge group', terminal.bridgeGroup],
    ['Notes', terminal.notes],
  ];
  return (
    <section
      aria-label={`Terminal ${terminal.label}`}
      className="rounded-sm border border-accent bg-panel p-4"
      data-testid="terminal-detail"
    >
      <div className="flex flex-wrap items-start justify-between gap-2 border-b border-line pb-2">
        <div>
          <h3 className="flex items-center gap-2 font-mono text-lg font-semibold">
            <ClassMark value={terminal.circuitClass} />
            {terminal.label}
          </h3>
          <p className="text-sm text-muted">
            {terminal.circuitClass}
            {channel ? (
              <>
                {' '}
                · channel <span className="font-mono text-ink">{channel.tag}</span> (
                {channel.signalType}
                {channel.guardRecipeName ? `, guard “${channel.guardRecipeName}”` : ', no guard'})
              </>
            ) : null}
          </p>
        </div>
        <div className="flex gap-2">
          {canWrite ? (
            <Button size="sm" onClick={onEdit}>
              Edit terminal
            </Button>
          ) : null}
          <Button size="sm" variant="secondary" onClick={onClose}>
            Close
          </Button>
        </div>
      </div>
      <dl className="mt-3 grid grid-cols-2 gap-x-4 gap-y-1 text-sm sm:grid-cols-3 lg:grid-cols-4">
        {facts
          .filter(([, v]) => v !== null && v !== '')
          .map(([k, v]) => (
            <div key={k}>
              <dt className="text-xs text-muted">{k}</dt>
              <dd className="font-mono">{v}</dd>
            </div>
          ))}
      </dl>
      {neighbours.length > 0 ? (
        <p className="mt-3 text-xs text-muted">
          Beside it on the strip:{' '}
          {neighbours.map((n, i) => (
            <span key={n.id} className="font-mono text-ink">
              {i > 0 ? ', ' : ''}
              {n.label} ({n.circuitClass}
              {voltageText(n) ? ` ${voltageText(n)}` : ''})
            </span>
          ))}
        </p>
      ) : null}
    </section>
  );
}
