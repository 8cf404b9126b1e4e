import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { BoardPool, SimulatedRollError } from "@shared/class-results/board-pool";
import { type PoolableRoll, poolRolls, RollPool } from "@shared/class-results/pooled-results";
import { TIE_RULES, type TieRule } from "@shared/probability/index";

// Invented dice for these checks.
const dice = [
  { name: "Fulmar", faces: [1, 4, 4, 6] },
  { name: "Shag", faces: [2, 3, 5, 5] },
  { name: "Eider", faces: [0, 3, 4, 7] },
];
const matchups = [
  [0, 1],
  [1, 0],
  [1, 2],
  [2, 0],
  [0, 1, 2],
];

const rollArbitrary = fc
  .record({
    group: fc.constantFrom("g1", "g2", "g3", "g4"),
    matchup: fc.constantFrom(...matchups),
    faceIndexes: fc.array(fc.nat(3), { minLength: 3, maxLength: 3 }),
    millisecond: fc.nat(5_000),
    source: fc.constantFrom("phone", "phone", "paper", "simulated"),
    tally: fc.constantFrom(1, 1, 2),
  })
  .map(({ group, matchup, faceIndexes, millisecond, source, tally }): PoolableRoll => {
    const totals = matchup.map((dieIndex, seat) => dice[dieIndex].faces[faceIndexes[seat]]);
    return {
      groupId: group,
      groupNickname: `Crew ${group}`,
      tally,
      dicePerPlayer: 1,
      matchup,
      totals,
      winnerSeat: null,
      source: source as PoolableRoll["source"],
      recordedAt: new Date(Date.UTC(2026, 2, 3, 10, 0, 0) + millisecond).toISOString(),
    };
  });

/** Splits a list into consecutive chunks at the given cut points. */
function chunks<T>(list: T[], cuts: number[]): T[][] {
  const points = [...new Set(cuts.map((cut) => cut % (list.length + 1)))].sort((x, y) => x - y);
  const out: T[][] = [];
  let start = 0;
  for (const point of [...points, list.length]) {
    out.push(list.slice(start, point));
    start = point;
  }
  return out;
}

/** The first seat's running frequency under a tie rule after each roll, counted directly from rolls in time order. */
function directRunningFrequency(rolls: PoolableRoll[], tieRule: TieRule): (number | null)[] {
  let wins = 0;
  let ties = 0;
  let decided = 0;
  return rolls.map((entry, index) => {
    const highest = Math.max(...entry.totals);
    const atTop = entry.totals.filter((total) => total === highest).length;
    if (atTop === 1) decided += 1;
    if (entry.totals[0] === highest) {
      if (atTop === 1) wins += 1;
      else ties += 1;
    }
    const count = index + 1;
    if (tieRule === "re-roll-ties") return decided === 0 ? null : wins / decided;
    if (tieRule === "ties-score-half") return (wins + ties / 2) / count;
    return wins / count;
  });
}

describe("RollPool, pooling as rolls come", () => {
  it("gives after every chunk the same figures as pooling all the rolls so far at once", () => {
    fc.assert(
      fc.property(
        fc.array(rollArbitrary, { maxLength: 120 }),
        fc.array(fc.nat(200), { maxLength: 5 }),
        fc.constantFrom(...TIE_RULES),
        (rolls, cuts, tieRule) => {
          const pool = new RollPool(dice, tieRule);
          const seen: PoolableRoll[] = [];
          for (const chunk of chunks(rolls, cuts)) {
            pool.add(chunk);
            seen.push(...chunk);
            expect(pool.result()).toEqual(poolRolls({ dice, tieRule, rolls: seen }));
          }
          expect(pool.size).toBe(rolls.length);
        },
      ),
      { numRuns: 60 },
    );
  });

  it("draws the convergence series in recorded order whatever order the rolls arrive in", () => {
    fc.assert(
      fc.property(fc.array(rollArbitrary, { minLength: 1, maxLength: 150 }), fc.constantFrom(...TIE_RULES), (generated, tieRule) => {
        // One matchup, distinct times, arriving newest first for the second half.
        const rolls = generated.map((entry, index) => ({
          ...entry,
          matchup: [0, 1],
          totals: [dice[0].faces[index % 4], dice[1].faces[(index * 3) % 4]],
          recordedAt: new Date(Date.UTC(2026, 2, 3, 10) + index * 1000 + (generated[index].recordedAt.length % 7)).toISOString(),
        }));
        const half = Math.floor(rolls.length / 2);
        const arriving = [...rolls.slice(0, half), ...rolls.slice(half).reverse()];
        const pooled = new RollPool(dice, tieRule).add(arriving).result();
        const [matchup] = pooled.matchups;
        const direct = directRunningFrequency(rolls, tieRule);
        // Every roll count up to the series limit is a point, so each point can be checked against the direct count.
        expect(matchup.convergence).toHaveLength(rolls.length);
        matchup.convergence.forEach((point, index) => {
          expect(point.rolls).toBe(index + 1);
          if (direct[index] === null) expect(point.frequency).toBeNull();
          else expect(point.frequency).toBeCloseTo(direct[index]!, 12);
        });
      }),
      { numRuns: 60 },
    );
  });

  it("without a series counts the same and keeps no convergence points", () => {
    fc.assert(
      fc.property(fc.array(rollArbitrary, { maxLength: 120 }), fc.constantFrom(...TIE_RULES), (rolls, tieRule) => {
        const full = poolRolls({ dice, tieRule, rolls });
        const flat = new RollPool(dice, tieRule, { series: false }).add(rolls).result();
        expect(flat.matchups.map((entry) => entry.convergence)).toEqual(full.matchups.map(() => []));
        expect(flat.matchups.map(({ convergence: _convergence, ...rest }) => rest)).toEqual(
          full.matchups.map(({ convergence: _convergence, ...rest }) => rest),
        );
        expect(flat.groups).toEqual(full.groups);
        expect(flat.totals).toEqual(full.totals);
      }),
      { numRuns: 40 },
    );
  });

  it("leaves a result it has returned unchanged when more rolls come", () => {
    const rolls = fc.sample(rollArbitrary, { numRuns: 40, seed: 41 });
    const pool = new RollPool(dice, "re-roll-ties").add(rolls.slice(0, 20));
    const early = pool.result();
    const copy = structuredClone(early);
    pool.add(rolls.slice(20));
    expect(early).toEqual(copy);
  });

  it("refuses a roll naming a die the set does not have, with the set's size in the message", () => {
    const pool = new RollPool(dice, "re-roll-ties");
    const [sample] = fc.sample(rollArbitrary, { numRuns: 1, seed: 7 });
    expect(() => pool.add([{ ...sample, matchup: [0, 5], totals: [1, 2] }])).toThrow("the set has 3 dice");
    expect(pool.size).toBe(0);
  });
});

describe("BoardPool, a Run board's running pools", () => {
  it("pools each tally with and without simulated rolls as poolRolls does on the filtered rolls, and counts rolls per group", () => {
    fc.assert(
      fc.property(fc.array(rollArbitrary, { maxLength: 120 }), fc.array(fc.nat(200), { maxLength: 4 }), (rolls, cuts) => {
        const tallies = [
          { tally: 1, dicePerPlayer: 1, players: 2, startedAt: "2026-03-03T10:00:00.000Z" },
          { tally: 2, dicePerPlayer: 1, players: 2, startedAt: "2026-03-03T10:20:00.000Z" },
        ];
        const nicknames = { g1: "Sea Spray", g2: "Rock Hoppers" };
        const board = new BoardPool({ dice, tieRule: "ties-score-half", tallies }, true);
        for (const chunk of chunks(rolls, cuts)) board.add(chunk);
        const result = board.result(nicknames);
        expect(result.kept).toBe(rolls.length);
        const perGroup: Record<string, number> = {};
        for (const entry of rolls) perGroup[entry.groupId] = (perGroup[entry.groupId] ?? 0) + 1;
        expect(result.rollsByGroup).toEqual(perGroup);
        for (const [index, { tally }] of tallies.entries()) {
          const named = rolls
            .filter((entry) => entry.tally === tally)
            .map((entry) => ({ ...entry, groupNickname: nicknames[entry.groupId as keyof typeof nicknames] ?? entry.groupNickname }));
          const own = named.filter((entry) => entry.source !== "simulated");
          expect(result.tallies[index].pooled).toEqual(poolRolls({ dice, tieRule: "ties-score-half", rolls: named }));
          expect(result.tallies[index].withoutSimulated).toEqual(
            own.length === named.length ? null : poolRolls({ dice, tieRule: "ties-score-half", rolls: own }),
          );
        }
      }),
      { numRuns: 40 },
    );
  });

  it("keeps no class-only pool for rolls without simulated ones, and refuses a simulated roll later", () => {
    const settings = {
      dice,
      tieRule: "re-roll-ties" as const,
      tallies: [{ tally: 1, dicePerPlayer: 1, players: 2, startedAt: "2026-03-03T10:00:00.000Z" }],
    };
    const rolls = fc.sample(rollArbitrary, { numRuns: 30, seed: 5 }).map((entry) => ({ ...entry, tally: 1, source: "phone" as const }));
    const board = BoardPool.of(settings, rolls);
    expect(board.result({}).tallies[0].withoutSimulated).toBeNull();
    expect(board.result({}).tallies[0].pooled).toEqual(poolRolls({ dice, tieRule: "re-roll-ties", rolls }));
    expect(() => board.add([{ ...rolls[0], source: "simulated" }])).toThrow(SimulatedRollError);
  });
});

describe("RollPool.addCounts: win/tie/loss counts with no rolls behind them", () => {
  const rollOf = (groupId: string, matchup: number[], totals: number[], second: number): PoolableRoll => ({
    groupId,
    tally: 1,
    dicePerPlayer: 1,
    matchup,
    totals,
    winnerSeat: null,
    source: "paper",
    recordedAt: new Date(Date.UTC(2026, 2, 1, 9, 0, second)).toISOString(),
  });

  it("gives every count, frequency, interval and test the same figures as the same rolls added one by one", () => {
    fc.assert(
      fc.property(
        fc.nat(30),
        fc.nat(30),
        fc.nat(30),
        fc.boolean(),
        fc.constantFrom<TieRule>(...TIE_RULES),
        (firstWins, ties, secondWins, typedSwapped, tieRule) => {
          // Fulmar (die 0) v Shag (die 1), totals as recorded: 6 v 5 a win for Fulmar, 5 v 5 a tie, 4 v 5 a win for Shag.
          const rolls: PoolableRoll[] = [];
          let second = 0;
          for (let index = 0; index < firstWins; index += 1) rolls.push(rollOf("crew", [0, 1], [6, 5], second++));
          for (let index = 0; index < ties; index += 1) rolls.push(rollOf("crew", [0, 1], [5, 5], second++));
          for (let index = 0; index < secondWins; index += 1) rolls.push(rollOf("crew", [0, 1], [4, 5], second++));
          const byRolls = new RollPool(dice, tieRule).add(rolls).result();
          const counted = new RollPool(dice, tieRule);
          counted.addCounts(
            typedSwapped
              ? {
                  groupId: "crew",
                  tally: 1,
                  dicePerPlayer: 1,
                  matchup: [1, 0],
                  firstWins: secondWins,
                  ties,
                  secondWins: firstWins,
                  source: "paper",
                }
              : { groupId: "crew", tally: 1, dicePerPlayer: 1, matchup: [0, 1], firstWins, ties, secondWins, source: "paper" },
          );
          const byCounts = counted.result();
          const total = firstWins + ties + secondWins;
          expect(byCounts.totals).toEqual({ ...byRolls.totals, countedRolls: total });
          expect(byCounts.matchups.length).toBe(byRolls.matchups.length);
          for (const [index, entry] of byCounts.matchups.entries()) {
            const { convergence: countedSeries, countedRolls, ...countedFigures } = entry;
            const { convergence: rolledSeries, countedRolls: none, ...rolledFigures } = byRolls.matchups[index];
            expect(countedFigures).toEqual(rolledFigures);
            expect(countedRolls).toBe(total);
            expect(none).toBe(0);
            // Counts have no order, so they add no point to the convergence series.
            expect(countedSeries).toEqual([]);
            expect(rolledSeries.length).toBeGreaterThan(0);
          }
          expect(byCounts.groups.map(({ countedRolls: _counted, ...group }) => group)).toEqual(
            byRolls.groups.map(({ countedRolls: _counted, ...group }) => group),
          );
        },
      ),
      { numRuns: 60 },
    );
  });

  it("refuses counts that are not whole numbers from 0, or that are not for two dice", () => {
    const pool = new RollPool(dice, "re-roll-ties");
    expect(() =>
      pool.addCounts({ groupId: "g", tally: 1, dicePerPlayer: 1, matchup: [0, 1], firstWins: -1, ties: 0, secondWins: 0, source: "paper" }),
    ).toThrow(RangeError);
    expect(() =>
      pool.addCounts({
        groupId: "g",
        tally: 1,
        dicePerPlayer: 1,
        matchup: [0, 1, 2],
        firstWins: 1,
        ties: 0,
        secondWins: 0,
        source: "paper",
      }),
    ).toThrow(RangeError);
    expect(pool.size).toBe(0);
  });
});
