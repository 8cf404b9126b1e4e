import { RollPool, type PoolableRoll, type PooledResults } from "./pooled-results";
import type { TieRule } from "../probability/index";

/** One tally of a run as the board pools it. */
export type BoardTally = { tally: number; dicePerPlayer: number; players: number; startedAt: string };

/** One tally's pooled results: every roll, and the class's own without the virtual class's (null when there are none). */
export type BoardTallyPools = { tally: BoardTally; pooled: PooledResults; withoutSimulated: PooledResults | null };

/** What a Run board shows from a run's kept rolls; the tallies as objects, or as the UTF-8 JSON bytes a board:update carries. */
export type BoardPools<Tallies = BoardTallyPools[]> = {
  tallies: Tallies;
  /** Kept rolls per group id. */
  rollsByGroup: Record<string, number>;
  /** Kept rolls pooled in all. */
  kept: number;
};

export type BoardPoolSettings = { dice: { name: string; faces: number[] }[]; tieRule: TieRule; tallies: BoardTally[] };

/** A simulated roll came to a BoardPool made without a class-only pool: pool the run again from every roll. */
export class SimulatedRollError extends Error {}

/**
 * A run's kept rolls pooled the way the Run board shows them, as they come: each tally on its own, with every roll and
 * (when the virtual class takes part) without its simulated rolls, and the number of kept rolls per group. Adding a
 * roll costs the same however many came before it, so a board refresh pools only the rolls new since the last one.
 * Without `withSimulated` no class-only pool is kept (it would equal the whole); a simulated roll then throws
 * SimulatedRollError, since the rolls before it were not kept apart.
 */
export class BoardPool {
  private readonly everyRoll = new Map<number, RollPool>();
  private readonly classOnly = new Map<number, RollPool>();
  private readonly rollsByGroup: Record<string, number> = {};
  private kept = 0;

  constructor(
    private readonly settings: BoardPoolSettings,
    private readonly withSimulated: boolean,
  ) {
    for (const { tally } of settings.tallies) {
      this.everyRoll.set(tally, new RollPool(settings.dice, settings.tieRule));
      if (withSimulated) this.classOnly.set(tally, new RollPool(settings.dice, settings.tieRule));
    }
  }

  /** A pool for these rolls: with a class-only pool exactly when some of them are simulated. */
  static of(settings: BoardPoolSettings, rolls: PoolableRoll[]): BoardPool {
    return new BoardPool(
      settings,
      rolls.some((entry) => entry.source === "simulated"),
    ).add(rolls);
  }

  add(rolls: Iterable<PoolableRoll>): this {
    for (const roll of rolls) {
      if (roll.source === "simulated" && !this.withSimulated)
        throw new SimulatedRollError("a simulated roll came to a pool kept without them");
      this.rollsByGroup[roll.groupId] = (this.rollsByGroup[roll.groupId] ?? 0) + 1;
      this.kept += 1;
      // A roll of a tally the run no longer lists is counted for its group but pooled nowhere.
      this.everyRoll.get(roll.tally)?.addOne(roll);
      if (roll.source !== "simulated") this.classOnly.get(roll.tally)?.addOne(roll);
    }
    return this;
  }

  /** The board's figures now; `nicknames` (group id → nickname) names the groups in the per-group tables. */
  result(nicknames: Record<string, string>): BoardPools {
    const tallies = this.settings.tallies.map((tally) => {
      const every = this.everyRoll.get(tally.tally)!;
      const own = this.classOnly.get(tally.tally);
      return { tally, pooled: every.result(nicknames), withoutSimulated: !own || own.size === every.size ? null : own.result(nicknames) };
    });
    return { tallies, rollsByGroup: { ...this.rollsByGroup }, kept: this.kept };
  }
}

/** Pools a run's kept rolls at once the way the Run board shows them. */
export function poolBoard(input: BoardPoolSettings & { rolls: PoolableRoll[]; nicknames: Record<string, string> }): BoardPools {
  return BoardPool.of(input, input.rolls).result(input.nicknames);
}
