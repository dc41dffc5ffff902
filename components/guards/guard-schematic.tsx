import { formatEng } from '@/lib/units';
import type { Guard, GuardStage, SeriesElement, ShuntElement } from '@/lib/stress/types';
import { mainFigure } from './elements';

// Layout in SVG units; the drawing scales to its box and scrolls on narrow screens.
const LINE_Y = 60;
const GROUND_Y = 176;
const SERIES_W = 96;
const SHUNT_PITCH = 70;
const INPUT_W = 128;
const LEFT = 56;
/** Drawn larger than its units so 10 px labels read at arm's length on a tablet. */
const SCALE = 1.5;

function valueText(element: SeriesElement | ShuntElement): string {
  const fig = mainFigure(element);
  if (!fig) return '';
  const v = (element as unknown as Record<string, unknown>)[fig.key];
  return typeof v === 'number' && Number.isFinite(v) ? formatEng(v, fig.unit) : '?';
}

function stageWidth(stage: GuardStage) {
  return SERIES_W + Math.max(1, stage.shunts.length) * SHUNT_PITCH;
}

/** A series element drawn on the main line between x and x + SERIES_W (symbols after IEC 60617). */
function SeriesSymbol({
  element,
  x,
  marked,
}: {
  element: SeriesElement;
  x: number;
  marked: boolean;
}) {
  const cx = x + SERIES_W / 2;
  const stroke = marked ? 'stroke-accent' : 'stroke-ink';
  const body = (() => {
    switch (element.kind) {
      case 'resistor':
        return (
          <rect
            x={cx - 22}
            y={LINE_Y - 8}
            width={44}
            height={16}
            className={`fill-panel ${stroke}`}
            strokeWidth={2}
          />
        );
      case 'ptc':
        return (
          <g>
            <rect
              x={cx - 22}
              y={LINE_Y - 8}
              width={44}
              height={16}
              className={`fill-panel ${stroke}`}
              strokeWidth={2}
            />
            <path
              d={`M${cx - 26} ${LINE_Y + 14} L${cx + 18} ${LINE_Y - 14} h8`}
              className={`fill-none ${stroke}`}
              strokeWidth={1.5}
            />
          </g>
        );
      case 'fuse':
        return (
          <g>
            <rect
              x={cx - 22}
              y={LINE_Y - 8}
              width={44}
              height={16}
              className={`fill-panel ${stroke}`}
              strokeWidth={2}
            />
            <line
              x1={cx - 22}
              x2={cx + 22}
              y1={LINE_Y}
              y2={LINE_Y}
              className={stroke}
              strokeWidth={1.5}
            />
          </g>
        );
      case 'wire':
        return (
          <path
            d={`M${cx - 22} ${LINE_Y} q5.5 -8 11 0 t11 0 t11 0 t11 0`}
            className={`fill-none ${stroke}`}
            strokeWidth={2}
          />
        );
    }
  })();
  return (
    <g>
      <line x1={x} x2={cx - 22} y1={LINE_Y} y2={LINE_Y} className="stroke-ink" strokeWidth={2} />
      <line
        x1={cx + 22}
        x2={x + SERIES_W}
        y1={LINE_Y}
        y2={LINE_Y}
        className="stroke-ink"
        strokeWidth={2}
      />
      {body}
      <text
        x={cx}
        y={LINE_Y - 16}
        textAnchor="middle"
        className="fill-ink font-mono text-[11px] font-semibold"
      >
        {element.id}
      </text>
      <text x={cx} y={LINE_Y + 26} textAnchor="middle" className="fill-muted font-mono text-[10px]">
        {valueText(element)}
      </text>
    </g>
  );
}

/** A diode symbol pointing from (x, y1) towards y2 (cathode bar at the far end). */
function Diode({
  x,
  y,
  up,
  cls,
  zener,
}: {
  x: number;
  y: number;
  up: boolean;
  cls: string;
  zener?: boolean;
}) {
  const d = up ? -1 : 1;
  const bar = y + d * 7;
  return (
    <g>
      <path
        d={`M${x - 8} ${y - d * 7} L${x + 8} ${y - d * 7} L${x} ${bar} Z`}
        className={`fill-panel ${cls}`}
        strokeWidth={1.75}
      />
      {zener ? (
        <path
          d={`M${x - 11} ${bar + d * 3} L${x - 8} ${bar} L${x + 8} ${bar} L${x + 11} ${bar - d * 3}`}
          className={`fill-none ${cls}`}
          strokeWidth={1.75}
        />
      ) : (
        <line x1={x - 8} x2={x + 8} y1={bar} y2={bar} className={cls} strokeWidth={1.75} />
      )}
    </g>
  );
}

/** A shunt element hanging from the node bus at x down to ground (or to the rails for the diode pair). */
function ShuntSymbol({
  element,
  x,
  marked,
}: {
  element: ShuntElement;
  x: number;
  marked: boolean;
}) {
  const cls = marked ? 'stroke-accent' : 'stroke-ink';
  const mid = (LINE_Y + GROUND_Y) / 2 + 4;
  const label = (
    <>
      <text x={x + 14} y={mid - 4} className="fill-ink font-mono text-[11px] font-semibold">
        {element.id}
      </text>
      <text x={x + 14} y={mid + 10} className="fill-muted font-mono text-[10px]">
        {valueText(element)}
      </text>
    </>
  );
  const lead = (from: number, to: number) => (
    <line x1={x} x2={x} y1={from} y2={to} className="stroke-ink" strokeWidth={2} />
  );
  const ground = (
    <g className="stroke-ink" strokeWidth={2}>
      <line x1={x - 12} x2={x + 12} y1={GROUND_Y} y2={GROUND_Y} />
      <line x1={x - 7} x2={x + 7} y1={GROUND_Y + 5} y2={GROUND_Y + 5} />
      <line x1={x - 3} x2={x + 3} y1={GROUND_Y + 10} y2={GROUND_Y + 10} />
    </g>
  );
  switch (element.kind) {
    case 'railDiodes':
      return (
        <g>
          {lead(LINE_Y, LINE_Y - 4)}
          {/* to the positive rail above, from the negative rail below */}
          <line x1={x} x2={x} y1={LINE_Y} y2={LINE_Y - 40} className="stroke-ink" strokeWidth={2} />
          <Diode x={x} y={LINE_Y - 24} up cls={cls} />
          <text
            x={x}
            y={LINE_Y - 44}
            textAnchor="middle"
            className="fill-muted font-mono text-[10px]"
          >
            +rail
          </text>
          {lead(LINE_Y, GROUND_Y - 8)}
          <Diode x={x} y={mid} up cls={cls} />
          <text
            x={x}
            y={GROUND_Y + 4}
            textAnchor="middle"
            className="fill-muted font-mono text-[10px]"
          >
            −rail
          </text>
          {label}
        </g>
      );
    case 'zener':
    case 'tvs': {
      const both = element.bidirectional;
      return (
        <g>
          {lead(LINE_Y, GROUND_Y)}
          {both ? (
            <>
              <Diode x={x} y={mid - 9} up cls={cls} zener />
              <Diode x={x} y={mid + 9} up={false} cls={cls} zener />
            </>
          ) : (
            <Diode x={x} y={mid} up cls={cls} zener />
          )}
          {element.kind === 'tvs' ? (
            <text x={x - 12} y={mid + 28} textAnchor="end" className="fill-muted text-[9px]">
              TVS
            </text>
          ) : null}
          {ground}
          {label}
        </g>
      );
    }
    case 'varistor':
      return (
        <g>
          {lead(LINE_Y, GROUND_Y)}
          <rect
            x={x - 8}
            y={mid - 20}
            width={16}
            height={40}
            className={`fill-panel ${cls}`}
            strokeWidth={2}
          />
          <path
            d={`M${x - 13} ${mid + 18} L${x + 9} ${mid - 18} h5`}
            className={`fill-none ${cls}`}
            strokeWidth={1.5}
          />
          <text x={x - 12} y={mid + 32} textAnchor="end" className="fill-muted text-[9px]">
            U
          </text>
          {ground}
          {label}
        </g>
      );
    case 'capacitor':
      return (
        <g>
          {lead(LINE_Y, mid - 4)}
          {lead(mid + 4, GROUND_Y)}
          <line
            x1={x - 13}
            x2={x + 13}
            y1={mid - 4}
            y2={mid - 4}
            className={cls}
            strokeWidth={2.5}
          />
          <line
            x1={x - 13}
            x2={x + 13}
            y1={mid + 4}
            y2={mid + 4}
            className={cls}
            strokeWidth={2.5}
          />
          {ground}
          {label}
        </g>
      );
    case 'shuntResistor':
      return (
        <g>
          {lead(LINE_Y, GROUND_Y)}
          <rect
            x={x - 8}
            y={mid - 20}
            width={16}
            height={40}
            className={`fill-panel ${cls}`}
            strokeWidth={2}
          />
          {ground}
          {label}
        </g>
      );
  }
}

/**
 * The guard drawn from its stages, field terminal on the left, protected input on the right.
 * Read-only; `marked` element ids (e.g. per-channel overrides) are drawn in the accent colour.
 */
export function GuardSchematic({
  guard,
  marked = [],
  title = 'Guard schematic',
}: {
  guard: Guard;
  marked?: string[];
  title?: string;
}) {
  const placed: { stage: GuardStage; at: number }[] = [];
  for (const stage of guard.stages) {
    const last = placed.at(-1);
    placed.push({ stage, at: last ? last.at + stageWidth(last.stage) : LEFT });
  }
  const lastPlaced = placed.at(-1);
  const x = lastPlaced ? lastPlaced.at + stageWidth(lastPlaced.stage) : LEFT;
  const inputX = x + 16;
  const width = inputX + INPUT_W + 16;
  const height = GROUND_Y + 24;
  const input = guard.input;
  const fmt = (v: number | undefined, unit: string) =>
    typeof v === 'number' && Number.isFinite(v) ? formatEng(v, unit) : '?';

  return (
    <div className="overflow-x-auto">
      <svg
        viewBox={`0 0 ${width} ${height}`}
        width={width * SCALE}
        height={height * SCALE}
        role="img"
        aria-label={`${title}: ${guard.stages.length} stages${guard.stages.length ? ', ' : ''}${guard.stages
          .map((s) => [s.series.id, ...s.shunts.map((sh) => sh.id)].join(' + '))
          .join(
            ', then ',
          )}; protected input ${fmt(input.negativeRail, 'V')} to ${fmt(input.positiveRail, 'V')}`}
        className="block max-w-none"
        data-testid="guard-schematic"
      >
        {/* field terminal */}
        <circle
          cx={LEFT - 22}
          cy={LINE_Y}
          r={8}
          className="fill-panel stroke-ink"
          strokeWidth={2}
        />
        <text x={LEFT - 22} y={LINE_Y - 16} textAnchor="middle" className="fill-muted text-[10px]">
          field
        </text>
        <line
          x1={LEFT - 14}
          x2={LEFT}
          y1={LINE_Y}
          y2={LINE_Y}
          className="stroke-ink"
          strokeWidth={2}
        />

        {placed.map(({ stage, at }, i) => {
          const nodeX = at + SERIES_W;
          const busEnd = at + stageWidth(stage);
          return (
            <g key={`${stage.series.id}-${i}`}>
              <SeriesSymbol
                element={stage.series}
                x={at}
                marked={marked.includes(stage.series.id)}
              />
              <line
                x1={nodeX}
                x2={busEnd}
                y1={LINE_Y}
                y2={LINE_Y}
                className="stroke-ink"
                strokeWidth={2}
              />
              {stage.shunts.map((shunt, j) => {
                const sx = nodeX + 24 + j * SHUNT_PITCH;
                return (
                  <g key={shunt.id}>
                    <circle cx={sx} cy={LINE_Y} r={3.5} className="fill-ink" />
                    <ShuntSymbol element={shunt} x={sx} marked={marked.includes(shunt.id)} />
                  </g>
                );
              })}
              <text x={at + 4} y={14} className="fill-muted text-[10px]">
                stage {i + 1}
              </text>
              {i > 0 ? (
                <line
                  x1={at}
                  x2={at}
                  y1={20}
                  y2={GROUND_Y + 14}
                  className="stroke-line"
                  strokeDasharray="2 4"
                />
              ) : null}
            </g>
          );
        })}

        {/* protected input */}
        <line x1={x} x2={inputX} y1={LINE_Y} y2={LINE_Y} className="stroke-ink" strokeWidth={2} />
        <rect
          x={inputX}
          y={LINE_Y - 34}
          width={INPUT_W}
          height={96}
          rx={3}
          className="fill-accent-soft stroke-ink"
          strokeWidth={2}
        />
        <text x={inputX + 8} y={LINE_Y - 18} className="fill-ink text-[11px] font-semibold">
          protected input
        </text>
        <text x={inputX + 8} y={LINE_Y - 2} className="fill-ink font-mono text-[10px]">
          {`rails ${fmt(input.negativeRail, 'V')} … ${fmt(input.positiveRail, 'V')}`}
        </text>
        <text x={inputX + 8} y={LINE_Y + 13} className="fill-ink font-mono text-[10px]">
          {`abs max ±${fmt(input.absMaxBeyondRail, 'V')}`}
        </text>
        <text x={inputX + 8} y={LINE_Y + 28} className="fill-ink font-mono text-[10px]">
          {input.absMaxCurrent !== undefined
            ? `I max ${fmt(input.absMaxCurrent, 'A')}`
            : 'I max not given'}
        </text>
        <text x={inputX + 8} y={LINE_Y + 43} className="fill-ink font-mono text-[10px]">
          {input.inputResistance !== undefined
            ? `R in ${fmt(input.inputResistance, 'Ω')}`
            : 'high impedance'}
        </text>
        {guard.stages.length === 0 ? (
          <text x={LEFT} y={LINE_Y + 40} className="fill-danger text-[11px]">
            no guard: the input sees the field directly
          </text>
        ) : null}
      </svg>
    </div>
  );
}
