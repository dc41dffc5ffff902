'use client';

import { useId, useMemo, useState, type KeyboardEvent } from 'react';
import type { WaveformTrace } from '@/lib/stress/types';
import { formatEng } from '@/lib/units';
import { decimate, linearScale, niceAxis, tickLabel } from '@/lib/report/plot-scale';

// Geometry in viewBox units; the SVG scales to its column (readable down to 1024 px wide).
const W = 640;
const H = 280;
const M = { left: 58, right: 14, top: 14, bottom: 40 };
const MAX_POINTS = 600;
const TABLE_ROWS = 41;

/** Each trace differs by stroke, dash AND the marker letter in the legend: never colour alone. */
const STYLES = [
  { stroke: 'stroke-ink', dash: '', swatch: 'bg-ink' },
  { stroke: 'stroke-accent', dash: '7 4', swatch: 'bg-accent' },
  { stroke: 'stroke-circuit-sensitive', dash: '2 3', swatch: 'bg-circuit-sensitive' },
  { stroke: 'stroke-verdict-holds', dash: '10 3 2 3', swatch: 'bg-verdict-holds' },
  { stroke: 'stroke-verdict-unprotected', dash: '4 2', swatch: 'bg-verdict-unprotected' },
  { stroke: 'stroke-muted', dash: '1 2', swatch: 'bg-muted' },
];

const MARKS = ['a', 'b', 'c', 'd', 'e', 'f', 'g', 'h'];

export interface PlotTrace {
  name: string;
  values: number[];
}

/** Human names for the engine's trace names. */
export function traceLabel(name: string): string {
  if (name === 'source') return 'open-circuit source';
  if (name === 'terminal') return 'field terminal';
  if (name === 'input') return 'protected input';
  if (name === 'source current') return 'from the source';
  if (name === 'I(input)') return 'into the input';
  const m = /^I\((.+)\)$/.exec(name);
  return m ? `through ${m[1]}` : name;
}

export function WaveformPlot({
  title,
  unit,
  t,
  traces,
}: {
  title: string;
  unit: WaveformTrace['unit'];
  t: number[];
  traces: PlotTrace[];
}) {
  const id = useId();
  const [cursor, setCursor] = useState<number | null>(null);
  const quantity = unit === 'V' ? 'Voltage' : 'Current';

  const geometry = useMemo(() => {
    const tMin = t[0] ?? 0;
    const tMax = t[t.length - 1] ?? 1;
    const xAxis = niceAxis(tMin, tMax, 6);
    let lo = 0;
    let hi = 0;
    for (const tr of traces)
      for (const v of tr.values) {
        if (v < lo) lo = v;
        if (v > hi) hi = v;
      }
    const yAxis = niceAxis(lo, hi, 5);
    // Rounded to 0.01 unit: server and browser then print identical attributes (hydration).
    const xs = linearScale(xAxis.min, xAxis.max, M.left, W - M.right);
    const ys = linearScale(yAxis.min, yAxis.max, H - M.bottom, M.top);
    const x = (v: number) => Math.round(xs(v) * 100) / 100;
    const y = (v: number) => Math.round(ys(v) * 100) / 100;
    const paths = traces.map((tr) => {
      const d = decimate(t, tr.values, MAX_POINTS);
      return d.t
        .map((tt, k) => `${k === 0 ? 'M' : 'L'}${x(tt).toFixed(1)},${y(d.v[k]!).toFixed(1)}`)
        .join('');
    });
    return { xAxis, yAxis, x, y, paths };
  }, [t, traces]);

  const { xAxis, yAxis, x, y, paths } = geometry;
  const stride = Math.max(1, Math.floor(t.length / 120));

  const onKey = (e: KeyboardEvent<SVGSVGElement>) => {
    const last = t.length - 1;
    if (last < 0) return;
    const step = e.shiftKey ? stride * 10 : stride;
    let next: number | null = cursor;
    if (e.key === 'ArrowRight') next = Math.min(last, (cursor ?? -step) + step);
    else if (e.key === 'ArrowLeft') next = Math.max(0, (cursor ?? last + step) - step);
    else if (e.key === 'Home') next = 0;
    else if (e.key === 'End') next = last;
    else if (e.key === 'Escape') next = null;
    else return;
    e.preventDefault();
    setCursor(next);
  };

  const tableRows = useMemo(() => {
    const n = Math.min(TABLE_ROWS, t.length);
    return Array.from({ length: n }, (_, k) =>
      Math.round((k * (t.length - 1)) / Math.max(1, n - 1)),
    );
  }, [t]);

  const readout =
    cursor === null
      ? 'Use ← and → to read values along the time axis (Shift for bigger steps).'
      : `t = ${formatEng(t[cursor]!, 's')}: ${traces.map((tr) => `${traceLabel(tr.name)} ${formatEng(tr.values[cursor]!, unit)}`).join(' · ')}`;

  return (
    <figure className="space-y-2" data-testid={`plot-${unit}`}>
      <figcaption className="text-sm font-medium">{title}</figcaption>
      <ul className="flex flex-wrap gap-x-4 gap-y-1 text-xs" aria-label={`${title}: traces`}>
        {traces.map((tr, k) => {
          const s = STYLES[k % STYLES.length]!;
          return (
            <li key={tr.name} className="flex items-center gap-1.5">
              <svg aria-hidden viewBox="0 0 30 10" className="h-2.5 w-8">
                <line
                  x1={1}
                  x2={29}
                  y1={5}
                  y2={5}
                  className={s.stroke}
                  strokeWidth={2}
                  strokeDasharray={s.dash || undefined}
                />
              </svg>
              <span className="font-mono text-muted">{MARKS[k]}</span>
              {traceLabel(tr.name)}
            </li>
          );
        })}
      </ul>
      <svg
        viewBox={`0 0 ${W} ${H}`}
        className="w-full rounded-sm border border-line bg-panel"
        role="img"
        tabIndex={0}
        aria-label={`${title}. ${quantity} from ${formatEng(yAxis.min, unit)} to ${formatEng(yAxis.max, unit)} over ${formatEng(t[t.length - 1] ?? 0, 's')}. Focus and use the arrow keys to read values; a data table follows.`}
        aria-describedby={`${id}-readout`}
        onKeyDown={onKey}
        onBlur={() => setCursor(null)}
      >
        {/* grid and ticks */}
        {yAxis.ticks.map((v) => (
          <g key={`y${v}`}>
            <line
              x1={M.left}
              x2={W - M.right}
              y1={y(v)}
              y2={y(v)}
              className={v === 0 ? 'stroke-muted' : 'stroke-line'}
              strokeWidth={v === 0 ? 1 : 0.6}
            />
            <text
              x={M.left - 6}
              y={y(v) + 4}
              textAnchor="end"
              className="fill-muted font-mono text-[11px]"
            >
              {tickLabel(v, yAxis)}
            </text>
          </g>
        ))}
        {xAxis.ticks.map((v) => (
          <g key={`x${v}`}>
            <line
              x1={x(v)}
              x2={x(v)}
              y1={M.top}
              y2={H - M.bottom}
              className="stroke-line"
              strokeWidth={0.6}
            />
            <text
              x={x(v)}
              y={H - M.bottom + 15}
              textAnchor="middle"
              className="fill-muted font-mono text-[11px]"
            >
              {tickLabel(v, xAxis)}
            </text>
          </g>
        ))}
        <text
          x={(M.left + W - M.right) / 2}
          y={H - 6}
          textAnchor="middle"
          className="fill-ink text-[12px]"
        >
          time ({xAxis.prefix}s)
        </text>
        <text
          x={14}
          y={(M.top + H - M.bottom) / 2}
          textAnchor="middle"
          transform={`rotate(-90 14 ${(M.top + H - M.bottom) / 2})`}
          className="fill-ink text-[12px]"
        >
          {quantity.toLowerCase()} ({yAxis.prefix}
          {unit})
        </text>
        <rect
          x={M.left}
          y={M.top}
          width={W - M.left - M.right}
          height={H - M.top - M.bottom}
          className="fill-none stroke-muted"
          strokeWidth={0.8}
        />
        {paths.map((d, k) => {
          const s = STYLES[k % STYLES.length]!;
          return (
            <path
              key={traces[k]!.name}
              d={d}
              className={`fill-none ${s.stroke}`}
              strokeWidth={1.8}
              strokeDasharray={s.dash || undefined}
              strokeLinejoin="round"
            />
          );
        })}
        {cursor !== null && (
          <g>
            <line
              x1={x(t[cursor]!)}
              x2={x(t[cursor]!)}
              y1={M.top}
              y2={H - M.bottom}
              className="stroke-ink"
              strokeWidth={1}
              strokeDasharray="3 3"
            />
            {traces.map((tr, k) => (
              <g key={tr.name}>
                <circle
                  cx={x(t[cursor]!)}
                  cy={y(tr.values[cursor]!)}
                  r={3.5}
                  className={`fill-panel ${STYLES[k % STYLES.length]!.stroke}`}
                  strokeWidth={1.5}
                />
                <text
                  x={x(t[cursor]!) + 5}
                  y={y(tr.values[cursor]!) - 4}
                  className="fill-ink font-mono text-[10px]"
                >
                  {MARKS[k]}
                </text>
              </g>
            ))}
          </g>
        )}
      </svg>
      <p id={`${id}-readout`} className="font-mono text-xs text-muted" aria-live="polite">
        {readout}
      </p>
      <details className="text-xs">
        <summary className="cursor-pointer text-muted">
          Data table ({tableRows.length} of {t.length} samples)
        </summary>
        <div className="mt-2 max-h-64 overflow-auto">
          <table className="w-full font-mono">
            <caption className="sr-only">{title}: sampled values</caption>
            <thead className="text-left text-muted">
              <tr>
                <th scope="col" className="pr-3 font-medium">
                  t
                </th>
                {traces.map((tr) => (
                  <th key={tr.name} scope="col" className="pr-3 font-medium">
                    {traceLabel(tr.name)}
                  </th>
                ))}
              </tr>
            </thead>
            <tbody>
              {tableRows.map((k) => (
                <tr key={k} className="border-t border-line">
                  <td className="pr-3">{formatEng(t[k]!, 's')}</td>
                  {traces.map((tr) => (
                    <td key={tr.name} className="pr-3">
                      {formatEng(tr.values[k]!, unit)}
                    </td>
                  ))}
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      </details>
    </figure>
  );
}
