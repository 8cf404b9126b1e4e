import Fraction from "fraction.js";
import { fractionToDecimal, fractionToString, type TreeDiagram } from "@shared/probability/index";

/** Above this many leaves the tree keeps its first stage only, each branch with its chance of a win. */
const LEAVES_DRAWN_MAX = 48;

const outcomeText = { win: "✓ win", tie: "= tie", loss: "✗ loss" } as const;
const outcomeColour = { win: "#0f6b63", tie: "#3b4f63", loss: "#b42318" } as const;

/**
 * A two-stage tree diagram for print, drawn from the engine's treeDiagram: the first die's values with their branch
 * probabilities, then the second die's, each path with its product probability and the first die's outcome in words.
 */
export function ReportTreeDiagram({ tree, first, second }: { tree: TreeDiagram; first: string; second: string }) {
  const leafCount = tree.branches.reduce((sum, branch) => sum + branch.leaves.length, 0);
  const full = leafCount <= LEAVES_DRAWN_MAX;
  const row = 15;
  const width = 660;
  const rootX = 14;
  const branchX = 170;
  const leafX = 370;
  const top = 34;
  const height = top + (full ? leafCount : tree.branches.length * 2) * row + 12;
  const win = tree.totals.win;
  let cursor = 0;
  const sumWord = tree.dicePerPlayer > 1 ? "total" : "face";

  return (
    <figure className="break-inside-avoid">
      <div className="overflow-x-auto">
      <svg viewBox={`0 0 ${width} ${height}`} className="h-auto w-full min-w-[540px] max-w-[660px]" role="img" aria-label={`Tree diagram of ${first} against ${second}: P(${first} wins) = ${fractionToString(win)}.`}>
        <text x={branchX - 24} y={16} fontSize="12" fontWeight="bold" fill="#12263a">
          {first}&rsquo;s {sumWord}
        </text>
        {full ? (
          <>
            <text x={leafX - 8} y={16} fontSize="12" fontWeight="bold" fill="#12263a">
              {second}&rsquo;s {sumWord}
            </text>
            <text x={leafX + 96} y={16} fontSize="12" fontWeight="bold" fill="#12263a">
              path
            </text>
            <text x={leafX + 160} y={16} fontSize="12" fontWeight="bold" fill="#12263a">
              for {first}
            </text>
          </>
        ) : null}
        {tree.branches.map((branch) => {
          const rows = full ? branch.leaves.length : 2;
          const start = cursor;
          cursor += rows;
          const branchY = top + (start + rows / 2) * row - row / 2;
          const rootY = top + ((full ? leafCount : tree.branches.length * 2) / 2) * row - row / 2;
          const branchWin = branch.leaves.filter((leaf) => leaf.outcome === "win").reduce((sum, leaf) => sum.add(leaf.branchProbability), new Fraction(0));
          return (
            <g key={branch.value}>
              <line x1={rootX + 6} y1={rootY} x2={branchX} y2={branchY} stroke="#3b4f63" strokeWidth="1" />
              <text x={(rootX + branchX) / 2 + 10} y={(rootY + branchY) / 2 - 2} fontSize="10" fill="#3b4f63">
                {fractionToString(branch.probability)}
              </text>
              <circle cx={branchX} cy={branchY} r="3" fill="#12263a" />
              <text x={branchX + 6} y={branchY + 4} fontSize="12" fontWeight="bold" fill="#12263a">
                {branch.value}
              </text>
              {full ? (
                branch.leaves.map((leaf, index) => {
                  const leafY = top + (start + index) * row;
                  return (
                    <g key={leaf.value}>
                      <line x1={branchX + 26} y1={branchY} x2={leafX} y2={leafY - 4} stroke="#d8cfc0" strokeWidth="1" />
                      <text x={leafX + 4} y={leafY} fontSize="11" fill="#12263a">
                        {leaf.value}
                      </text>
                      <text x={leafX + 34} y={leafY} fontSize="10" fill="#3b4f63">
                        {fractionToString(leaf.branchProbability)}
                      </text>
                      <text x={leafX + 96} y={leafY} fontSize="11" fill="#12263a">
                        {fractionToString(leaf.probability)}
                      </text>
                      <text x={leafX + 160} y={leafY} fontSize="11" fontWeight="bold" fill={outcomeColour[leaf.outcome]}>
                        {outcomeText[leaf.outcome]}
                      </text>
                    </g>
                  );
                })
              ) : (
                <text x={leafX + 4} y={branchY + 4} fontSize="11" fill="#12263a">
                  P({first} wins | {branch.value}) = {fractionToString(branchWin)}
                </text>
              )}
            </g>
          );
        })}
        <circle cx={rootX + 4} cy={top + ((full ? leafCount : tree.branches.length * 2) / 2) * row - row / 2} r="4" fill="#0f6b63" />
      </svg>
      </div>
      <figcaption className="mt-1 text-sm">
        Multiply along each path; add the paths that end in a win: P({first} wins) = <strong>{fractionToString(win)}</strong> ({fractionToDecimal(win, 3)}), P(tie) ={" "}
        {fractionToString(tree.totals.tie)}, P({second} wins) = {fractionToString(tree.totals.loss)}.
        {!full && ` With ${leafCount} paths, only the first stage is drawn; each branch shows ${first}'s chance of winning from it.`}
      </figcaption>
    </figure>
  );
}
