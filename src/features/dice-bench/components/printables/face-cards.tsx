import { useId } from "react";
import type { SetDie } from "@shared/schemas/dice-sets";
import { DiePatternDef } from "@/components/dice/die-swatch";
import { PrintedFace } from "./cube-net";

/** Edge of one face card, in millimetres. */
const card = 24;
const perRow = 7;

/** A die of any face count as square face cards to cut out (to draw from a bag or stick on a spinner), drawn to size in millimetres. */
export function FaceCards({ die }: { die: SetDie }) {
  const patternId = `cards-${useId().replace(/:/g, "")}`;
  const columns = Math.min(perRow, die.faces.length);
  const rows = Math.ceil(die.faces.length / perRow);
  const width = columns * card;
  const height = rows * card;
  return (
    <svg
      width={`${width + 1}mm`}
      height={`${height + 1}mm`}
      viewBox={`-0.5 -0.5 ${width + 1} ${height + 1}`}
      className="h-auto max-w-full"
      role="img"
      aria-label={`Face cards of ${die.name}: ${die.faces.join(", ")}`}
      data-testid="face-cards"
    >
      <defs>
        <DiePatternDef id={patternId} colour={die.colour} pattern={die.pattern} scale={3} />
      </defs>
      {die.faces.map((value, index) => {
        const x = (index % perRow) * card;
        const y = Math.floor(index / perRow) * card;
        return (
          <g key={index}>
            <rect x={x} y={y} width={card} height={card} fill="#ffffff" stroke="#12263a" strokeWidth="0.4" />
            <PrintedFace x={x} y={y} size={card} value={value} die={die} patternId={patternId} />
          </g>
        );
      })}
    </svg>
  );
}
