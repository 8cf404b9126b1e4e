import fc from "fast-check";
import Fraction from "fraction.js";
import jStat from "jstat";
import { describe, expect, it } from "vitest";
import {
  binomialPValue,
  CONVERGENCE_POINTS_MAX,
  type PoolableRoll,
  poolRolls,
  scoreUnderTieRule,
} from "@shared/class-results/pooled-results";
import {
  binomialTest,
  compareDice,
  matchupSimulation,
  TIE_RULES,
  type TieRule,
  winProbabilityUnderTieRule,
  wilsonInterval,
} from "@shared/probability/index";

// Invented dice for hand-worked examples.
const dice = [
  { name: "Puffin", faces: [1, 3, 3] },
  { name: "Gannet", faces: [2, 2, 3] },
  { name: "Tern", faces: [0, 3] },
  { name: "Skua", faces: [1, 3] },
];

let clock = 0;
function roll(groupId: string, matchup: number[], totals: number[], extra: Partial<PoolableRoll> = {}): PoolableRoll {
  clock += 1;
  const highest = Math.max(...totals);
  const top = totals.flatMap((total, seat) => (total === highest ? [seat] : []));
  return {
    groupId,
    groupNickname: `Group ${groupId}`,
    tally: 1,
    dicePerPlayer: 1,
    matchup,
    totals,
    winnerSeat: top.length === 1 ? top[0] : null,
    source: "phone",
    recordedAt: new Date(Date.UTC(2026, 0, 5, 9, 0, 0, clock)).toISOString(),
    ...extra,
  };
}

/** Brute force: every joint outcome of the faces, counting the first seat's outright wins, shared tops and any shared top. */
function enumerate(faces: number[][]) {
  let win = 0;
  let tie = 0;
  let shared = 0;
  let total = 0;
  const walk = (seat: number, totals: number[]) => {
    if (seat === faces.length) {
      total += 1;
      const highest = Math.max(...totals);
      const atTop = totals.filter((t) => t === highest).length;
      if (atTop > 1) shared += 1;
      if (totals[0] === highest) {
        if (atTop === 1) win += 1;
        else tie += 1;
      }
      return;
    }
    for (const face of faces[seat]) walk(seat + 1, [...totals, face]);
  };
  walk(0, []);
  return { win: new Fraction(win, total), tie: new Fraction(tie, total), shared: new Fraction(shared, total) };
}

describe("poolRolls exact values", () => {
  it("gives Puffin v Gannet the hand-counted 4/9 win, 2/9 tie, 3/9 loss and each tie rule's chance", () => {
    // Worked by hand over the 9 equally likely pairs: 1 loses to 2, 2, 3; each 3 beats 2, 2 and ties 3.
    const expected: Record<TieRule, string> = { "re-roll-ties": "4/7", "ties-score-half": "5/9", "ties-score-nothing": "4/9" };
    for (const tieRule of TIE_RULES) {
      const [entry] = poolRolls({ dice, tieRule, rolls: [roll("a", [0, 1], [3, 2])] }).matchups;
      expect(entry.label).toBe("Puffin v Gannet");
      expect(entry.exact.win.fraction).toBe("4/9");
      expect(entry.exact.tie.fraction).toBe("2/9");
      expect(entry.exact.loss.fraction).toBe("1/3");
      expect(entry.exact.underTieRule?.fraction).toBe(expected[tieRule]);
      expect(entry.exact.win.decimal).toBe("0.444");
    }
  });

  it("gives three players (Skua, Gannet, Tern) the hand-enumerated chances", () => {
    // Skua {1,3}, Gannet {2,2}→ always 2, Tern {0,3}: four equally likely pairs (Skua, Tern): (1,0) Gannet wins, (1,3) Tern wins,
    // (3,0) Skua wins, (3,3) Skua and Tern share the top. So Skua: win 1/4, tie 1/4, loss 1/2; any shared top 1/4.
    const three = [dice[3], { name: "Gannet", faces: [2, 2] }, dice[2]];
    const results = poolRolls({ dice: three, tieRule: "ties-score-half", rolls: [roll("a", [0, 1, 2], [3, 2, 3])] });
    const [entry] = results.matchups;
    expect(entry.players).toBe(3);
    expect(entry.label).toBe("Skua v Gannet v Tern");
    expect(entry.exact.win.fraction).toBe("1/4");
    expect(entry.exact.tie.fraction).toBe("1/4");
    expect(entry.exact.loss.fraction).toBe("1/2");
    expect(entry.exact.sharedHighest.fraction).toBe("1/4");
    expect(entry.exact.seatWins.map((value) => value.fraction)).toEqual(["1/4", "1/4", "1/4"]);
    expect(entry.exact.underTieRule?.fraction).toBe("3/8");
    expect(entry.seats.map((seat) => [seat.wins, seat.ties, seat.losses])).toEqual([
      [0, 1, 0],
      [0, 0, 1],
      [0, 1, 0],
    ]);
    expect(entry.frequencyUnderTieRule).toBe(0.5);
  });

  it("agrees with the engine's compareDice and winProbabilityUnderTieRule for two players, any dice and tie rule", () => {
    const die = fc.array(fc.integer({ min: 0, max: 9 }), { minLength: 2, maxLength: 6 });
    fc.assert(
      fc.property(die, die, fc.integer({ min: 1, max: 2 }), fc.constantFrom(...TIE_RULES), (a, b, dicePerPlayer, tieRule) => {
        const set = [
          { name: "A", faces: a },
          { name: "B", faces: b },
        ];
        const [entry] = poolRolls({ dice: set, tieRule, rolls: [roll("g", [0, 1], [1, 0], { dicePerPlayer })] }).matchups;
        const engine = compareDice(a, b, { dicePerPlayer });
        expect(entry.exact.win.fraction).toBe(new Fraction(engine.win).toFraction());
        expect(entry.exact.tie.fraction).toBe(new Fraction(engine.tie).toFraction());
        const rule = winProbabilityUnderTieRule(engine, tieRule);
        expect(entry.exact.underTieRule?.fraction ?? null).toBe(rule === null ? null : rule.toFraction());
      }),
      { numRuns: 150 },
    );
  });

  it("agrees with brute-force enumeration of every outcome for three players", () => {
    const die = fc.array(fc.integer({ min: 0, max: 6 }), { minLength: 2, maxLength: 4 });
    fc.assert(
      fc.property(die, die, die, (a, b, c) => {
        const set = [
          { name: "A", faces: a },
          { name: "B", faces: b },
          { name: "C", faces: c },
        ];
        const [entry] = poolRolls({ dice: set, tieRule: "re-roll-ties", rolls: [roll("g", [0, 1, 2], [1, 0, 0])] }).matchups;
        const brute = enumerate([a, b, c]);
        expect(entry.exact.win.fraction).toBe(brute.win.toFraction());
        expect(entry.exact.tie.fraction).toBe(brute.tie.toFraction());
        expect(entry.exact.sharedHighest.fraction).toBe(brute.shared.toFraction());
      }),
      { numRuns: 100 },
    );
  });
});

describe("poolRolls counts", () => {
  const rolls = [
    roll("a", [0, 1], [3, 2]),
    roll("a", [0, 1], [1, 2]),
    roll("a", [0, 1], [3, 3]),
    roll("b", [1, 0], [2, 3]),
    roll("b", [1, 0], [3, 1], { source: "simulated" }),
  ];

  it("pools rolls of the same dice in either seat order, counting per seat", () => {
    const results = poolRolls({ dice, tieRule: "re-roll-ties", rolls });
    expect(results.matchups).toHaveLength(1);
    const [entry] = results.matchups;
    expect(entry.matchup).toEqual([0, 1]);
    expect(entry.rolls).toBe(5);
    // Puffin's side: 3>2 win, 1<2 loss, 3=3 tie, 3>2 win, 1<3 loss.
    expect(entry.seats[0]).toMatchObject({ dieName: "Puffin", wins: 2, ties: 1, losses: 2 });
    expect(entry.seats[1]).toMatchObject({ dieName: "Gannet", wins: 2, ties: 1, losses: 2 });
    expect(entry.decidedRolls).toBe(4);
    expect(entry.frequency).toBeCloseTo(2 / 5, 12);
    expect(entry.frequencyUnderTieRule).toBeCloseTo(2 / 4, 12);
    expect(results.totals).toMatchObject({ rolls: 5, groups: 2, matchups: 1, bySource: { phone: 4, simulated: 1, paper: 0 } });
  });

  it("scores the first seat by each tie rule", () => {
    const half = poolRolls({ dice, tieRule: "ties-score-half", rolls }).matchups[0];
    expect(half.frequencyUnderTieRule).toBeCloseTo(2.5 / 5, 12);
    const nothing = poolRolls({ dice, tieRule: "ties-score-nothing", rolls }).matchups[0];
    expect(nothing.frequencyUnderTieRule).toBeCloseTo(2 / 5, 12);
    expect(scoreUnderTieRule([3, 3], "re-roll-ties")).toBeNull();
    expect(scoreUnderTieRule([3, 3, 1], "ties-score-half")).toBe(0.5);
    expect(scoreUnderTieRule([1, 3, 3], "ties-score-half")).toBe(0);
  });

  it("keeps separate entries per group and per number of dice each", () => {
    const results = poolRolls({ dice, tieRule: "re-roll-ties", rolls: [...rolls, roll("a", [0, 1], [6, 4], { dicePerPlayer: 2 })] });
    expect(results.matchups.map((entry) => entry.key)).toEqual(["1:0-1", "2:0-1"]);
    expect(results.groups.map((group) => [group.groupNickname, group.matchupKey, group.rolls])).toEqual([
      ["Group a", "1:0-1", 3],
      ["Group a", "2:0-1", 1],
      ["Group b", "1:0-1", 2],
    ]);
    expect(results.groups[2].sources.sort()).toEqual(["phone", "simulated"]);
  });

  it("gives the Wilson 95% interval of the counted rolls", () => {
    const [entry] = poolRolls({ dice, tieRule: "re-roll-ties", rolls }).matchups;
    const reference = wilsonInterval(2, 4);
    expect(entry.interval?.lower).toBeCloseTo(reference.lower, 12);
    expect(entry.interval?.upper).toBeCloseTo(reference.upper, 12);
  });

  it("refuses a roll naming a die outside the set or with the wrong number of totals", () => {
    expect(() => poolRolls({ dice, tieRule: "re-roll-ties", rolls: [roll("a", [0, 7], [1, 2])] })).toThrow(RangeError);
    expect(() => poolRolls({ dice, tieRule: "re-roll-ties", rolls: [roll("a", [0, 1], [1])] })).toThrow(RangeError);
  });

  it("answers an empty pool with no entries", () => {
    const results = poolRolls({ dice, tieRule: "re-roll-ties", rolls: [] });
    expect(results.matchups).toEqual([]);
    expect(results.totals.rolls).toBe(0);
  });
});

describe("poolRolls convergence series", () => {
  const a = [1, 5, 5, 5, 5, 7];
  const b = [2, 3, 3, 4, 6, 6];
  const set = [
    { name: "Shag", faces: a },
    { name: "Fulmar", faces: b },
  ];
  const simulation = matchupSimulation(a, b, { rolls: 3000, seed: 2026 });
  const rolls = simulation.rolls.map((entry) => roll("sim", [0, 1], [entry.firstTotal, entry.secondTotal], { source: "simulated" }));

  it("downsamples to at most 200 points, ends at the last roll and follows the engine's running frequency", () => {
    const [entry] = poolRolls({ dice: set, tieRule: "ties-score-nothing", rolls }).matchups;
    expect(entry.convergence.length).toBeLessThanOrEqual(CONVERGENCE_POINTS_MAX);
    expect(entry.convergence.at(-1)?.rolls).toBe(3000);
    for (const point of entry.convergence) expect(point.frequency).toBeCloseTo(simulation.winFrequency[point.rolls - 1], 12);
    expect(entry.frequency).toBeCloseTo(simulation.counts.win / 3000, 12);
  });

  it("keeps every point up to 200 rolls", () => {
    const [entry] = poolRolls({ dice: set, tieRule: "ties-score-nothing", rolls: rolls.slice(0, 150) }).matchups;
    expect(entry.convergence.map((point) => point.rolls)).toEqual(Array.from({ length: 150 }, (_, index) => index + 1));
  });

  it("draws the 95% band as exact ± z·√(p(1 − p)/n), z from jstat", () => {
    // Worked by hand: Shag 1 beats nothing; each of four 5s beats 2, 3, 3, 4 (16 of 36); 7 beats all six (6): P(win) = 22/36 = 11/18, no ties.
    const [entry] = poolRolls({ dice: set, tieRule: "ties-score-nothing", rolls }).matchups;
    expect(entry.exact.win.fraction).toBe("11/18");
    const z = jStat.normal.inv(0.975, 0, 1);
    const p = 11 / 18;
    for (const point of [entry.convergence[0], entry.convergence[99], entry.convergence.at(-1)!]) {
      const half = z * Math.sqrt((p * (1 - p)) / point.rolls);
      expect(point.bandLower).toBeCloseTo(Math.max(0, p - half), 9);
      expect(point.bandUpper).toBeCloseTo(Math.min(1, p + half), 9);
    }
    // Law of large numbers: after 3000 seeded rolls the frequency sits inside the band (common practice: a 95% band, one seed).
    const last = entry.convergence.at(-1)!;
    expect(last.frequency!).toBeGreaterThan(last.bandLower!);
    expect(last.frequency!).toBeLessThan(last.bandUpper!);
  });

  it("uses the variance of a half-point score for ties-score-half", () => {
    // Puffin v Gannet: S = 1 w.p. 4/9, 1/2 w.p. 2/9, else 0, so E[S] = 5/9, E[S²] = 1/2 and Var S = 31/162 (worked by hand).
    const fifty = Array.from({ length: 50 }, (_, index) => roll("a", [0, 1], index % 2 ? [3, 3] : [3, 2]));
    const [entry] = poolRolls({ dice, tieRule: "ties-score-half", rolls: fifty }).matchups;
    const z = jStat.normal.inv(0.975, 0, 1);
    const last = entry.convergence.at(-1)!;
    expect(last.rolls).toBe(50);
    expect(last.bandUpper).toBeCloseTo(5 / 9 + z * Math.sqrt(31 / 162 / 50), 9);
    expect(last.bandLower).toBeCloseTo(5 / 9 - z * Math.sqrt(31 / 162 / 50), 9);
    expect(last.frequency).toBeCloseTo(37.5 / 50, 12);
  });

  it("counts only decided rolls in the band under re-roll-ties", () => {
    const [entry] = poolRolls({ dice, tieRule: "re-roll-ties", rolls: [roll("a", [0, 1], [3, 3]), roll("a", [0, 1], [3, 2])] }).matchups;
    expect(entry.convergence[0]).toEqual({ rolls: 1, frequency: null, bandLower: null, bandUpper: null });
    const z = jStat.normal.inv(0.975, 0, 1);
    const p = 4 / 7;
    expect(entry.convergence[1].bandUpper).toBeCloseTo(Math.min(1, p + z * Math.sqrt(p * (1 - p))), 9);
    expect(entry.convergence[1].frequency).toBe(1);
  });
});

describe("poolRolls group plausibility", () => {
  /** R's binom.test rule in floating point on jstat's binomial pmf. */
  function referencePValue(successes: number, trials: number, p: number): number {
    const observed = jStat.binomial.pdf(successes, trials, p);
    let total = 0;
    for (let k = 0; k <= trials; k += 1) {
      const probability = jStat.binomial.pdf(k, trials, p);
      if (probability <= observed * (1 + 1e-7)) total += probability;
    }
    return Math.min(1, total);
  }

  it("flags a group whose first seat wins every roll and leaves seeded honest groups alone", () => {
    const honest = matchupSimulation(dice[0].faces, dice[1].faces, { rolls: 60, seed: 7 });
    const rolls = [
      ...honest.rolls.map((entry) => roll("honest", [0, 1], [entry.firstTotal, entry.secondTotal])),
      ...Array.from({ length: 30 }, () => roll("stuck", [0, 1], [3, 2])),
    ];
    const results = poolRolls({ dice, tieRule: "re-roll-ties", rolls });
    const byGroup = Object.fromEntries(results.groups.map((group) => [group.groupId, group]));
    expect(byGroup.stuck.test.implausible).toBe(true);
    expect(byGroup.stuck.test.pValue).toBeCloseTo(referencePValue(30, 30, 4 / 9), 9);
    expect(byGroup.honest.test.pValue).toBeCloseTo(referencePValue(honest.counts.win, 60, 4 / 9), 9);
    expect(byGroup.honest.test.implausible).toBe(byGroup.honest.test.pValue < 0.01);
    expect(byGroup.honest.test.method).toBe("exact binomial test (whole numbers)");
    expect(results.totals.implausibleGroups).toBe(1);
  });

  it("gives the same p-value from the floating-point sum as from the engine's whole-number test", () => {
    for (const [successes, trials, p] of [
      [1100, 2000, new Fraction(5, 9)],
      [700, 3000, new Fraction(4115, 15552)],
      [2500, 5000, new Fraction(1, 2)],
    ] as const) {
      const floating = binomialPValue(successes, trials, p);
      expect(floating.method).toBe("exact binomial test (floating point)");
      expect(floating.pValue).toBeCloseTo(binomialTest(successes, trials, p).pValueNumber, 9);
    }
  });
});
