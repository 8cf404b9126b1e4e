import Fraction from "fraction.js";
import { useId, useMemo, type ReactNode } from "react";
import {
  fractionToString,
  type GroupedTree,
  type Outcome,
  sumCountDistribution,
  type TreeDiagram,
  treeDiagram,
} from "@shared/probability/index";
import { probabilityText } from "@/lib/probability-text";
import { useGroupedTree } from "@/lib/use-grouped-tree";

/** Where the tree is shown: the Dice bench on screen, the Wall view on a projector (light on dark), or a printed page. */
export type TreeLook = "screen" | "projector" | "print";

export const outcomeMarks: Record<Outcome, { symbol: string; word: string }> = {
  win: { symbol: "★", word: "win" },
  tie: { symbol: "=", word: "tie" },
  loss: { symbol: "✗", word: "loss" },
};

type Look = {
  /** Above this many leaves only the first stage is drawn, each branch with the first die's chance of winning from it. */
  leavesMax: number;
  /** Drawing units: one leaf row, the gap between branches, the columns, the width, and a font scale. */
  row: number;
  gap: number;
  x: { root: number; branch: number; leaf: number; product: number };
  width: number;
  font: number;
  colours: {
    ink: string;
    soft: string;
    halo: string;
    valueFill: string;
    valueStroke: string;
    leafFill: string;
    winFill: string;
    winInk: string;
  };
  classes: { frame: string; svg: string; note: string; totals: string };
};

const looks: Record<TreeLook, Look> = {
  screen: {
    leavesMax: 144,
    row: 24,
    gap: 10,
    x: { root: 12, branch: 106, leaf: 212, product: 240 },
    width: 360,
    font: 1,
    colours: {
      ink: "#12263a",
      soft: "#3b4f63",
      halo: "#ffffff",
      valueFill: "#d5f0ec",
      valueStroke: "#0f6b63",
      leafFill: "#ffffff",
      winFill: "#12263a",
      winInk: "#ffffff",
    },
    classes: {
      frame: "relative max-h-[38rem] overflow-y-auto rounded-xl border-2 border-line bg-white p-2",
      svg: "mx-auto h-auto w-full max-w-[30rem]",
      note: "px-2 pt-2 text-sm text-ink-soft",
      totals: "px-2 pb-1 text-base",
    },
  },
  projector: {
    leavesMax: 36,
    row: 32,
    gap: 12,
    x: { root: 16, branch: 150, leaf: 300, product: 338 },
    width: 520,
    font: 1.35,
    colours: {
      ink: "#ffffff",
      soft: "#9fd8cf",
      halo: "#12263a",
      valueFill: "#0f4f4a",
      valueStroke: "#9fd8cf",
      leafFill: "#12263a",
      winFill: "#ffffff",
      winInk: "#12263a",
    },
    classes: { frame: "flex flex-col gap-2", svg: "mx-auto h-auto max-h-[52vh] w-full", note: "text-2xl", totals: "text-3xl" },
  },
  print: {
    leavesMax: 48,
    row: 20,
    gap: 6,
    x: { root: 12, branch: 106, leaf: 212, product: 240 },
    width: 360,
    font: 0.9,
    colours: {
      ink: "#12263a",
      soft: "#3b4f63",
      halo: "#ffffff",
      valueFill: "#ffffff",
      valueStroke: "#12263a",
      leafFill: "#ffffff",
      winFill: "#12263a",
      winInk: "#ffffff",
    },
    classes: { frame: "break-inside-avoid", svg: "mx-auto h-auto w-full max-w-[34rem]", note: "mt-1 text-sm", totals: "text-sm" },
  },
};

const headingChars = 11;
const shortName = (name: string) => (name.length > headingChars ? `${name.slice(0, headingChars - 1)}…` : name);
const along = (x1: number, y1: number, x2: number, y2: number, at: number) => ({ x: x1 + (x2 - x1) * at, y: y1 + (y2 - y1) * at });

/** The first die's chance of winning once its branch is taken: the sum of that branch's winning leaves' second-stage chances. */
function branchWinChance(branch: TreeDiagram["branches"][number]): Fraction {
  return branch.leaves.filter((leaf) => leaf.outcome === "win").reduce((sum, leaf) => sum.add(leaf.branchProbability), new Fraction(0));
}

/**
 * A two-stage tree diagram from the engine's treeDiagram: the first die's values (sums with two dice each) with their
 * branch probabilities, then the second's, each leaf with its product probability and outcome (★ win, = tie, ✗ loss,
 * winning leaves filled), and the totals per outcome. Too many leaves for the look, and only the first stage is drawn.
 */
/** A leaf's value in its box, filled dark when the first die wins there: the same in the full and the grouped tree. */
function LeafBox({
  x,
  y,
  halfWidth,
  fontSize,
  font,
  won,
  colours,
  children,
}: {
  x: number;
  y: number;
  halfWidth: number;
  fontSize: number;
  font: number;
  won: boolean;
  colours: Look["colours"];
  children: ReactNode;
}) {
  return (
    <>
      <rect
        x={x - halfWidth}
        y={y - 10 * font}
        width={halfWidth * 2}
        height={20 * font}
        rx="4"
        fill={won ? colours.winFill : colours.leafFill}
        stroke={colours.ink}
        strokeWidth="1.25"
      />
      <text x={x} y={y + 4.5 * font} textAnchor="middle" fontSize={fontSize} fontWeight="700" fill={won ? colours.winInk : colours.ink}>
        {children}
      </text>
    </>
  );
}

export function TreeDiagramFigure({
  tree,
  first,
  second,
  look = "screen",
}: {
  tree: TreeDiagram;
  first: string;
  second: string;
  look?: TreeLook;
}) {
  const titleId = useId();
  const style = looks[look];
  const { row, gap, x, colours, font } = style;
  const top = 34 * font;
  const leafCount = tree.branches.reduce((sum, branch) => sum + branch.leaves.length, 0);
  const full = leafCount <= style.leavesMax;

  let cursor = top;
  const groups = tree.branches.map((branch) => {
    const leaves = (full ? branch.leaves : []).map((leaf) => {
      const y = cursor + row / 2;
      cursor += row;
      return { leaf, y };
    });
    if (!full) cursor += row;
    cursor += gap;
    const y = full ? (leaves[0].y + leaves[leaves.length - 1].y) / 2 : cursor - gap - row / 2;
    return { branch, leaves, y };
  });
  const height = cursor;
  const rootY = (groups[0].y + groups[groups.length - 1].y) / 2;
  const size = (units: number) => units * font;
  const haloText = { paintOrder: "stroke" as const, stroke: colours.halo, strokeWidth: 3 };

  return (
    <figure
      className={style.classes.frame}
      tabIndex={look === "screen" ? 0 : undefined}
      role={look === "screen" ? "region" : undefined}
      aria-labelledby={look === "screen" ? titleId : undefined}
    >
      <svg
        viewBox={`0 0 ${style.width} ${height}`}
        className={style.classes.svg}
        role="img"
        aria-labelledby={titleId}
        data-testid="tree-diagram"
      >
        <title id={titleId}>
          Tree diagram of {first} against {second}: {first} wins {fractionToString(tree.totals.win)}, ties{" "}
          {fractionToString(tree.totals.tie)}, loses {fractionToString(tree.totals.loss)}.
        </title>
        <text x={x.branch} y={size(18)} textAnchor="middle" fontSize={size(12)} fontWeight="700" fill={colours.soft}>
          {shortName(first)}
        </text>
        <text
          x={full ? x.leaf : x.product}
          y={size(18)}
          textAnchor={full ? "middle" : "start"}
          fontSize={size(12)}
          fontWeight="700"
          fill={colours.soft}
        >
          {full ? shortName(second) : `P(${shortName(first)} wins | value)`}
        </text>
        {full && (
          <text x={x.product + 8} y={size(18)} fontSize={size(12)} fontWeight="700" fill={colours.soft}>
            P(path)
          </text>
        )}
        <circle cx={x.root} cy={rootY} r={size(5)} fill={colours.ink} />
        {groups.map(({ branch, leaves, y }) => {
          const label = along(x.root, rootY, x.branch - size(14), y, 0.62);
          return (
            <g key={branch.value}>
              <line x1={x.root} y1={rootY} x2={x.branch - size(14)} y2={y} stroke={colours.soft} strokeWidth="1.5" />
              <text x={label.x} y={label.y - 4} textAnchor="middle" fontSize={size(11)} fill={colours.ink} {...haloText}>
                {fractionToString(branch.probability)}
              </text>
              <rect
                x={x.branch - size(14)}
                y={y - size(11)}
                width={size(28)}
                height={size(22)}
                rx="5"
                fill={colours.valueFill}
                stroke={colours.valueStroke}
                strokeWidth="1.5"
              />
              <text x={x.branch} y={y + size(5)} textAnchor="middle" fontSize={size(13)} fontWeight="700" fill={colours.ink}>
                {branch.value}
              </text>
              {!full && (
                <text x={x.product} y={y + size(4.5)} fontSize={size(12)} fill={colours.ink}>
                  {fractionToString(branchWinChance(branch))}
                </text>
              )}
              {leaves.map(({ leaf, y: leafY }) => {
                const leafLabel = along(x.branch + size(14), y, x.leaf - size(13), leafY, 0.72);
                const mark = outcomeMarks[leaf.outcome];
                const won = leaf.outcome === "win";
                return (
                  <g key={leaf.value} data-outcome={leaf.outcome}>
                    <title>
                      {first} {branch.value}, {second} {leaf.value}: {fractionToString(branch.probability)} ×{" "}
                      {fractionToString(leaf.branchProbability)} = {fractionToString(leaf.probability)}, {mark.word} for {first}
                    </title>
                    <line x1={x.branch + size(14)} y1={y} x2={x.leaf - size(13)} y2={leafY} stroke={colours.soft} strokeWidth="1" />
                    <text x={leafLabel.x} y={leafLabel.y - 3} textAnchor="middle" fontSize={size(10)} fill={colours.soft} {...haloText}>
                      {fractionToString(leaf.branchProbability)}
                    </text>
                    <LeafBox x={x.leaf} y={leafY} halfWidth={size(13)} fontSize={size(12)} font={font} won={won} colours={colours}>
                      {leaf.value}
                    </LeafBox>
                    <text x={x.product} y={leafY + size(4.5)} fontSize={size(12)} fill={colours.ink} fontWeight={won ? 700 : 400}>
                      {fractionToString(leaf.probability)}
                      <tspan dx="8">
                        {mark.symbol} {mark.word}
                      </tspan>
                    </text>
                  </g>
                );
              })}
            </g>
          );
        })}
      </svg>
      <figcaption className={style.classes.note}>
        {full
          ? `Each path multiplies its two branches${look === "screen" ? " (hover or focus a leaf for the sum)" : ""}. ★ win, = tie and ✗ loss are for ${first}.`
          : `With ${leafCount} paths only the first stage is drawn: beside each value of ${first}, its chance of winning from there.`}
      </figcaption>
      <ul className={style.classes.totals} data-testid="tree-totals">
        <li>
          {full ? "Add the ★ leaves: " : ""}P({first} wins) = <strong>{probabilityText(tree.totals.win)}</strong>
        </li>
        <li>
          {full ? "Add the = leaves: " : ""}P(tie) = {probabilityText(tree.totals.tie)}
        </li>
        <li>
          {full ? "Add the ✗ leaves: " : ""}P({second} wins) = {probabilityText(tree.totals.loss)}
        </li>
      </ul>
    </figure>
  );
}

/** How a grouped tree is laid out: the first die's values (in bands) then outcomes, or outcomes then the bands that reach them. */
export type TreeGrouping = "total" | "outcome";

const outcomeOrder: Outcome[] = ["win", "tie", "loss"];

const bandText = (band: GroupedTree["bands"][number]) => (band.from === band.to ? String(band.from) : `${band.from}–${band.to}`);

/**
 * A tree diagram too large to draw path by path (engine's groupedTreeDiagram), drawn grouped: by the first die's total (its
 * values in bands, each band's paths added up by outcome) or by outcome (each outcome's paths added up by band of the first
 * die's total). Every number is an exact sum of the paths it stands for.
 */
export function GroupedTreeFigure({
  tree,
  first,
  second,
  grouping = "total",
  look = "screen",
}: {
  tree: GroupedTree;
  first: string;
  second: string;
  grouping?: TreeGrouping;
  look?: TreeLook;
}) {
  const titleId = useId();
  const style = looks[look];
  const { row, gap, colours, font } = style;
  const size = (units: number) => units * font;
  const x = { root: 12, middle: 118, leaf: 262, product: 316 };
  const width = 470;
  const top = 34 * font;
  const haloText = { paintOrder: "stroke" as const, stroke: colours.halo, strokeWidth: 3 };
  const secondTotal = tree.total / tree.firstTotal;
  const paths = tree.firstValues * tree.secondValues;
  const whole = (count: bigint) => new Fraction(count, tree.total);
  const middles =
    grouping === "total"
      ? tree.bands.map((band) => ({
          key: `${band.from}`,
          label: bandText(band),
          chance: new Fraction(band.ways, tree.firstTotal),
          leaves: outcomeOrder
            .filter((outcome) => band.outcomes[outcome] > 0n)
            .map((outcome) => ({
              key: outcome,
              label: outcomeMarks[outcome].symbol,
              outcome,
              chance: new Fraction(band.outcomes[outcome], band.ways * secondTotal),
              path: whole(band.outcomes[outcome]),
            })),
        }))
      : outcomeOrder
          .filter((outcome) => tree.totals[outcome] > 0n)
          .map((outcome) => ({
            key: outcome,
            label: `${outcomeMarks[outcome].symbol} ${outcomeMarks[outcome].word}`,
            chance: whole(tree.totals[outcome]),
            leaves: tree.bands
              .filter((band) => band.outcomes[outcome] > 0n)
              .map((band) => ({
                key: `${band.from}`,
                label: bandText(band),
                outcome,
                chance: new Fraction(band.outcomes[outcome], tree.totals[outcome]),
                path: whole(band.outcomes[outcome]),
              })),
          }));
  let cursor = top;
  const groups = middles.map((middle) => {
    const leaves = middle.leaves.map((leaf) => {
      const y = cursor + row / 2;
      cursor += row;
      return { leaf, y };
    });
    cursor += gap;
    return { middle, leaves, y: (leaves[0].y + leaves[leaves.length - 1].y) / 2 };
  });
  const height = cursor;
  const rootY = (groups[0].y + groups[groups.length - 1].y) / 2;
  const half = size(34);
  return (
    <figure
      className={style.classes.frame}
      tabIndex={look === "screen" ? 0 : undefined}
      role={look === "screen" ? "region" : undefined}
      aria-labelledby={look === "screen" ? titleId : undefined}
    >
      <svg
        viewBox={`0 0 ${width} ${height}`}
        className={style.classes.svg}
        role="img"
        aria-labelledby={titleId}
        data-testid="grouped-tree-diagram"
      >
        <title id={titleId}>
          Tree diagram of {first} against {second}, grouped by {grouping === "total" ? `${first}'s total` : "outcome"}: {first} wins{" "}
          {fractionToString(whole(tree.totals.win))}, ties {fractionToString(whole(tree.totals.tie))}, loses{" "}
          {fractionToString(whole(tree.totals.loss))}.
        </title>
        <text x={x.middle} y={size(18)} textAnchor="middle" fontSize={size(12)} fontWeight="700" fill={colours.soft}>
          {grouping === "total" ? shortName(first) : "Outcome"}
        </text>
        <text x={x.leaf} y={size(18)} textAnchor="middle" fontSize={size(12)} fontWeight="700" fill={colours.soft}>
          {grouping === "total" ? "Outcome" : shortName(first)}
        </text>
        <text x={x.product + 8} y={size(18)} fontSize={size(12)} fontWeight="700" fill={colours.soft}>
          P(paths)
        </text>
        <circle cx={x.root} cy={rootY} r={size(5)} fill={colours.ink} />
        {groups.map(({ middle, leaves, y }) => {
          const label = along(x.root, rootY, x.middle - half, y, 0.8);
          return (
            <g key={middle.key}>
              <line x1={x.root} y1={rootY} x2={x.middle - half} y2={y} stroke={colours.soft} strokeWidth="1.5" />
              <text x={label.x} y={label.y - 4} textAnchor="middle" fontSize={size(11)} fill={colours.ink} {...haloText}>
                {fractionToString(middle.chance)}
              </text>
              <rect
                x={x.middle - half}
                y={y - size(11)}
                width={half * 2}
                height={size(22)}
                rx="5"
                fill={colours.valueFill}
                stroke={colours.valueStroke}
                strokeWidth="1.5"
              />
              <text x={x.middle} y={y + size(5)} textAnchor="middle" fontSize={size(12)} fontWeight="700" fill={colours.ink}>
                {middle.label}
              </text>
              {leaves.map(({ leaf, y: leafY }) => {
                const won = leaf.outcome === "win";
                return (
                  <g key={leaf.key} data-outcome={leaf.outcome}>
                    <line x1={x.middle + half} y1={y} x2={x.leaf - half} y2={leafY} stroke={colours.soft} strokeWidth="1" />
                    <title>
                      {middle.label}, {leaf.label}: {fractionToString(middle.chance)} × {fractionToString(leaf.chance)} ={" "}
                      {fractionToString(leaf.path)}
                    </title>
                    <LeafBox x={x.leaf} y={leafY} halfWidth={half} fontSize={size(11)} font={font} won={won} colours={colours}>
                      {leaf.label}
                    </LeafBox>
                    <text x={x.product} y={leafY + size(4.5)} fontSize={size(12)} fill={colours.ink} fontWeight={won ? 700 : 400}>
                      {fractionToString(leaf.path)}
                      {grouping === "total" && <tspan dx="8">{outcomeMarks[leaf.outcome].word}</tspan>}
                    </text>
                  </g>
                );
              })}
            </g>
          );
        })}
      </svg>
      <figcaption className={style.classes.note}>
        {`The full tree has ${paths.toLocaleString("en-GB")} paths, so they are drawn grouped: ${
          grouping === "total"
            ? `${first}'s totals in ${tree.bands.length} bands, each band's paths added up by outcome for ${first}`
            : `by outcome for ${first}, each outcome's paths added up by band of ${first}'s total`
        }. Each P(paths) is the exact sum of the paths it stands for${look === "screen" ? " (hover or focus a leaf for its branch chances)" : ""}.`}
      </figcaption>
      <ul className={style.classes.totals} data-testid="tree-totals">
        <li>
          P({first} wins) = <strong>{probabilityText(whole(tree.totals.win))}</strong>
        </li>
        <li>P(tie) = {probabilityText(whole(tree.totals.tie))}</li>
        <li>
          P({second} wins) = {probabilityText(whole(tree.totals.loss))}
        </li>
      </ul>
    </figure>
  );
}

/** Above this many paths the tree is worked out in a worker and drawn grouped. */
export const TREE_PATHS_IN_PAGE_MAX = 2500;

/**
 * The tree diagram of a matchup, whatever the dice: a small tree is worked out on the page and drawn path by path (or, above the
 * look's limit, by its first stage); a large one is worked out in a Web Worker and drawn grouped, so the page stays responsive.
 */
export function MatchupTree({
  first,
  second,
  dicePerPlayer,
  look = "screen",
  grouping = "total",
}: {
  first: { name: string; faces: number[] };
  second: { name: string; faces: number[] };
  dicePerPlayer: number;
  look?: TreeLook;
  grouping?: TreeGrouping;
}) {
  const paths = useMemo(
    () => sumCountDistribution(first.faces, dicePerPlayer).values.length * sumCountDistribution(second.faces, dicePerPlayer).values.length,
    [first.faces, second.faces, dicePerPlayer],
  );
  const large = paths > TREE_PATHS_IN_PAGE_MAX;
  const small = useMemo(
    () => (large ? null : treeDiagram(first.faces, second.faces, { dicePerPlayer })),
    [large, first.faces, second.faces, dicePerPlayer],
  );
  const grouped = useGroupedTree(large ? { first: first.faces, second: second.faces, dicePerPlayer } : null);
  if (small) return <TreeDiagramFigure tree={small} first={first.name} second={second.name} look={look} />;
  if (grouped.error) return <p role="alert">The tree diagram could not be worked out: {grouped.error}</p>;
  if (!grouped.tree) {
    return (
      <p role="status" className={looks[look].classes.note} data-testid="tree-working">
        Working out the {paths.toLocaleString("en-GB")} paths of the tree diagram…
      </p>
    );
  }
  return <GroupedTreeFigure tree={grouped.tree} first={first.name} second={second.name} grouping={grouping} look={look} />;
}
