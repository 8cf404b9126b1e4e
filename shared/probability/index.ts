// Public API of the exact probability engine; the one barrel file, mandated so callers import from one place.
export { analyzeSet } from "./analyze-set";
export type { BeatsEdge, BestCounter, DiceCycle, MatchupEntry, MatchupReversal, SetAnalysis, SetLevelAnalysis } from "./analyze-set";
export { beatsGraph, matchupRelation } from "./beats-graph";
export type { MatchupRelation } from "./beats-graph";
export { binomialTest, binomialTestPValue, BINOMIAL_TRIALS_MAX } from "./binomial-test";
export type { BinomialTestResult } from "./binomial-test";
export { chiSquareCriticalValue, chiSquareGoodnessOfFit, chiSquareUpperTail } from "./chi-square";
export type { ChiSquareResult } from "./chi-square";
export { PLANNED_ROLLS_MAX, rollsNeededToExcludeHalf } from "./class-planning";
export { countDistributionFromFaces, countsBelow, probabilityMapFromCounts, probabilityOfValue } from "./count-distribution";
export type { CountDistribution } from "./count-distribution";
export { diceSetChecked, diceSetSchema, namedDieSchema, SET_SIZE_MAX, SET_SIZE_MIN } from "./dice-set";
export type { NamedDie } from "./dice-set";
export {
  DICE_PER_PLAYER_MAX,
  dicePerPlayerChecked,
  dicePerPlayerSchema,
  dieFacesChecked,
  dieFacesSchema,
  FACE_VALUE_MAX,
  FACE_VALUE_MIN,
  faceValueSchema,
  FACES_MAX,
  FACES_MIN,
  InvalidDieError,
} from "./die";
export type { DieFaces } from "./die";
export { fractionToDecimal, fractionToNumber, fractionToPercent, fractionToString } from "./format";
export { groupedTreeDiagram } from "./grouped-tree";
export type { GroupedTree, GroupedTreeBand } from "./grouped-tree";
export { logGamma, regularizedGammaLower, regularizedGammaUpper } from "./incomplete-gamma";
export { compareDice, matchupCountsFromDistributions, matchupResultFromCounts } from "./matchup";
export type { MatchupCounts, MatchupResult } from "./matchup";
export { beatAllCountsFromDistributions, beatAllProbability, multiPlayerMatchup } from "./multi-player";
export type { MultiPlayerResult } from "./multi-player";
export { normalDistribution, normalQuantile } from "./normal-quantile";
export { outcomeOfTotals } from "./outcome";
export type { Outcome } from "./outcome";
export { pickAdviceForThreePlayers } from "./pick-advisor";
export type { PickAdvice, PickCandidate } from "./pick-advisor";
export { mulberry32, randomBelow } from "./seeded-random";
export type { RandomSource } from "./seeded-random";
export { expectedPoints, expectedWins, SERIES_GAMES_MAX, seriesOutcome, seriesOutcomeForDice } from "./series";
export type { SeriesOutcome } from "./series";
export { simpleCycles } from "./simple-cycles";
export { STRONGEST_CYCLE_VERTICES_MAX, strongestHamiltonianCycle } from "./strongest-hamiltonian-cycle";
export type { StrongestHamiltonianCycle } from "./strongest-hamiltonian-cycle";
export type { DirectedGraph, SimpleCycles } from "./simple-cycles";
export { matchupSimulation, SIMULATION_ROLLS_MAX } from "./simulation";
export type { MatchupSimulation, SimulatedRoll } from "./simulation";
export { sumCountDistribution, sumDistribution } from "./sum-distribution";
export { TIE_RULES, winProbabilitiesByTieRule, winProbabilityUnderTieRule } from "./tie-rule";
export type { TieRule } from "./tie-rule";
export { treeDiagram } from "./tree-diagram";
export type { TreeBranch, TreeDiagram, TreeLeaf } from "./tree-diagram";
export { twoWayTable } from "./two-way-table";
export type { TableCell, TableHeading, TwoWayTable } from "./two-way-table";
export { criticalValueForConfidence, wilsonInterval, wilsonIntervalFromProportion } from "./wilson-interval";
export type { ProportionInterval } from "./wilson-interval";
