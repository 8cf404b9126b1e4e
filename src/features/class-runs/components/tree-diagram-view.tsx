import Fraction from "fraction.js";
import { fractionToString, treeDiagram, type TreeDiagram } from "@shared/probability/index";

const outcomeMark = { win: "W", tie: "T", loss: "L" } as const;
const outcomeWord = { win: "wins", tie: "ties", loss: "loses" } as const;
const LEAVES_DRAWN_MAX = 36;

/** A tree too big to draw: one line per first-stage branch with its chance of winning. */
function BranchSummary({ tree, first, second }: { tree: TreeDiagram; first: string; second: string }) {
  return (
    <table className="w-full text-left text-2xl">
      <caption className="mb-2 text-left text-xl">Too many branches to draw: each value of {first} with its chance, then the chance {first} wins from it.</caption>
      <thead>
        <tr className="border-b-2 border-white/40">
          <th scope="col" className="py-1">{first} shows</th>
          <th scope="col" className="py-1">Chance</th>
          <th scope="col" className="py-1">{first} wins against {second}</th>
        </tr>
      </thead>
      <tbody>
        {tree.branches.map((branch) => {
          const win = branch.leaves.filter((leaf) => leaf.outcome === "win").reduce((sum, leaf) => sum.add(leaf.branchProbability), new Fraction(0));
          return (
            <tr key={branch.value} className="border-b border-white/20">
              <td className="py-1 font-bold">{branch.value}</td>
              <td className="py-1">{fractionToString(branch.probability)}</td>
              <td className="py-1">{fractionToString(win)}</td>
            </tr>
          );
        })}
      </tbody>
    </table>
  );
}

/**
 * The Prove phase's tree diagram from the engine: the first die's values (sums with two dice each), then the second's,
 * each leaf with its product probability and outcome marked by a letter (W, T, L), then the totals per outcome.
 */
export function TreeDiagramView({ dice, matchup, dicePerPlayer }: { dice: { name: string; faces: number[] }[]; matchup: number[]; dicePerPlayer: number }) {
  const [a, b] = matchup;
  const first = dice[a];
  const second = dice[b];
  const tree = treeDiagram(first.faces, second.faces, { dicePerPlayer });
  const leafCount = tree.branches.reduce((sum, branch) => sum + branch.leaves.length, 0);
  const totals = (
    <p className="text-3xl" data-testid="tree-totals">
      {first.name} wins {fractionToString(tree.totals.win)}, ties {fractionToString(tree.totals.tie)}, loses {fractionToString(tree.totals.loss)}
    </p>
  );
  if (leafCount > LEAVES_DRAWN_MAX) {
    return (
      <div className="flex flex-col gap-4">
        <BranchSummary tree={tree} first={first.name} second={second.name} />
        {totals}
      </div>
    );
  }
  const row = 30;
  const height = Math.max(leafCount * row + 20, 200);
  const x = { root: 40, branch: 330, leaf: 700 };
  let leafIndex = 0;
  const branches = tree.branches.map((branch) => {
    const leaves = branch.leaves.map((leaf) => ({ leaf, y: 20 + row * leafIndex++ + row / 2 }));
    const y = (leaves[0].y + leaves[leaves.length - 1].y) / 2;
    return { branch, leaves, y };
  });
  const rootY = height / 2;
  return (
    <figure className="flex flex-col gap-3">
      <svg viewBox={`0 0 1200 ${height}`} className="max-h-[66vh] w-full" role="img" aria-label={`Tree diagram of ${first.name} against ${second.name}`}>
        <text x={x.root - 20} y={rootY + 8} fill="#ffffff" fontSize="24" fontWeight="700">●</text>
        {branches.map(({ branch, leaves, y }) => (
          <g key={branch.value}>
            <line x1={x.root} y1={rootY} x2={x.branch - 10} y2={y} stroke="#9fd8cf" strokeWidth="2" />
            <text x={(x.root + x.branch) / 2 - 30} y={(rootY + y) / 2 - 6} fill="#f6efe3" fontSize="20">{fractionToString(branch.probability)}</text>
            <text x={x.branch} y={y + 8} fill="#ffffff" fontSize="24" fontWeight="700">{first.name} {branch.value}</text>
            {leaves.map(({ leaf, y: leafY }) => (
              <g key={leaf.value}>
                <line x1={x.branch + 150} y1={y} x2={x.leaf - 10} y2={leafY} stroke="#9fd8cf" strokeWidth="1.5" />
                <text x={x.leaf} y={leafY + 7} fill="#ffffff" fontSize="20">
                  <tspan fill="#f6efe3">({fractionToString(leaf.branchProbability)})</tspan> {second.name} {leaf.value} →{" "}
                  <tspan fontWeight={leaf.outcome === "win" ? 700 : 400}>{outcomeMark[leaf.outcome]}</tspan> · {fractionToString(leaf.probability)}
                </text>
              </g>
            ))}
          </g>
        ))}
      </svg>
      <figcaption className="text-2xl">
        {first.name} first (left), then {second.name} with its chance in brackets; each path multiplies its branches. W: {first.name} {outcomeWord.win}, T: {outcomeWord.tie}, L:{" "}
        {outcomeWord.loss}.
      </figcaption>
      {totals}
    </figure>
  );
}
