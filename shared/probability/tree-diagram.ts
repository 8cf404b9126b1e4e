import Fraction from "fraction.js";
import { dicePerPlayerChecked, dieFacesChecked } from "./die";
import { type Outcome, outcomeOfTotals } from "./outcome";
import { sumCountDistribution } from "./sum-distribution";

/** A leaf of the tree: die B's value after die A's branch, with the product probability. */
export interface TreeLeaf {
  value: number;
  /** P(B shows this value): the second-stage branch probability. */
  branchProbability: Fraction;
  /** P(A's branch) × P(this branch): the probability of the whole path. */
  probability: Fraction;
  outcome: Outcome;
}

/** A first-stage branch: one distinct value (or sum) of die A. */
export interface TreeBranch {
  value: number;
  probability: Fraction;
  leaves: TreeLeaf[];
}

/** Data to draw a two-stage tree diagram of a matchup. */
export interface TreeDiagram {
  dicePerPlayer: number;
  branches: TreeBranch[];
  /** Leaves summed per outcome for A. */
  totals: Record<Outcome, Fraction>;
}

/**
 * Two-stage tree diagram of die A against die B (multiplication rule for independent stages):
 * A's distinct values (sums when `dicePerPlayer` > 1) with branch probabilities, then B's, each leaf with its
 * product probability and A's outcome, and the leaves summed per outcome.
 */
export function treeDiagram(a: number[], b: number[], options?: { dicePerPlayer?: number }): TreeDiagram {
  const dicePerPlayer = dicePerPlayerChecked(options?.dicePerPlayer ?? 1);
  const first = sumCountDistribution(dieFacesChecked(a), dicePerPlayer);
  const second = sumCountDistribution(dieFacesChecked(b), dicePerPlayer);
  const secondStage = second.values.map((value, index) => ({ value, probability: new Fraction(second.counts[index], second.total) }));
  const totals: Record<Outcome, Fraction> = { win: new Fraction(0), tie: new Fraction(0), loss: new Fraction(0) };
  const branches = first.values.map((value, index) => {
    const probability = new Fraction(first.counts[index], first.total);
    const leaves = secondStage.map((leaf) => {
      const outcome = outcomeOfTotals(value, leaf.value);
      const path = probability.mul(leaf.probability);
      totals[outcome] = totals[outcome].add(path);
      return { value: leaf.value, branchProbability: leaf.probability, probability: path, outcome };
    });
    return { value, probability, leaves };
  });
  return { dicePerPlayer, branches, totals };
}
