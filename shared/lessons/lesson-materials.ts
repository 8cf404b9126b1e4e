import Fraction from "fraction.js";
import {
  analyzeSet,
  compareDice,
  fractionToNumber,
  fractionToString,
  rollsNeededToExcludeHalf,
  wilsonIntervalFromProportion,
  winProbabilityUnderTieRule,
  type MatchupResult,
  type ProportionInterval,
  type TieRule,
} from "../probability/index";
import { LESSON_LIMITS, type LessonMaterialsFields } from "../schemas/lessons";
import { paceText, rollPhaseBudget, rollPhaseMinutes, type RollPhaseBudget } from "./roll-pace";

/** A die of the lesson's set, as the materials list needs it. */
export interface MaterialsDie {
  name: string;
  faces: number[];
}

/** Printed dice of one kind for the whole class. */
export interface DieMaterials {
  name: string;
  /** Dice handed to groups (every group's share added up). */
  forGroups: number;
  spares: number;
  total: number;
}

/** What the teacher prints or hands out for one lesson. */
export interface LessonMaterials {
  /** Copies of each die a player holds: the mode's dice per player, or 2 when a Twist round plays two dice each. */
  copiesPerPlayer: number;
  dice: DieMaterials[];
  totalDice: number;
  recordingSheets: { perGroup: number; forGroups: number; spares: number; total: number; rowsPerSheet: number };
  /** One slip per pupil when the Reflect phase runs and the plan has an exit ticket; 0 otherwise. */
  exitTicketSlips: number;
  /** Plain sentences explaining how the counts were reached. */
  notes: string[];
}

/** The rolls verdict for one main matchup, from the winner's side. */
export interface MatchupVerdict {
  winner: string;
  loser: string;
  /** The winner's chance of one roll under the lesson's tie rule, exact (winProbabilityUnderTieRule). */
  winChance: Fraction;
  /** The exact chance of a tie on one roll. */
  tieChance: Fraction;
  /**
   * The proportion the class result tests against 1/2: the winner's share of decided rolls (re-roll ties, ties score
   * nothing) or the winner's mean score per roll (ties score half).
   */
  testedChance: Fraction;
  /** Pooled rolls this matchup gets from the whole class. */
  plannedRolls: number;
  /** Recorded rolls needed before the 95% Wilson interval is expected to exclude 1/2; null when no number is enough. */
  neededRolls: number | null;
  enough: boolean;
  /** The 95% Wilson interval for `testedChance` expected at the planned rolls, or null with no rolls. */
  expectedInterval: ProportionInterval | null;
}

/** The set's matchup that needs the fewest rolls, proposed when a main matchup is too close for one lesson. */
export interface StrongestMatchup {
  winner: string;
  loser: string;
  /** The winner's chance under the lesson's tie rule, exact. */
  winChance: Fraction;
  neededRolls: number;
  /** Groups whose Roll phase makes the needed rolls when they all play it; null without a Roll phase. */
  groupsInTime: number | null;
}

/** Whether the pooled rolls are enough for a convincing class result, and what to change if not, within the Roll phase. */
export interface RollsVerdict {
  status: "enough" | "not-enough" | "no-set" | "no-winner";
  /** groups × rollsPerGroup. */
  pooledRolls: number;
  /** The Roll phase's minutes, the common-practice pace and the rolls a group makes in them; null without a Roll phase. */
  budget: RollPhaseBudget | null;
  /** False when the plan's rolls per group do not fit in the Roll phase (the verdict then counts only those that fit). */
  fitsTime: boolean;
  matchups: MatchupVerdict[];
  /** Rolls per group to use (never more than fit in the Roll phase), with `suggestedGroups` groups; null when the plan's are right. */
  suggestedRollsPerGroup: number | null;
  /** More groups (at most the lesson limit), when the rolls that fit are not enough with the planned groups; null otherwise. */
  suggestedGroups: number | null;
  /** Simulated rolls per short matchup a Virtual class would add, when no class can make them in time; null otherwise. */
  virtualTopUp: number | null;
  /** Main matchups too close to show in one lesson ("Puffin over Gannet"). */
  tooClose: string[];
  /** Proposed when some main matchup is too close: the set's matchup that needs the fewest rolls. */
  strongestMatchup: StrongestMatchup | null;
  message: string;
}

/** What `lessonMaterials` returns. */
export interface LessonMaterialsResult {
  materials: LessonMaterials;
  verdict: RollsVerdict;
  /** The matchups (pairs or trios of die names) the class plays, as assigned round the main cycle. */
  games: string[][];
  /** How the main matchups were chosen, for display. */
  mainMatchupSource: "cycle" | "beats" | "none";
}

/** Confidence level of the rolls verdict. */
export const VERDICT_CONFIDENCE = 0.95;

/** Spare dice and sheets: one of each for every four groups, rounded up (common practice in our planning, not a published rule). */
export function sparesFor(groups: number): number {
  return Math.ceil(groups / 4);
}

interface MainMatchups {
  source: LessonMaterialsResult["mainMatchupSource"];
  /** [winnerIndex, loserIndex] pairs. */
  pairs: [number, number][];
  /** Die indices in cycle order (or set order when there is no cycle through every die). */
  order: number[];
}

/**
 * The set's main matchups at the lesson's dice per player: the matchups round a cycle through every die
 * (the one whose weakest link is strongest), or, without such a cycle, every matchup one die wins.
 */
function mainMatchupsOf(dice: MaterialsDie[], dicePerPlayer: number): MainMatchups {
  const analysis = analyzeSet(dice, { dicePerPlayer, cycleLimit: 500 });
  const level = analysis.levels.find((entry) => entry.dicePerPlayer === dicePerPlayer)!;
  const strongest = level.strongestHamiltonianCycle;
  if (strongest) {
    const order = strongest.indices;
    return { source: "cycle", order, pairs: order.map((index, position) => [index, order[(position + 1) % order.length]]) };
  }
  const order = dice.map((_die, index) => index);
  if (level.beats.length === 0) return { source: "none", order, pairs: [] };
  return { source: "beats", order, pairs: level.beats.map((edge) => [edge.winnerIndex, edge.loserIndex]) };
}

/** The games groups play: each main matchup for two players; trios of neighbours round the cycle for three players. */
function gamesOf(main: MainMatchups, players: 2 | 3, dieCount: number): number[][] {
  if (players === 2) return main.pairs.map((pair) => [...pair]);
  if (dieCount < 3) return [];
  if (dieCount === 3) return [main.order.slice()];
  return main.order.map((_index, position) => [0, 1, 2].map((step) => main.order[(position + step) % main.order.length]));
}

/** Which game each group plays when the teacher assigns them: round-robin over the games. */
function assignedGames(games: number[][], groups: number): number[][] {
  return Array.from({ length: groups }, (_unused, group) => games[group % games.length]);
}

/** How many groups' worth of rolls a main matchup receives: a group counts 1 if its game has both dice. */
function coverageOf(
  pair: [number, number],
  games: number[][],
  groups: number,
  matchupChoice: LessonMaterialsFields["matchupChoice"],
): number {
  const contains = (game: number[]) => game.includes(pair[0]) && game.includes(pair[1]);
  if (games.length === 0) return 0;
  if (matchupChoice === "group-choice") {
    // A group that chooses spreads its rolls evenly over the games, on average.
    return (groups * games.filter(contains).length) / games.length;
  }
  return assignedGames(games, groups).filter(contains).length;
}

/**
 * The materials list and the rolls verdict of a lesson plan with its dice set (null when no set is chosen).
 * Dice: with assigned matchups each group gets the dice of its own game; with group choice each group gets the whole set;
 * a player holds `copiesPerPlayer` of each die. The verdict asks, for each main matchup, whether its pooled rolls reach
 * `rollsNeededToExcludeHalf` (the smallest n whose 95% Wilson score interval, Wilson 1927, at the expected win count
 * excludes 1/2), using the win chance under the lesson's tie rule. In a three-player game every roll also compares each
 * pair of players, so a pair's pooled rolls are the rolls of every game holding both dice. A group's rolls are capped by
 * the Roll phase's time budget at the common-practice pace (roll-pace.ts): the verdict, its suggestions and the
 * recording sheets' rows never count more rolls than fit.
 */
export function lessonMaterials(plan: LessonMaterialsFields, dice: MaterialsDie[] | null): LessonMaterialsResult {
  const twistIncluded = plan.phases.some((entry) => entry.phase === "Twist" && entry.included);
  const reflectIncluded = plan.phases.some((entry) => entry.phase === "Reflect" && entry.included);
  const copiesPerPlayer = twistIncluded && plan.mode.dicePerPlayer === 1 ? 2 : plan.mode.dicePerPlayer;
  const spares = sparesFor(plan.groups);
  const pooledRolls = plan.groups * plan.rollsPerGroup;
  const notes: string[] = [];
  const sheetsPerGroup = twistIncluded ? 2 : 1;
  const budget = rollPhaseBudget(rollPhaseMinutes(plan.phases), plan.mode);
  // A sheet has rows for the rolls a group can make in the Roll phase, never for a plan that does not fit.
  const rowsPerSheet = budget === null ? plan.rollsPerGroup : Math.max(1, Math.min(plan.rollsPerGroup, budget.rollsPerGroup));
  const recordingSheets = {
    perGroup: sheetsPerGroup,
    forGroups: sheetsPerGroup * plan.groups,
    spares,
    total: sheetsPerGroup * plan.groups + spares,
    rowsPerSheet,
  };
  const exitTicketSlips = reflectIncluded && plan.exitTicket.trim() !== "" ? plan.groups * plan.pupilsPerGroup : 0;
  notes.push(
    `Recording sheets: ${sheetsPerGroup === 2 ? "two per group (the Roll round and the Twist round)" : "one per group"}, each with room for ${rowsPerSheet} rolls, plus ${spares} spare.`,
  );
  if (rowsPerSheet < plan.rollsPerGroup && budget !== null) {
    notes.push(
      `The plan asks for ${plan.rollsPerGroup} rolls per group, but at ${paceText(budget)} a group makes about ${budget.rollsPerGroup} in the ${budget.minutes}-minute Roll phase, so the sheets have ${rowsPerSheet} rows.`,
    );
  }

  if (dice === null || dice.length === 0) {
    return {
      materials: {
        copiesPerPlayer,
        dice: [],
        totalDice: 0,
        recordingSheets,
        exitTicketSlips,
        notes: ["Choose a dice set to count the dice.", ...notes],
      },
      verdict: {
        status: "no-set",
        pooledRolls,
        budget,
        fitsTime: true,
        matchups: [],
        suggestedRollsPerGroup: null,
        suggestedGroups: null,
        virtualTopUp: null,
        tooClose: [],
        strongestMatchup: null,
        message: "Choose a dice set to check whether the planned rolls are enough.",
      },
      games: [],
      mainMatchupSource: "none",
    };
  }

  const main = mainMatchupsOf(dice, plan.mode.dicePerPlayer);
  const games = gamesOf(main, plan.mode.players, dice.length);
  const forGroups = new Array<number>(dice.length).fill(0);
  if (plan.matchupChoice === "group-choice" || games.length === 0) {
    dice.forEach((_die, index) => (forGroups[index] = plan.groups * copiesPerPlayer));
    notes.unshift(
      plan.matchupChoice === "group-choice"
        ? `Groups choose their matchups, so each group gets the whole set: ${copiesPerPlayer} of every die.`
        : "No game of this set can be assigned, so each group gets the whole set.",
    );
  } else {
    for (const game of assignedGames(games, plan.groups)) for (const index of game) forGroups[index] += copiesPerPlayer;
    notes.unshift(`The teacher assigns the games in turn round the set, and each group gets ${copiesPerPlayer} of each die in its game.`);
  }
  if (copiesPerPlayer === 2 && plan.mode.dicePerPlayer === 1)
    notes.push("The Twist round plays two dice each, so every die comes in pairs.");
  const diceMaterials = dice.map((die, index) => {
    const used = forGroups[index] > 0;
    const dieSpares = used ? spares * copiesPerPlayer : 0;
    return { name: die.name, forGroups: forGroups[index], spares: dieSpares, total: forGroups[index] + dieSpares };
  });
  notes.push(`Spares: ${spares} of each die in use (one for every four groups, rounded up, times the copies a player holds).`);
  const materials: LessonMaterials = {
    copiesPerPlayer,
    dice: diceMaterials,
    totalDice: diceMaterials.reduce((sum, entry) => sum + entry.total, 0),
    recordingSheets,
    exitTicketSlips,
    notes,
  };
  const gameNames = games.map((game) => game.map((index) => dice[index].name));

  return { materials, verdict: rollsVerdict(plan, dice, main, games, pooledRolls), games: gameNames, mainMatchupSource: main.source };
}

/**
 * Recorded rolls one matchup needs (see `lessonMaterials`), and the proportion they test.
 * Re-roll ties records decided rolls only; ties score nothing records ties that decide nothing, so the decided rolls
 * needed are scaled up by 1 / P(no tie); ties score half treats the mean score like a win rate (Bernoulli variance is the
 * largest a score in [0, 1] can have, so this errs towards more rolls).
 */
function rollsNeededUnderTieRule(
  result: MatchupResult,
  rule: TieRule,
): { testedChance: Fraction; neededRolls: number | null; decidedShare: number } {
  if (rule === "ties-score-half") {
    const testedChance = winProbabilityUnderTieRule(result, rule)!;
    return { testedChance, neededRolls: rollsNeededToExcludeHalf(testedChance, VERDICT_CONFIDENCE), decidedShare: 1 };
  }
  const testedChance = winProbabilityUnderTieRule(result, "re-roll-ties") ?? new Fraction(1, 2);
  const decided = rollsNeededToExcludeHalf(testedChance, VERDICT_CONFIDENCE);
  if (rule === "re-roll-ties" || decided === null) return { testedChance, neededRolls: decided, decidedShare: 1 };
  const decidedShare = fractionToNumber(new Fraction(1).sub(result.tie));
  return { testedChance, neededRolls: Math.ceil(decided / decidedShare), decidedShare };
}

/** The smallest number of groups (up to the lesson limit) whose rolls in the Roll phase give `pair` its needed rolls; null when none does. */
function groupsReaching(
  pair: [number, number],
  games: number[][],
  fromGroups: number,
  matchupChoice: LessonMaterialsFields["matchupChoice"],
  rollsEach: number,
  needed: number,
): number | null {
  for (let groups = fromGroups; groups <= LESSON_LIMITS.groupsMax; groups += 1) {
    if (Math.floor(coverageOf(pair, games, groups, matchupChoice) * rollsEach) >= needed) return groups;
  }
  return null;
}

/** The set's matchup (two players, the lesson's dice each and tie rule) that needs the fewest rolls, or null when every matchup is even. */
function strongestMatchupOf(plan: LessonMaterialsFields, dice: MaterialsDie[], rollsEach: number | null): StrongestMatchup | null {
  let best: StrongestMatchup | null = null;
  dice.forEach((first, firstIndex) =>
    dice.forEach((second, secondIndex) => {
      if (firstIndex === secondIndex) return;
      const result = compareDice(first.faces, second.faces, { dicePerPlayer: plan.mode.dicePerPlayer });
      const winChance = winProbabilityUnderTieRule(result, plan.tieRule);
      if (winChance === null || winChance.compare(new Fraction(1, 2)) <= 0) return;
      const { neededRolls } = rollsNeededUnderTieRule(result, plan.tieRule);
      if (neededRolls === null || (best !== null && neededRolls >= best.neededRolls)) return;
      best = {
        winner: first.name,
        loser: second.name,
        winChance,
        neededRolls,
        groupsInTime: rollsEach === null ? null : Math.ceil(neededRolls / rollsEach),
      };
    }),
  );
  return best;
}

function rollsVerdict(
  plan: LessonMaterialsFields,
  dice: MaterialsDie[],
  main: MainMatchups,
  games: number[][],
  pooledRolls: number,
): RollsVerdict {
  const budget = rollPhaseBudget(rollPhaseMinutes(plan.phases), plan.mode);
  const fitsTime = budget === null || plan.rollsPerGroup <= budget.rollsPerGroup;
  // Only rolls that fit in the Roll phase count: a plan cannot promise more than a group can make.
  const rollsEach = budget === null ? plan.rollsPerGroup : Math.min(plan.rollsPerGroup, budget.rollsPerGroup);
  const cap = budget === null ? LESSON_LIMITS.rollsPerGroupMax : budget.rollsPerGroup;
  const base = {
    pooledRolls,
    budget,
    fitsTime,
    suggestedRollsPerGroup: null,
    suggestedGroups: null,
    virtualTopUp: null,
    tooClose: [],
    strongestMatchup: null,
  };
  if (main.pairs.length === 0) {
    return {
      ...base,
      status: "no-winner",
      matchups: [],
      message: "Every matchup of this set is even, so no number of rolls can show a winner.",
    };
  }
  const timeNote =
    budget === null || fitsTime
      ? ""
      : ` ${plan.rollsPerGroup} rolls per group do not fit in the ${budget.minutes}-minute Roll phase: at ${paceText(budget)} a group makes about ${budget.rollsPerGroup}, so the verdict counts ${budget.rollsPerGroup}.`;
  const neededGroups = plan.matchupChoice === "assigned" && games.length > plan.groups ? games.length : plan.groups;
  const matchups: MatchupVerdict[] = [];
  const pairs: [number, number][] = [];
  for (const pair of main.pairs) {
    // A main matchup not in any game (three players, no cycle through every die) is left out of the verdict.
    if (!games.some((game) => game.includes(pair[0]) && game.includes(pair[1]))) continue;
    const result = compareDice(dice[pair[0]].faces, dice[pair[1]].faces, { dicePerPlayer: plan.mode.dicePerPlayer });
    const winChance = winProbabilityUnderTieRule(result, plan.tieRule) ?? new Fraction(1, 2);
    const { testedChance, neededRolls, decidedShare } = rollsNeededUnderTieRule(result, plan.tieRule);
    const plannedRolls = Math.floor(coverageOf(pair, games, plan.groups, plan.matchupChoice) * rollsEach);
    const enough = neededRolls !== null && plannedRolls >= neededRolls;
    const effectiveRolls = plannedRolls * decidedShare;
    const expectedInterval =
      effectiveRolls > 0 ? wilsonIntervalFromProportion(fractionToNumber(testedChance), effectiveRolls, VERDICT_CONFIDENCE) : null;
    matchups.push({
      winner: dice[pair[0]].name,
      loser: dice[pair[1]].name,
      winChance,
      tieChance: result.tie,
      testedChance,
      plannedRolls,
      neededRolls,
      enough,
      expectedInterval,
    });
    pairs.push(pair);
  }
  if (matchups.length === 0) {
    return { ...base, status: "no-winner", matchups, message: "No game of this lesson plays a matchup that one die wins." };
  }
  if (matchups.every((entry) => entry.enough)) {
    return {
      ...base,
      status: "enough",
      matchups,
      suggestedRollsPerGroup: fitsTime ? null : cap,
      message: `Enough: ${fitsTime ? pooledRolls : rollsEach * plan.groups} pooled rolls give every main matchup the rolls it needs for a 95% interval that leaves out 1/2.${timeNote}`,
    };
  }

  // Groups first: the most any short matchup needs at the rolls that fit, within the lesson limit.
  let groups = neededGroups;
  const tooClose: string[] = [];
  matchups.forEach((entry, index) => {
    if (entry.enough) return;
    const reaching =
      entry.neededRolls === null ? null : groupsReaching(pairs[index], games, neededGroups, plan.matchupChoice, cap, entry.neededRolls);
    if (reaching === null) tooClose.push(`${entry.winner} over ${entry.loser}`);
    else groups = Math.max(groups, reaching);
  });
  // Then the rolls per group those groups need (never more than fit in the Roll phase).
  let rollsPerGroup = 1;
  let virtualTopUp = 0;
  matchups.forEach((entry, index) => {
    if (entry.neededRolls === null) return;
    const coverage = coverageOf(pairs[index], games, groups, plan.matchupChoice);
    const perGroup = coverage === 0 ? cap : Math.ceil(entry.neededRolls / coverage);
    rollsPerGroup = Math.max(rollsPerGroup, Math.min(cap, perGroup));
    virtualTopUp = Math.max(virtualTopUp, entry.neededRolls - Math.floor(coverage * cap));
  });
  const suggestedGroups = groups > plan.groups ? groups : null;
  const suggestedRolls = rollsPerGroup > plan.rollsPerGroup || !fitsTime ? rollsPerGroup : null;
  const short = matchups.filter((entry) => !entry.enough).length;
  const parts = [
    ...(suggestedGroups === null
      ? []
      : [
          `${suggestedGroups} groups${suggestedGroups === neededGroups && neededGroups > plan.groups ? ", so every main matchup is played" : ""}`,
        ]),
    ...(suggestedRolls === null ? [] : [`${suggestedRolls} rolls per group`]),
  ];
  const topUp = tooClose.length > 0 && virtualTopUp > 0 ? virtualTopUp : null;
  const strongest = tooClose.length > 0 ? strongestMatchupOf(plan, dice, budget === null ? null : cap) : null;
  const sentences = [`Not enough yet: ${short} of ${matchups.length} main matchups fall short.${timeNote}`];
  if (parts.length > 0) sentences.push(`Try ${parts.join(" and ")}.`);
  if (tooClose.length > 0) {
    const limit = budget === null ? "" : ` in the ${budget.minutes}-minute Roll phase`;
    sentences.push(
      `${tooClose.join(", ")} ${tooClose.length === 1 ? "is" : "are"} too close to show in one lesson: even ${LESSON_LIMITS.groupsMax} groups cannot make the rolls needed${limit}.`,
    );
    if (topUp !== null)
      sentences.push(
        `A Virtual class could top the class up with about ${topUp} simulated rolls of each short matchup (marked simulated).`,
      );
    if (strongest !== null) {
      const s = strongest as StrongestMatchup;
      const groupsText =
        s.groupsInTime === null ? "" : `, about ${s.groupsInTime} ${s.groupsInTime === 1 ? "group's" : "groups'"} Roll phase`;
      sentences.push(
        `The set's strongest matchup, ${s.winner} over ${s.loser} (wins ${fractionToString(s.winChance)}), needs about ${s.neededRolls} rolls${groupsText}.`,
      );
    }
  }
  return {
    status: "not-enough",
    pooledRolls,
    budget,
    fitsTime,
    matchups,
    suggestedRollsPerGroup: suggestedRolls,
    suggestedGroups,
    virtualTopUp: topUp,
    tooClose,
    strongestMatchup: strongest,
    message: sentences.join(" "),
  };
}
