/** A roll's outcome from the first player's side. */
export type Outcome = "win" | "tie" | "loss";

/** The first player's outcome when their total is `first` and the other's is `second`. */
export function outcomeOfTotals(first: number, second: number): Outcome {
  return first > second ? "win" : first < second ? "loss" : "tie";
}
