'use client';

import { useMemo, useState, type KeyboardEvent } from 'react';
import { ClassGlyph } from './class-glyph';
import type { Strip, TerminalRow } from '@/components/schedule/types';
import type { Verdict } from '@/lib/stress/types';
import type { LikelihoodClass, Mechanism } from '@/lib/exposure/types';
import { CIRCUIT_CLASSES } from '@/models/enums';
import { cn } from '@/lib/utils';

/** A path by which a hazard terminal can reach a channel terminal (drawn by the audit overlay). */
export interface DrawnExposure {
  from: number;
  to: number;
  mechanism: Mechanism;
  likelihood: LikelihoodClass;
}

// Geometry in CSS pixels: a position is wide enough to touch with a gloved finger (≥ 44 px).
const PITCH = 54;
const TILE_H = 58;
const TAG_W = 72;
const BRIDGE_H = 18;
const FOOT_H = 22;
const STRIP_GAP = 22;

// Full class names so Tailwind's scanner sees them.
const TILE_FILL: Record<string, string> = {
  hazard: 'fill-circuit-hazard',
  sensitive: 'fill-circuit-sensitive',
  return: 'fill-circuit-return',
  earth: 'fill-circuit-earth',
  spare: 'fill-circuit-spare',
  barrier: 'fill-circuit-barrier',
};
const TILE_STROKE: Record<string, string> = {
  hazard: 'stroke-circuit-hazard',
  sensitive: 'stroke-circuit-sensitive',
  return: 'stroke-circuit-return',
  earth: 'stroke-circuit-earth',
  spare: 'stroke-circuit-spare',
  barrier: 'stroke-circuit-barrier',
};
const VERDICT_STROKE: Record<Verdict, string> = {
  holds: 'stroke-verdict-holds',
  marginal: 'stroke-verdict-marginal',
  fails: 'stroke-verdict-fails',
  unprotected: 'stroke-verdict-unprotected',
  incomplete: 'stroke-verdict-incomplete',
};
const VERDICT_FILL: Record<Verdict, string> = {
  holds: 'fill-verdict-holds',
  marginal: 'fill-verdict-marginal',
  fails: 'fill-verdict-fails',
  unprotected: 'fill-verdict-unprotected',
  incomplete: 'fill-verdict-incomplete',
};
const VERDICT_BG: Record<Verdict, string> = {
  holds: 'bg-verdict-holds',
  marginal: 'bg-verdict-marginal',
  fails: 'bg-verdict-fails',
  unprotected: 'bg-verdict-unprotected',
  incomplete: 'bg-verdict-incomplete',
};
/** A letter beside each verdict colour, so the verdict never rests on colour alone. */
const VERDICT_MARK: Record<Verdict, string> = {
  holds: 'H',
  marginal: 'M',
  fails: 'F',
  unprotected: 'U',
  incomplete: '?',
};
const CLASS_LABEL: Record<string, string> = {
  hazard: 'hazard source',
  sensitive: 'sensitive input',
  return: 'return / common',
  earth: 'earth / shield',
  spare: 'spare',
  barrier: 'barrier',
};

export function voltageText(t: Pick<TerminalRow, 'nominalVoltage' | 'currentKind'>): string {
  if (t.nominalVoltage === null || t.nominalVoltage === undefined) return '';
  const v = Number(t.nominalVoltage.toPrecision(4));
  return `${v}V${t.currentKind ? ` ${t.currentKind.toUpperCase()}` : ''}`;
}

/** The short name printed on a tile: the terminal number, else what follows the strip tag in the label. */
function shortName(t: TerminalRow): string {
  if (t.terminalNumber) return t.terminalNumber;
  const after = t.label.split(':').at(-1) ?? t.label;
  return after.length > 6 ? `${after.slice(0, 5)}…` : after;
}

function describe(t: TerminalRow, verdict?: Verdict): string {
  const parts = [t.label, CLASS_LABEL[t.circuitClass] ?? t.circuitClass];
  const v = voltageText(t);
  if (v) parts.push(v);
  if (t.level > 1) parts.push(`level ${t.level}`);
  if (t.channelTag) parts.push(`channel ${t.channelTag}`);
  if (t.wireNumber) parts.push(`wire ${t.wireNumber}`);
  if (verdict) parts.push(`verdict ${verdict}`);
  return parts.join(', ');
}

interface StripLayout {
  strip: Strip;
  terminals: TerminalRow[];
  maxPosition: number;
  levels: number;
  top: number;
  height: number;
  bridges: { group: string; from: number; to: number; members: number[] }[];
}

/**
 * Each strip as a row of positions seen from the front: stacked levels one above another,
 * barriers as thick partitions, bridges as a bar over the tiles they join, the channel tag
 * under each sensitive terminal. Circuit class is told by fill AND by a glyph.
 */
export function StripDrawing({
  strips,
  terminals,
  exposures = [],
  verdicts = {},
  selectedId,
  onSelect,
}: {
  strips: Strip[];
  terminals: TerminalRow[];
  exposures?: DrawnExposure[];
  verdicts?: Record<number, Verdict>;
  selectedId?: number | null;
  onSelect?: (terminalId: number) => void;
}) {
  const [focusedId, setFocusedId] = useState<number | null>(null);

  const layouts = useMemo(() => {
    const byStrip = new Map<number, TerminalRow[]>();
    for (const t of terminals)
      (byStrip.get(t.stripId) ?? byStrip.set(t.stripId, []).get(t.stripId)!).push(t);
    const sorted = [...strips].sort((a, b) => a.order - b.order || a.tag.localeCompare(b.tag));
    const out: StripLayout[] = [];
    for (const strip of sorted) {
      const top = out.length ? out[out.length - 1].top + out[out.length - 1].height + STRIP_GAP : 0;
      const list = byStrip.get(strip.id) ?? [];
      const maxPosition = Math.max(0, ...list.map((t) => t.position));
      const levels = Math.max(1, ...list.map((t) => t.level));
      const groups = new Map<string, TerminalRow[]>();
      for (const t of list)
        if (t.bridgeGroup)
          (groups.get(t.bridgeGroup) ?? groups.set(t.bridgeGroup, []).get(t.bridgeGroup)!).push(t);
      const bridges = [...groups.entries()]
        .filter(([, members]) => members.length > 1)
        .map(([group, members]) => ({
          group,
          from: Math.min(...members.map((m) => m.position)),
          to: Math.max(...members.map((m) => m.position)),
          members: members.map((m) => m.position),
        }));
      const height = BRIDGE_H + levels * TILE_H + FOOT_H;
      out.push({ strip, terminals: list, maxPosition, levels, top, height, bridges });
    }
    return out;
  }, [strips, terminals]);

  // Centre of each tile, for the exposure overlay.
  const centres = useMemo(() => {
    const m = new Map<number, { x: number; y: number }>();
    for (const l of layouts) {
      for (const t of l.terminals) {
        m.set(t.id, {
          x: TAG_W + (t.position - 0.5) * PITCH,
          y: l.top + BRIDGE_H + (l.levels - t.level + 0.5) * TILE_H,
        });
      }
    }
    return m;
  }, [layouts]);

  const width = TAG_W + Math.max(8, ...layouts.map((l) => l.maxPosition)) * PITCH + 16;
  const height = Math.max(
    60,
    layouts.reduce((h, l) => h + l.height + STRIP_GAP, 0),
  );
  const usedVerdicts = [...new Set(Object.values(verdicts))] as Verdict[];

  const onKey = (e: KeyboardEvent<SVGGElement>, id: number) => {
    if (e.key === 'Enter' || e.key === ' ') {
      e.preventDefault();
      onSelect?.(id);
    }
  };

  if (strips.length === 0) {
    return <p className="text-sm text-muted">This cabinet has no strips yet.</p>;
  }

  return (
    <figure className="space-y-2" aria-label="Strip drawing">
      <figcaption className="flex flex-wrap items-center gap-x-4 gap-y-1 text-xs text-muted">
        {CIRCUIT_CLASSES.map((c) => (
          <span key={c} className="flex items-center gap-1">
            <svg aria-hidden viewBox="0 0 14 14" className="h-3.5 w-3.5">
              <ClassGlyph cls={c} x={7} y={7} size={12} />
            </svg>
            {CLASS_LABEL[c]}
          </span>
        ))}
        <span className="flex items-center gap-1">
          <svg aria-hidden viewBox="0 0 28 10" className="h-2.5 w-7">
            <line x1={2} x2={26} y1={5} y2={5} className="stroke-ink" strokeWidth={3} />
          </svg>
          bridge
        </span>
        {exposures.length > 0 ? (
          <span className="flex items-center gap-1">
            <svg aria-hidden viewBox="0 0 28 10" className="h-2.5 w-7">
              <line x1={2} x2={26} y1={5} y2={5} className="stroke-danger" strokeWidth={2.5} />
            </svg>
            exposure path
          </span>
        ) : null}
        {usedVerdicts.map((v) => (
          <span key={v} className="flex items-center gap-1">
            <span
              className={cn(
                'inline-block rounded-[2px] px-1 font-mono text-[10px] text-accent-ink',
                VERDICT_BG[v],
              )}
            >
              {VERDICT_MARK[v]}
            </span>
            {v}
          </span>
        ))}
      </figcaption>
      <div
        className="overflow-x-auto overscroll-x-contain rounded-sm border border-line bg-panel"
        data-testid="strip-drawing"
      >
        <svg
          width={width}
          height={height}
          viewBox={`0 0 ${width} ${height}`}
          role="group"
          aria-label={`${strips.length} strips, ${terminals.length} terminals`}
          className="block select-none"
        >
          {layouts.map((l) => (
            <g key={l.strip.id} aria-label={`Strip ${l.strip.tag}`} role="list">
              {/* the rail: a spine along the strip */}
              <rect
                x={TAG_W - 6}
                y={l.top + BRIDGE_H + l.levels * TILE_H - 6}
                width={Math.max(1, l.maxPosition) * PITCH + 12}
                height={4}
                className="fill-rail"
                opacity={0.35}
              />
              <text
                x={8}
                y={l.top + BRIDGE_H + 18}
                className="fill-ink font-mono text-[15px] font-semibold"
              >
                {l.strip.tag}
              </text>
              {l.strip.name ? (
                <text x={8} y={l.top + BRIDGE_H + 34} className="fill-muted text-[10px]">
                  {l.strip.name.length > 9 ? `${l.strip.name.slice(0, 8)}…` : l.strip.name}
                </text>
              ) : null}

              {/* multi-level blocks: each level named once, at the left of its row */}
              {l.levels > 1
                ? Array.from({ length: l.levels }, (_, i) => i + 1).map((level) => (
                    <text
                      key={`level-${level}`}
                      x={TAG_W - 8}
                      y={l.top + BRIDGE_H + (l.levels - level) * TILE_H + TILE_H - 12}
                      textAnchor="end"
                      className="fill-muted font-mono text-[10px]"
                    >
                      {`L${level}`}
                    </text>
                  ))
                : null}

              {/* empty positions: a faint slot */}
              {Array.from({ length: l.maxPosition }, (_, i) => i + 1)
                .filter((p) => !l.terminals.some((t) => t.position === p))
                .map((p) => (
                  <rect
                    key={`gap-${p}`}
                    x={TAG_W + (p - 1) * PITCH + 4}
                    y={l.top + BRIDGE_H + 4}
                    width={PITCH - 8}
                    height={l.levels * TILE_H - 12}
                    className="fill-none stroke-line"
                    strokeDasharray="3 3"
                  />
                ))}

              {l.bridges.map((b) => {
                const y = l.top + BRIDGE_H - 8;
                return (
                  <g key={b.group} aria-label={`bridge ${b.group}`}>
                    <title>{`Bridge ${b.group}: positions ${b.members.join(', ')}`}</title>
                    <line
                      x1={TAG_W + (b.from - 0.5) * PITCH}
                      x2={TAG_W + (b.to - 0.5) * PITCH}
                      y1={y}
                      y2={y}
                      className="stroke-ink"
                      strokeWidth={4}
                      strokeLinecap="round"
                    />
                    {b.members.map((p) => (
                      <line
                        key={p}
                        x1={TAG_W + (p - 0.5) * PITCH}
                        x2={TAG_W + (p - 0.5) * PITCH}
                        y1={y}
                        y2={y + 10}
                        className="stroke-ink"
                        strokeWidth={2}
                      />
                    ))}
                  </g>
                );
              })}

              {l.terminals.map((t) => {
                const x = TAG_W + (t.position - 1) * PITCH;
                const y = l.top + BRIDGE_H + (l.levels - t.level) * TILE_H;
                const verdict = verdicts[t.id];
                const selected = selectedId === t.id;
                const focused = focusedId === t.id;
                if (t.circuitClass === 'barrier') {
                  return (
                    <g
                      key={t.id}
                      role="listitem"
                      tabIndex={0}
                      aria-label={describe(t)}
                      onClick={() => onSelect?.(t.id)}
                      onKeyDown={(e) => onKey(e, t.id)}
                      onFocus={() => setFocusedId(t.id)}
                      onBlur={() => setFocusedId(null)}
                      className="cursor-pointer outline-none"
                      data-terminal-id={t.id}
                    >
                      <title>{describe(t)}</title>
                      <rect
                        x={x}
                        y={y}
                        width={PITCH}
                        height={TILE_H - 6}
                        className="fill-transparent"
                      />
                      <rect
                        x={x + PITCH / 2 - 5}
                        y={l.top + 2}
                        width={10}
                        height={BRIDGE_H + l.levels * TILE_H - 4}
                        rx={1}
                        className="fill-circuit-barrier"
                      />
                      {selected || focused ? (
                        <rect
                          x={x + 2}
                          y={y + 1}
                          width={PITCH - 4}
                          height={TILE_H - 8}
                          rx={4}
                          className="fill-none stroke-accent"
                          strokeWidth={3}
                        />
                      ) : null}
                    </g>
                  );
                }
                return (
                  <g
                    key={t.id}
                    role="listitem"
                    tabIndex={0}
                    aria-label={describe(t, verdict)}
                    aria-current={selected ? 'true' : undefined}
                    onClick={() => onSelect?.(t.id)}
                    onKeyDown={(e) => onKey(e, t.id)}
                    onFocus={() => setFocusedId(t.id)}
                    onBlur={() => setFocusedId(null)}
                    className="cursor-pointer outline-none"
                    data-terminal-id={t.id}
                  >
                    <title>{describe(t, verdict)}</title>
                    {/* the tile: a tint of the class colour, outlined in it */}
                    <rect
                      x={x + 3}
                      y={y + 2}
                      width={PITCH - 6}
                      height={TILE_H - 8}
                      rx={4}
                      className="fill-panel"
                    />
                    <rect
                      x={x + 3}
                      y={y + 2}
                      width={PITCH - 6}
                      height={TILE_H - 8}
                      rx={4}
                      className={cn(TILE_FILL[t.circuitClass], TILE_STROKE[t.circuitClass])}
                      fillOpacity={t.circuitClass === 'spare' ? 0.08 : 0.16}
                      strokeWidth={1.5}
                      strokeDasharray={t.circuitClass === 'spare' ? '4 3' : undefined}
                    />
                    {/* a solid band on hazards: the strongest cue after the glyph */}
                    {t.circuitClass === 'hazard' ? (
                      <rect
                        x={x + 3}
                        y={y + 2}
                        width={PITCH - 6}
                        height={5}
                        rx={2}
                        className="fill-circuit-hazard"
                      />
                    ) : null}
                    <ClassGlyph cls={t.circuitClass} x={x + 13} y={y + 17} size={11} />
                    <text
                      x={x + PITCH - 7}
                      y={y + 21}
                      textAnchor="end"
                      className="fill-ink font-mono text-[12px] font-semibold"
                    >
                      {shortName(t)}
                    </text>
                    <text
                      x={x + PITCH / 2}
                      y={y + 40}
                      textAnchor="middle"
                      className="fill-ink font-mono text-[9.5px]"
                    >
                      {voltageText(t)}
                    </text>
                    {verdict ? (
                      <g>
                        <rect
                          x={x + 1}
                          y={y}
                          width={PITCH - 2}
                          height={TILE_H - 4}
                          rx={5}
                          className={cn('fill-none', VERDICT_STROKE[verdict])}
                          strokeWidth={3}
                        />
                        <rect
                          x={x + PITCH - 17}
                          y={y + TILE_H - 18}
                          width={14}
                          height={12}
                          rx={2}
                          className={VERDICT_FILL[verdict]}
                        />
                        <text
                          x={x + PITCH - 10}
                          y={y + TILE_H - 9}
                          textAnchor="middle"
                          className="fill-accent-ink font-mono text-[9px] font-bold"
                        >
                          {VERDICT_MARK[verdict]}
                        </text>
                      </g>
                    ) : null}
                    {selected || focused ? (
                      <rect
                        x={x}
                        y={y - 1}
                        width={PITCH}
                        height={TILE_H - 2}
                        rx={6}
                        className="fill-none stroke-accent"
                        strokeWidth={selected ? 3 : 2}
                        strokeDasharray={selected ? undefined : '4 2'}
                      />
                    ) : null}
                    {t.channelTag && t.level === 1 ? (
                      <text
                        x={x + PITCH / 2}
                        y={l.top + BRIDGE_H + l.levels * TILE_H + 12}
                        textAnchor="middle"
                        className="fill-circuit-sensitive font-mono text-[9.5px] font-medium"
                      >
                        {t.channelTag.length > 8 ? `${t.channelTag.slice(0, 7)}…` : t.channelTag}
                      </text>
                    ) : null}
                    {t.channelTag && t.level > 1 ? (
                      <text
                        x={x + PITCH / 2}
                        y={y + 50}
                        textAnchor="middle"
                        className="fill-circuit-sensitive font-mono text-[8px]"
                      >
                        {t.channelTag.length > 8 ? `${t.channelTag.slice(0, 7)}…` : t.channelTag}
                      </text>
                    ) : null}
                  </g>
                );
              })}
            </g>
          ))}

          {/* exposure overlay: a line per path; dash tells likelihood, a title names the mechanism */}
          {exposures.map((e, i) => {
            const a = centres.get(e.from);
            const b = centres.get(e.to);
            if (!a || !b) return null;
            const sameRow = Math.abs(a.y - b.y) < 1;
            const sameColumn = Math.abs(a.x - b.x) < 1;
            const lift = sameRow ? Math.min(TILE_H * 0.9, 14 + Math.abs(a.x - b.x) / 4) : 0;
            // Stacked levels: run along the tile's right edge so the printed figures stay readable.
            const edge = a.x + PITCH / 2 - 6;
            const d = sameRow
              ? `M${a.x} ${a.y - 16} Q${(a.x + b.x) / 2} ${a.y - 16 - lift} ${b.x} ${b.y - 16}`
              : sameColumn
                ? `M${edge} ${a.y} L${edge} ${b.y}`
                : `M${a.x} ${a.y} L${b.x} ${b.y}`;
            return (
              <path
                key={`${e.from}-${e.to}-${e.mechanism}-${i}`}
                d={d}
                className="fill-none stroke-danger"
                strokeWidth={e.likelihood === 'likely' ? 2.5 : 1.75}
                strokeDasharray={
                  e.likelihood === 'likely'
                    ? undefined
                    : e.likelihood === 'plausible'
                      ? '6 4'
                      : '2 4'
                }
                opacity={0.85}
                pointerEvents="stroke"
              >
                <title>{`${e.mechanism} exposure (${e.likelihood})`}</title>
              </path>
            );
          })}
        </svg>
      </div>
    </figure>
  );
}
