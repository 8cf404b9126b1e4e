import { useId } from "react";
import type { Outcome, TreeDiagram } from "@shared/probability/index";
import { fractionToString } from "@shared/probability/index";
import { probabilityText } from "@/lib/probability-text";

/** Largest tree drawn; bigger ones are left to the two-way table. */
export const TREE_LEAVES_MAX = 144;

const rowHeight = 24;
const groupGap = 10;
const top = 34;
const x = { root: 12, branch: 106, leaf: 212, product: 240 };
const headingChars = 11;

function shortName(name: string) {
  return name.length > headingChars ? `${name.slice(0, headingChars - 1)}…` : name;
}

export const outcomeMarks: Record<Outcome, { symbol: string; word: string }> = {
  win: { symbol: "★", word: "win" },
  tie: { symbol: "=", word: "tie" },
  loss: { symbol: "✗", word: "loss" },
};

/** A two-stage tree diagram: the first die's values, then the second's, branches labelled with fractions, leaves with products. */
export function TreeDiagramFigure({ tree, first, second }: { tree: TreeDiagram; first: string; second: string }) {
  const titleId = useId();
  const leafCount = tree.branches.reduce((sum, branch) => sum + branch.leaves.length, 0);
  if (leafCount > TREE_LEAVES_MAX) {
    return (
      <p className="rounded-lg border-2 border-line bg-shell p-3">
        This tree would have {leafCount} leaves, too many to read. The two-way table below shows the same sample space; with one die each the
        tree is smaller.
      </p>
    );
  }
  let cursor = top;
  const groups = tree.branches.map((branch) => {
    const leaves = branch.leaves.map((leaf) => {
      const y = cursor + rowHeight / 2;
      cursor += rowHeight;
      return { leaf, y };
    });
    cursor += groupGap;
    return { branch, leaves, y: (leaves[0].y + leaves[leaves.length - 1].y) / 2 };
  });
  const height = cursor;
  const rootY = (groups[0].y + groups[groups.length - 1].y) / 2;
  const along = (x1: number, y1: number, x2: number, y2: number, at: number) => ({ x: x1 + (x2 - x1) * at, y: y1 + (y2 - y1) * at });

  return (
    <div className="relative max-h-[38rem] overflow-y-auto rounded-xl border-2 border-line bg-white p-2" tabIndex={0} role="region" aria-labelledby={titleId}>
      <svg viewBox={`0 0 360 ${height}`} className="mx-auto h-auto w-full max-w-[30rem]" role="img" aria-labelledby={titleId} data-testid="tree-diagram">
        <title id={titleId}>
          Tree diagram: {first} against {second}. {first} wins {fractionToString(tree.totals.win)}, ties {fractionToString(tree.totals.tie)}, loses{" "}
          {fractionToString(tree.totals.loss)}.
        </title>
        <text x={x.branch} y={18} textAnchor="middle" fontSize="12" fontWeight="700" fill="#3b4f63">
          {shortName(first)}
        </text>
        <text x={x.leaf} y={18} textAnchor="middle" fontSize="12" fontWeight="700" fill="#3b4f63">
          {shortName(second)}
        </text>
        <text x={x.product + 8} y={18} fontSize="12" fontWeight="700" fill="#3b4f63">
          P(path)
        </text>
        <circle cx={x.root} cy={rootY} r="5" fill="#12263a" />
        {groups.map(({ branch, leaves, y }) => {
          const label = along(x.root, rootY, x.branch - 14, y, 0.62);
          return (
            <g key={branch.value}>
              <line x1={x.root} y1={rootY} x2={x.branch - 14} y2={y} stroke="#3b4f63" strokeWidth="1.5" />
              <text x={label.x} y={label.y - 4} textAnchor="middle" fontSize="11" fill="#12263a" paintOrder="stroke" stroke="#ffffff" strokeWidth="3">
                {fractionToString(branch.probability)}
              </text>
              <rect x={x.branch - 14} y={y - 11} width="28" height="22" rx="5" fill="#d5f0ec" stroke="#0f6b63" strokeWidth="1.5" />
              <text x={x.branch} y={y + 5} textAnchor="middle" fontSize="13" fontWeight="700" fill="#12263a">
                {branch.value}
              </text>
              {leaves.map(({ leaf, y: leafY }) => {
                const leafLabel = along(x.branch + 14, y, x.leaf - 13, leafY, 0.72);
                const mark = outcomeMarks[leaf.outcome];
                const won = leaf.outcome === "win";
                return (
                  <g key={leaf.value} data-outcome={leaf.outcome}>
                    <title>
                      {first} {branch.value}, {second} {leaf.value}: {fractionToString(branch.probability)} × {fractionToString(leaf.branchProbability)} ={" "}
                      {fractionToString(leaf.probability)}, {mark.word} for {first}
                    </title>
                    <line x1={x.branch + 14} y1={y} x2={x.leaf - 13} y2={leafY} stroke="#3b4f63" strokeWidth="1" />
                    <text x={leafLabel.x} y={leafLabel.y - 3} textAnchor="middle" fontSize="10" fill="#3b4f63" paintOrder="stroke" stroke="#ffffff" strokeWidth="3">
                      {fractionToString(leaf.branchProbability)}
                    </text>
                    <rect
                      x={x.leaf - 13}
                      y={leafY - 10}
                      width="26"
                      height="20"
                      rx="4"
                      fill={won ? "#12263a" : "#ffffff"}
                      stroke="#12263a"
                      strokeWidth="1.25"
                    />
                    <text x={x.leaf} y={leafY + 4.5} textAnchor="middle" fontSize="12" fontWeight="700" fill={won ? "#ffffff" : "#12263a"}>
                      {leaf.value}
                    </text>
                    <text x={x.product} y={leafY + 4.5} fontSize="12" fill="#12263a" fontWeight={won ? 700 : 400}>
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
      <p className="px-2 pt-2 text-sm text-ink-soft">
        Each path multiplies its two branches (hover or focus a leaf for the sum). ★ win, = tie and ✗ loss are for {first}.
      </p>
      <ul className="px-2 pb-1 text-base" data-testid="tree-totals">
        <li>
          Add the ★ leaves: P({first} wins) = <strong>{probabilityText(tree.totals.win)}</strong>
        </li>
        <li>Add the = leaves: P(tie) = {probabilityText(tree.totals.tie)}</li>
        <li>
          Add the ✗ leaves: P({second} wins) = {probabilityText(tree.totals.loss)}
        </li>
      </ul>
    </div>
  );
}
