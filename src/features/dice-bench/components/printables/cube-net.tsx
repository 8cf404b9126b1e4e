import { useId } from "react";
import type { SetDie } from "@shared/schemas/dice-sets";
import { DiePatternDef } from "@/components/dice/die-swatch";

/** Edge of one cube face, in millimetres. */
const side = 26;
/** Depth of a glue tab, in millimetres. */
const tab = 6;

type Point = [number, number];

/** The cross-shaped net: top, left, front, right, bottom, back, as (column, row) cells of a 3 × 4 grid. */
const cells: Point[] = [
  [1, 0],
  [0, 1],
  [1, 1],
  [2, 1],
  [1, 2],
  [1, 3],
];

/** Outer edges that carry a glue tab (one of each pair that meets when folded), with the tab's outward direction. */
const tabbedEdges: { from: Point; to: Point; out: Point }[] = [
  { from: [1, 0], to: [2, 0], out: [0, -1] },
  { from: [1, 0], to: [1, 1], out: [-1, 0] },
  { from: [2, 0], to: [2, 1], out: [1, 0] },
  { from: [0, 2], to: [1, 2], out: [0, 1] },
  { from: [2, 2], to: [3, 2], out: [0, 1] },
  { from: [1, 3], to: [1, 4], out: [-1, 0] },
  { from: [2, 3], to: [2, 4], out: [1, 0] },
];

/** Outer edges cut straight, with no tab. */
const plainEdges: [Point, Point][] = [
  [
    [0, 1],
    [1, 1],
  ],
  [
    [0, 1],
    [0, 2],
  ],
  [
    [2, 1],
    [3, 1],
  ],
  [
    [3, 1],
    [3, 2],
  ],
  [
    [1, 2],
    [1, 3],
  ],
  [
    [2, 2],
    [2, 3],
  ],
  [
    [1, 4],
    [2, 4],
  ],
];

const mm = ([column, row]: Point): Point => [column * side, row * side];

/** Value size by digit count, so 999 still fits a face. */
export function faceFontSize(value: number, faceSize: number) {
  const digits = String(value).length;
  return faceSize * (digits <= 1 ? 0.52 : digits === 2 ? 0.44 : digits === 3 ? 0.33 : 0.26);
}

/** One printed face: the value large (6 and 9 underlined so they read the right way up), the die's name, and its pattern band. */
export function PrintedFace({
  x,
  y,
  size,
  value,
  die,
  patternId,
}: {
  x: number;
  y: number;
  size: number;
  value: number;
  die: SetDie;
  patternId: string;
}) {
  const fontSize = faceFontSize(value, size);
  const band = size * 0.15;
  const underline = value === 6 || value === 9;
  return (
    <g>
      <text x={x + size / 2} y={y + size * 0.15} textAnchor="middle" fontSize={size * 0.1} fill="#12263a">
        {die.name.length > 18 ? `${die.name.slice(0, 17)}…` : die.name}
      </text>
      <text x={x + size / 2} y={y + size * 0.47 + fontSize * 0.36} textAnchor="middle" fontSize={fontSize} fontWeight="700" fill="#12263a">
        {value}
      </text>
      {underline && (
        <line
          x1={x + size * 0.38}
          x2={x + size * 0.62}
          y1={y + size * 0.73}
          y2={y + size * 0.73}
          stroke="#12263a"
          strokeWidth={size * 0.03}
        />
      )}
      <rect
        x={x + size * 0.06}
        y={y + size - band - size * 0.06}
        width={size * 0.88}
        height={band}
        fill={`url(#${patternId})`}
        stroke="#12263a"
        strokeWidth="0.2"
      />
    </g>
  );
}

/** A cut-and-fold net for a six-faced die, drawn to size in millimetres: solid lines are cut, dashed lines folded, grey tabs glued. */
export function CubeNet({ die }: { die: SetDie }) {
  const patternId = `net-${useId().replace(/:/g, "")}`;
  const width = 3 * side;
  const height = 4 * side;
  return (
    <svg
      width={`${width + 2}mm`}
      height={`${height + tab + 2}mm`}
      viewBox={`-1 ${-tab - 1} ${width + 2} ${height + tab + 2}`}
      className="h-auto max-w-full"
      role="img"
      aria-label={`Net of ${die.name}: faces ${die.faces.join(", ")}`}
      data-testid="cube-net"
    >
      <defs>
        <DiePatternDef id={patternId} colour={die.colour} pattern={die.pattern} scale={3} />
      </defs>
      {tabbedEdges.map(({ from, to, out }, index) => {
        const [x1, y1] = mm(from);
        const [x2, y2] = mm(to);
        const along: Point = [(x2 - x1) / side, (y2 - y1) / side];
        const inset = 4;
        const a: Point = [x1 + out[0] * tab + along[0] * inset, y1 + out[1] * tab + along[1] * inset];
        const b: Point = [x2 + out[0] * tab - along[0] * inset, y2 + out[1] * tab - along[1] * inset];
        return (
          <path
            key={index}
            d={`M${x1} ${y1} L${a[0]} ${a[1]} L${b[0]} ${b[1]} L${x2} ${y2}`}
            fill="#e5e7eb"
            stroke="#12263a"
            strokeWidth="0.35"
          />
        );
      })}
      {cells.map((cell, index) => {
        const [x, y] = mm(cell);
        return (
          <rect
            key={index}
            x={x}
            y={y}
            width={side}
            height={side}
            fill="#ffffff"
            stroke="#12263a"
            strokeWidth="0.3"
            strokeDasharray="1.5 1"
          />
        );
      })}
      {plainEdges.map(([from, to], index) => {
        const [x1, y1] = mm(from);
        const [x2, y2] = mm(to);
        return <line key={index} x1={x1} y1={y1} x2={x2} y2={y2} stroke="#12263a" strokeWidth="0.45" strokeLinecap="square" />;
      })}
      {cells.map((cell, index) => {
        const [x, y] = mm(cell);
        return <PrintedFace key={index} x={x} y={y} size={side} value={die.faces[index]} die={die} patternId={patternId} />;
      })}
    </svg>
  );
}
