import { poolRolls, type PoolableRoll, type PooledResults } from "./pooled-results";
import type { TieRule } from "../probability/index";

/** One tally of a run as the board pools it. */
export type BoardTally = { tally: number; dicePerPlayer: number; players: number; startedAt: string };

/** What a Run board shows from a run's kept rolls. */
export type BoardPools = {
  tallies: { tally: BoardTally; pooled: PooledResults; withoutSimulated: PooledResults | null }[];
  /** Kept rolls per group id. */
  rollsByGroup: Record<string, number>;
};

/**
 * Pools a run's kept rolls the way the Run board shows them: each tally on its own, with every roll and (when the
 * virtual class took part) without the simulated ones, and the number of kept rolls per group.
 */
export function poolBoard(input: {
  rolls: PoolableRoll[];
  dice: { name: string; faces: number[] }[];
  tieRule: TieRule;
  tallies: BoardTally[];
  nicknames: Record<string, string>;
}): BoardPools {
  const rollsByGroup: Record<string, number> = {};
  for (const entry of input.rolls) {
    rollsByGroup[entry.groupId] = (rollsByGroup[entry.groupId] ?? 0) + 1;
    entry.groupNickname = input.nicknames[entry.groupId];
  }
  const tallies = input.tallies.map((tally) => {
    const ofTally = input.rolls.filter((entry) => entry.tally === tally.tally);
    const classOnly = ofTally.filter((entry) => entry.source !== "simulated");
    return {
      tally,
      pooled: poolRolls({ dice: input.dice, tieRule: input.tieRule, rolls: ofTally }),
      withoutSimulated: classOnly.length === ofTally.length ? null : poolRolls({ dice: input.dice, tieRule: input.tieRule, rolls: classOnly }),
    };
  });
  return { tallies, rollsByGroup };
}
