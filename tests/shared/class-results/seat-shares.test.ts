import Fraction from "fraction.js";
import { describe, expect, it } from "vitest";
import { type PoolableRoll, poolRolls } from "@shared/class-results/pooled-results";
import { matchupFromSeat, padDieOrder, seatShares, shareSentence } from "@shared/class-results/seat-shares";
import { TIE_RULES, type TieRule, wilsonInterval } from "@shared/probability/index";

// Invented dice for hand-worked examples.
const dice = [
  { name: "Puffin", faces: [1, 3, 3] },
  { name: "Gannet", faces: [2, 2, 3] },
  { name: "Tern", faces: [0, 3] },
];

let clock = 0;
function roll(matchup: number[], totals: number[]): PoolableRoll {
  clock += 1;
  const highest = Math.max(...totals);
  const top = totals.flatMap((total, seat) => (total === highest ? [seat] : []));
  return {
    groupId: "g1",
    tally: 1,
    dicePerPlayer: 1,
    matchup,
    totals,
    winnerSeat: top.length === 1 ? top[0] : null,
    source: "phone",
    recordedAt: new Date(Date.UTC(2026, 0, 5, 9, 0, 0, clock)).toISOString(),
  };
}

/**
 * Brute force (the classical definition: favourable over equally likely outcomes): each seat's score under a tie rule,
 * averaged over every joint outcome of the faces; under "re-roll ties" only outcomes with one top total count.
 */
function bruteForceSeatShares(faces: number[][], tieRule: TieRule): (Fraction | null)[] {
  const scores = faces.map(() => new Fraction(0));
  let counted = 0;
  const walk = (seat: number, totals: number[]) => {
    if (seat === faces.length) {
      const highest = Math.max(...totals);
      const atTop = totals.filter((total) => total === highest).length;
      if (tieRule === "re-roll-ties" && atTop > 1) return;
      counted += 1;
      totals.forEach((total, index) => {
        if (total !== highest) return;
        if (atTop === 1) scores[index] = scores[index].add(1);
        else if (tieRule === "ties-score-half") scores[index] = scores[index].add(new Fraction(1, 2));
      });
      return;
    }
    for (const face of faces[seat]) walk(seat + 1, [...totals, face]);
  };
  walk(0, []);
  return scores.map((score) => (counted === 0 ? null : score.div(counted)));
}

describe("padDieOrder", () => {
  it("follows the order the groups play a matchup in, the most played order first", () => {
    expect(
      padDieOrder(
        [0, 2],
        [
          [2, 0],
          [0, 1],
          [2, 0],
          [0, 2],
        ],
        3,
      ),
    ).toEqual([2, 0]);
    expect(padDieOrder([0, 1, 2], [[1, 2, 0]], 3)).toEqual([1, 2, 0]);
  });

  it("falls back on the assignment cycle's order, then on ascending dice, when no group plays the matchup", () => {
    // The cycle of three dice hands out 0 v 1, 1 v 2 and 2 v 0.
    expect(padDieOrder([0, 2], [null, [0, 1]], 3)).toEqual([2, 0]);
    expect(padDieOrder([0, 1], [], 3)).toEqual([0, 1]);
    // With four dice, 0 v 2 is never handed out by the cycle (0 v 1, 1 v 2, 2 v 3, 3 v 0).
    expect(padDieOrder([0, 2], [], 4)).toEqual([0, 2]);
  });
});

describe("seatShares", () => {
  it("gives each die its own share and its one exact value, in the order asked for", () => {
    // Rolls of Gannet v Puffin as a pad records them; pooling stores them as Puffin v Gannet.
    const rolls = [roll([1, 0], [2, 1]), roll([1, 0], [2, 3]), roll([1, 0], [3, 3]), roll([1, 0], [3, 1]), roll([1, 0], [2, 3])];
    const pooled = poolRolls({ dice, tieRule: "re-roll-ties", rolls });
    const [entry] = pooled.matchups;
    expect(entry.matchup).toEqual([0, 1]);
    const [gannet, puffin] = seatShares(entry, "re-roll-ties", [1, 0]);
    // Counted from the rolls above: Gannet won 2, Puffin 2, one tie re-rolled.
    expect(gannet).toMatchObject({ dieName: "Gannet", wins: 2, ties: 1, losses: 2, share: 0.5 });
    expect(puffin).toMatchObject({ dieName: "Puffin", wins: 2, ties: 1, losses: 2, share: 0.5 });
    // Hand-counted over the 9 equally likely pairs: Puffin wins 4, Gannet 3, 2 tie; re-rolling ties gives 4/7 and 3/7.
    expect(puffin.exact?.fraction).toBe("4/7");
    expect(gannet.exact?.fraction).toBe("3/7");
    expect(puffin.exact?.fraction).toBe(entry.exact.underTieRule?.fraction);
    // Wilson (1927) score interval over the 4 rolls that were not ties, as the engine's wilsonInterval gives it.
    expect(gannet.interval?.lower).toBeCloseTo(wilsonInterval(2, 4).lower, 12);
    expect(() => seatShares(entry, "re-roll-ties", [2, 0])).toThrow(RangeError);
  });

  it("matches brute force for every seat of a three-player matchup under every tie rule", () => {
    const faces = dice.map((die) => die.faces);
    for (const tieRule of TIE_RULES) {
      const pooled = poolRolls({ dice, tieRule, rolls: [roll([0, 1, 2], [3, 2, 0])] });
      const [entry] = pooled.matchups;
      const expected = bruteForceSeatShares(faces, tieRule);
      const shares = seatShares(entry, tieRule);
      shares.forEach((share, seat) => expect(share.exact?.fraction, `${tieRule}, seat ${seat}`).toBe(expected[seat]?.toFraction()));
    }
  });

  it("reads a share whose rolls all tied under re-roll ties as none yet", () => {
    const pooled = poolRolls({ dice, tieRule: "re-roll-ties", rolls: [roll([0, 1], [3, 3])] });
    const [puffin] = seatShares(pooled.matchups[0], "re-roll-ties");
    expect(puffin.share).toBeNull();
    expect(puffin.interval).toBeNull();
  });
});

describe("matchupFromSeat", () => {
  const rolls = [
    roll([1, 0], [2, 1]),
    roll([1, 0], [2, 3]),
    roll([1, 0], [3, 3]),
    roll([1, 0], [3, 1]),
    roll([1, 0], [2, 3]),
    roll([1, 0], [3, 1]),
  ];

  it("turns a two-player matchup round to the second die: its share, exact value and running series", () => {
    for (const tieRule of ["re-roll-ties", "ties-score-half"] as const) {
      const [entry] = poolRolls({ dice, tieRule, rolls }).matchups;
      const turned = matchupFromSeat(entry, tieRule, 1);
      const [gannet] = seatShares(entry, tieRule, [1]);
      expect(turned.label).toBe("Gannet v Puffin");
      expect(turned.seats[0].dieName).toBe("Gannet");
      expect(turned.frequencyUnderTieRule).toBe(gannet.share);
      expect(turned.exact.underTieRule).toEqual(gannet.exact);
      // Gannet's running share is Puffin's complement at every roll, and the band around its exact value mirrors Puffin's.
      expect(turned.convergence.at(-1)?.frequency).toBeCloseTo(gannet.share!, 12);
      turned.convergence.forEach((point, index) => {
        const original = entry.convergence[index];
        expect(point.frequency === null).toBe(original.frequency === null);
        if (point.frequency !== null) expect(point.frequency + original.frequency!).toBeCloseTo(1, 12);
        if (point.bandLower !== null) expect(point.bandLower + original.bandUpper!).toBeCloseTo(1, 12);
      });
    }
  });

  it("leaves the matchup as it is where one die's share is not the other's complement", () => {
    const [nothing] = poolRolls({ dice, tieRule: "ties-score-nothing", rolls }).matchups;
    expect(matchupFromSeat(nothing, "ties-score-nothing", 1)).toBe(nothing);
    const [three] = poolRolls({ dice, tieRule: "re-roll-ties", rolls: [roll([0, 1, 2], [3, 2, 0])] }).matchups;
    expect(matchupFromSeat(three, "re-roll-ties", 2)).toBe(three);
  });
});

describe("shareSentence", () => {
  it("says whose share it is and what it counts under each tie rule", () => {
    expect(shareSentence("Puffin", 0.45, "ties-score-nothing")).toBe("Puffin wins 0.450 of rolls");
    expect(shareSentence("Puffin", 0.45, "re-roll-ties")).toBe("Puffin wins 0.450 of the rolls that were not ties");
    expect(shareSentence("Gannet", 0.5, "ties-score-half")).toBe("Gannet scores 0.500 per roll (a tie scores half)");
    expect(shareSentence("Gannet", null, "ties-score-half")).toBe("Gannet has no rolls that count yet");
  });
});
