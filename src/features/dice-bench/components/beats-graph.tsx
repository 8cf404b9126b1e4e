import { useId, useMemo, useState } from "react";
import type { DiceCycle, SetLevelAnalysis } from "@shared/probability/index";
import { fractionToString } from "@shared/probability/index";
import { DiePatternDef, paletteHex } from "@/components/dice/die-swatch";
import { modeLabel, probabilityText } from "@/lib/probability-text";
import type { BenchDie } from "../hooks/use-set-analysis";

const width = 560;
const centre = { x: width / 2, y: 215 };
const ring = 132;
const node = 30;
const cyclesListed = 24;
const labelSize = 19;

/** The cycle shown first: one through every die if there is one, then the longest, then the one with the strongest weakest link. */
export function preferredCycle(cycles: DiceCycle[]): number {
  let best = -1;
  cycles.forEach((cycle, index) => {
    if (best === -1) {
      best = index;
      return;
    }
    const current = cycles[best];
    if (cycle.indices.length !== current.indices.length) {
      if (cycle.indices.length > current.indices.length) best = index;
    } else if (cycle.weakestWin.gt(current.weakestWin)) best = index;
  });
  return best;
}

/** A cycle in words: "A → B → C → back to A". */
export function cycleWords(cycle: DiceCycle): string {
  return `${cycle.dice.join(" → ")} → back to ${cycle.dice[0]}`;
}

/**
 * The beats graph: the dice round a circle, an arrow from each winner to the die it beats, and one chosen cycle
 * drawn with thick dashed arrows and its winning chances, so it stands out without colour.
 */
export function BeatsGraph({ level, dice }: { level: SetLevelAnalysis; dice: BenchDie[] }) {
  const baseId = useId().replace(/:/g, "");
  const [chosen, setChosen] = useState<number | null>(null);
  const defaultCycle = useMemo(() => preferredCycle(level.cycles), [level.cycles]);
  const cycleIndex = chosen !== null && chosen < level.cycles.length ? chosen : defaultCycle;
  const cycle = cycleIndex >= 0 ? level.cycles[cycleIndex] : null;
  const mode = modeLabel(level.dicePerPlayer);

  const points = dice.map((_, index) => {
    const angle = -Math.PI / 2 + (2 * Math.PI * index) / dice.length;
    return { x: centre.x + ring * Math.cos(angle), y: centre.y + ring * Math.sin(angle), cos: Math.cos(angle), sin: Math.sin(angle) };
  });
  const inCycle = new Set(
    cycle ? cycle.indices.map((from, position) => `${from}>${cycle.indices[(position + 1) % cycle.indices.length]}`) : [],
  );
  const edges = level.beats.map((edge) => {
    const from = points[edge.winnerIndex];
    const to = points[edge.loserIndex];
    const length = Math.hypot(to.x - from.x, to.y - from.y);
    const ux = (to.x - from.x) / length;
    const uy = (to.y - from.y) / length;
    return {
      edge,
      highlighted: inCycle.has(`${edge.winnerIndex}>${edge.loserIndex}`),
      x1: from.x + ux * (node + 4),
      y1: from.y + uy * (node + 4),
      x2: to.x - ux * (node + 6),
      y2: to.y - uy * (node + 6),
      // Label off to the left of the arrow's middle, so labels of crossing arrows part.
      lx: (from.x + to.x) / 2 - uy * 16,
      ly: (from.y + to.y) / 2 + ux * 16,
    };
  });
  const labels = dice.map((die, index) => {
    const point = points[index];
    const anchor: "start" | "end" | "middle" = point.cos > 0.3 ? "start" : point.cos < -0.3 ? "end" : "middle";
    const labelRadius = ring + node + 12;
    const x = centre.x + labelRadius * point.cos;
    const y = centre.y + labelRadius * point.sin + (point.sin > 0.5 ? 16 : point.sin < -0.5 ? -4 : 6);
    // Width estimated from the character count (about 0.6 em per character in bold).
    const textWidth = die.name.length * labelSize * 0.6;
    const left = anchor === "start" ? x : anchor === "end" ? x - textWidth : x - textWidth / 2;
    return { x, y, anchor, left, right: left + textWidth };
  });
  // Fit the drawing to the dice and their names, so it scales as large as it can on a phone.
  const left = Math.min(...labels.map((label) => label.left), ...points.map((point) => point.x - node)) - 8;
  const right = Math.max(...labels.map((label) => label.right), ...points.map((point) => point.x + node)) + 8;
  const top = Math.min(...labels.map((label) => label.y - labelSize), ...points.map((point) => point.y - node)) - 8;
  const bottom = Math.max(...labels.map((label) => label.y + 6), ...points.map((point) => point.y + node)) + 8;
  const titleId = `${baseId}-title`;
  const descId = `${baseId}-desc`;

  return (
    <figure className="flex flex-col gap-3">
      <div className="rounded-xl border-2 border-line bg-white p-2">
        <svg
          viewBox={`${left} ${top} ${right - left} ${bottom - top}`}
          className="mx-auto h-auto w-full max-w-[36rem]"
          role="img"
          aria-labelledby={`${titleId} ${descId}`}
          data-testid={`beats-graph-${level.dicePerPlayer}`}
        >
          <title id={titleId}>Beats graph, {mode}</title>
          <desc id={descId}>
            {level.beats.map((edge) => `${edge.winner} beats ${edge.loser}, winning ${fractionToString(edge.win)}.`).join(" ")}
            {cycle ? ` Highlighted cycle: ${cycleWords(cycle)}.` : " There is no cycle."}
          </desc>
          <defs>
            {dice.map((die, index) => (
              <DiePatternDef key={die.name} id={`${baseId}-p${index}`} colour={die.colour} pattern={die.pattern} scale={12} />
            ))}
            <marker
              id={`${baseId}-arrow`}
              viewBox="0 0 10 10"
              refX="8"
              refY="5"
              markerWidth="12"
              markerHeight="12"
              markerUnits="userSpaceOnUse"
              orient="auto-start-reverse"
            >
              <path d="M0 0 L10 5 L0 10 Z" fill="#3b4f63" />
            </marker>
            <marker
              id={`${baseId}-arrow-cycle`}
              viewBox="0 0 10 10"
              refX="8"
              refY="5"
              markerWidth="20"
              markerHeight="20"
              markerUnits="userSpaceOnUse"
              orient="auto-start-reverse"
            >
              <path d="M0 0 L10 5 L0 10 Z" fill="#12263a" />
            </marker>
          </defs>
          {edges
            .filter((line) => !line.highlighted)
            .map((line) => (
              <line
                key={`${line.edge.winnerIndex}>${line.edge.loserIndex}`}
                x1={line.x1}
                y1={line.y1}
                x2={line.x2}
                y2={line.y2}
                stroke="#3b4f63"
                strokeWidth="1.75"
                strokeOpacity="0.75"
                markerEnd={`url(#${baseId}-arrow)`}
              />
            ))}
          {edges
            .filter((line) => line.highlighted)
            .map((line) => (
              <line
                key={`${line.edge.winnerIndex}>${line.edge.loserIndex}`}
                x1={line.x1}
                y1={line.y1}
                x2={line.x2}
                y2={line.y2}
                stroke="#12263a"
                strokeWidth="5"
                strokeDasharray="14 7"
                markerEnd={`url(#${baseId}-arrow-cycle)`}
                data-cycle-edge=""
              />
            ))}
          {edges
            .filter((line) => line.highlighted)
            .map((line) => {
              const text = fractionToString(line.edge.win);
              const boxWidth = text.length * 9.2 + 12;
              return (
                <g key={`label-${line.edge.winnerIndex}>${line.edge.loserIndex}`}>
                  <rect
                    x={line.lx - boxWidth / 2}
                    y={line.ly - 12}
                    width={boxWidth}
                    height={24}
                    rx="6"
                    fill="#fffdf9"
                    stroke="#12263a"
                    strokeWidth="1.5"
                  />
                  <text x={line.lx} y={line.ly + 5.5} textAnchor="middle" fontSize="16" fontWeight="700" fill="#12263a">
                    {text}
                  </text>
                </g>
              );
            })}
          {dice.map((die, index) => {
            const point = points[index];
            const label = labels[index];
            return (
              <g key={die.name}>
                <circle
                  cx={point.x}
                  cy={point.y}
                  r={node}
                  fill={`url(#${baseId}-p${index})`}
                  stroke={paletteHex(die.colour)}
                  strokeWidth="4"
                />
                <text x={label.x} y={label.y} textAnchor={label.anchor} fontSize={labelSize} fontWeight="700" fill="#12263a">
                  {die.name}
                </text>
              </g>
            );
          })}
        </svg>
      </div>
      <figcaption className="text-sm text-ink-soft">
        <ul className="flex flex-wrap gap-x-5 gap-y-1">
          <li className="flex items-center gap-1.5">
            <svg viewBox="0 0 40 10" className="h-3 w-10 shrink-0" aria-hidden="true">
              <line x1="0" y1="5" x2="40" y2="5" stroke="#12263a" strokeWidth="4" strokeDasharray="9 4" />
            </svg>
            thick dashed arrow: the highlighted cycle, with the winner&rsquo;s chance
          </li>
          <li className="flex items-center gap-1.5">
            <svg viewBox="0 0 40 10" className="h-3 w-10 shrink-0" aria-hidden="true">
              <line x1="0" y1="5" x2="40" y2="5" stroke="#3b4f63" strokeWidth="1.75" />
            </svg>
            thin arrow: from a die to the die it beats
          </li>
          <li>no arrow: the two dice are even</li>
        </ul>
      </figcaption>
      {level.cycles.length > 0 ? (
        <fieldset className="min-w-0">
          <legend className="font-bold">
            Highlight a cycle ({level.cycles.length} {level.cycles.length === 1 ? "cycle" : "cycles"}
            {level.cyclesComplete ? "" : ", list cut short"})
          </legend>
          <ul className="mt-1 flex flex-col gap-1">
            {level.cycles.slice(0, cyclesListed).map((each, index) => (
              <li key={each.indices.join("-")}>
                <label className="flex cursor-pointer items-start gap-2 rounded-lg px-1 py-1 hover:bg-sand">
                  <input
                    type="radio"
                    className="mt-1 h-4 w-4 accent-tide"
                    name={`${baseId}-cycle`}
                    checked={index === cycleIndex}
                    onChange={() => setChosen(index)}
                  />
                  <span>
                    {cycleWords(each)}{" "}
                    <span className="text-ink-soft">
                      · weakest link {probabilityText(each.weakestWin)}
                      {each.indices.length === dice.length ? " · through every die" : ""}
                    </span>
                  </span>
                </label>
              </li>
            ))}
          </ul>
          {level.cycles.length > cyclesListed && <p className="text-sm text-ink-soft">and {level.cycles.length - cyclesListed} more.</p>}
        </fieldset>
      ) : (
        <p className="text-ink-soft">No cycle with {mode}: the dice can be ranked from strongest to weakest.</p>
      )}
      <details className="rounded-lg border-2 border-line bg-shell px-3 py-2">
        <summary className="cursor-pointer font-bold">Every arrow in words</summary>
        <ul className="mt-2 list-disc pl-5">
          {level.beats.map((edge) => (
            <li key={`${edge.winnerIndex}>${edge.loserIndex}`}>
              {edge.winner} beats {edge.loser}: wins {probabilityText(edge.win)}
            </li>
          ))}
        </ul>
      </details>
    </figure>
  );
}
