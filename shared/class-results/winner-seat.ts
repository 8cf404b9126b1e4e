/** The seat with the highest total, or null when the highest total is shared (a tie). */
export function winnerSeatOf(totals: readonly number[]): number | null {
  // One pass without allocating: every pupil's roll goes through here.
  let winner: number | null = null;
  let highest = -Infinity;
  for (let seat = 0; seat < totals.length; seat += 1) {
    if (totals[seat] > highest) {
      highest = totals[seat];
      winner = seat;
    } else if (totals[seat] === highest) winner = null;
  }
  return winner;
}
