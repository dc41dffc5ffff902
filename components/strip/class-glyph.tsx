/** Circuit-class glyphs: the class is told by shape as well as colour, in the drawing, legend and table. */

export function ClassMark({ value }: { value: string }) {
  return (
    <svg aria-hidden viewBox="0 0 12 12" className="h-3 w-3 shrink-0">
      <ClassGlyph cls={value} x={6} y={6} size={10} />
    </svg>
  );
}

export function ClassGlyph({
  cls,
  x,
  y,
  size,
}: {
  cls: string;
  x: number;
  y: number;
  size: number;
}) {
  const r = size / 2;
  switch (cls) {
    case 'hazard': // a triangle pointing up: danger
      return (
        <path
          d={`M${x} ${y - r} L${x + r} ${y + r * 0.8} L${x - r} ${y + r * 0.8} Z`}
          className="fill-circuit-hazard"
        />
      );
    case 'sensitive': // a ring: a measuring input
      return (
        <circle
          cx={x}
          cy={y}
          r={r * 0.8}
          className="fill-none stroke-circuit-sensitive"
          strokeWidth={size / 4.5}
        />
      );
    case 'return': // a square outline
      return (
        <rect
          x={x - r * 0.7}
          y={y - r * 0.7}
          width={r * 1.4}
          height={r * 1.4}
          className="fill-none stroke-circuit-return"
          strokeWidth={size / 5}
        />
      );
    case 'earth': // three falling bars
      return (
        <g className="stroke-circuit-earth" strokeWidth={size / 7}>
          <line x1={x - r} x2={x + r} y1={y - r * 0.4} y2={y - r * 0.4} />
          <line x1={x - r * 0.6} x2={x + r * 0.6} y1={y + r * 0.15} y2={y + r * 0.15} />
          <line x1={x - r * 0.25} x2={x + r * 0.25} y1={y + r * 0.7} y2={y + r * 0.7} />
        </g>
      );
    case 'spare': // a dash
      return (
        <line
          x1={x - r * 0.8}
          x2={x + r * 0.8}
          y1={y}
          y2={y}
          className="stroke-circuit-spare"
          strokeWidth={size / 5}
        />
      );
    case 'barrier': // a solid bar
      return (
        <rect
          x={x - r * 0.3}
          y={y - r}
          width={r * 0.6}
          height={size}
          className="fill-circuit-barrier"
        />
      );
    default:
      return <circle cx={x} cy={y} r={r * 0.3} className="fill-muted" />;
  }
}
