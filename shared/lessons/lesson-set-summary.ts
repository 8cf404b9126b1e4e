import { analyzeSet, fractionToString, type SetLevelAnalysis } from "../probability/index";

/** Plain sentences about a lesson's dice set for the printed plan. */
export interface LessonSetSummary {
  /** e.g. "Skua beats Fulmar (5/9), Fulmar beats Gannet (5/9) and Gannet beats Skua (5/9)." — null with no cycle. */
  cycleSentence: string | null;
  /** e.g. "Whichever die you pick, another die beats it." — null when some die is unbeaten. */
  noBestDieSentence: string | null;
  /** How the matchups change from one die each to two dice each, one sentence per changed matchup. */
  twoDiceChanges: string[];
  /** Every matchup one die wins at the lesson's dice per player, with its exact one-roll chances. */
  matchups: { winner: string; loser: string; win: string; tie: string; loss: string }[];
}

function joinSentence(parts: string[]): string {
  return parts.length < 2 ? parts.join("") : `${parts.slice(0, -1).join(", ")} and ${parts[parts.length - 1]}`;
}

function cycleSentenceOf(level: SetLevelAnalysis): string | null {
  const cycle =
    level.strongestHamiltonianCycle ??
    level.cycles.reduce<SetLevelAnalysis["cycles"][number] | null>(
      (longest, entry) => (longest === null || entry.indices.length > longest.indices.length ? entry : longest),
      null,
    );
  if (!cycle) return null;
  const names = cycle.dice;
  const parts = cycle.indices.map((index, position) => {
    const next = cycle.indices[(position + 1) % cycle.indices.length];
    return `${names[position]} beats ${names[(position + 1) % names.length]} (${fractionToString(level.matrix[index][next]!.win)})`;
  });
  return `${joinSentence(parts)}.`;
}

/**
 * The set's story at the lesson's dice per player, from the exact analysis (analyzeSet): its longest cycle (one through
 * every die when there is one), whether every die is beaten, each winning matchup's fractions, and what changes with two dice each.
 */
export function lessonSetSummary(dice: { name: string; faces: number[] }[], dicePerPlayer: 1 | 2): LessonSetSummary {
  const analysis = analyzeSet(dice, { dicePerPlayer: 2, cycleLimit: 500 });
  const level = analysis.levels.find((entry) => entry.dicePerPlayer === dicePerPlayer)!;
  const matchups = level.beats.map((edge) => {
    const entry = level.matrix[edge.winnerIndex][edge.loserIndex]!;
    return {
      winner: edge.winner,
      loser: edge.loser,
      win: fractionToString(entry.win),
      tie: fractionToString(entry.tie),
      loss: fractionToString(entry.loss),
    };
  });
  const twoDiceChanges = analysis.reversals
    .filter((reversal) => reversal.toDicePerPlayer === 2)
    .map((reversal) => {
      const describe = (relation: string) =>
        relation === "beats"
          ? `${reversal.first} beats ${reversal.second}`
          : relation === "loses"
            ? `${reversal.second} beats ${reversal.first}`
            : `${reversal.first} and ${reversal.second} are even`;
      return `With one die each ${describe(reversal.before)}; with two dice each ${describe(reversal.after)}.`;
    });
  return {
    cycleSentence: cycleSentenceOf(level),
    noBestDieSentence: level.everyDieIsBeaten ? "Whichever die you pick, another die beats it: there is no best die." : null,
    twoDiceChanges,
    matchups,
  };
}
