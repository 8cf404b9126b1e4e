import type { MatchupReversal, SetAnalysis, SetLevelAnalysis } from "@shared/probability/index";
import { countWord, modeLabel, modeTitle, probabilityText } from "@/lib/probability-text";
import { cycleWords, preferredCycle } from "./beats-graph";

/** Plain sentences about one level: is every die beaten, and which cycle runs through the dice. */
function levelSentences(level: SetLevelAnalysis): { lead: string; rest: string } {
  const lead = `${modeTitle(level.dicePerPlayer)}: `;
  let beaten: string;
  if (level.everyDieIsBeaten) beaten = "every die is beaten by another.";
  else {
    const unbeaten = level.bestCounters.filter((counter) => counter.counter === null).map((counter) => counter.die);
    beaten = `no die beats ${unbeaten.join(" or ")}, so ${unbeaten.length === 1 ? "it is a safe pick" : "they are safe picks"}.`;
  }
  const cycle = preferredCycle(level.cycles);
  let cycleText: string;
  if (cycle >= 0) {
    const shown = level.cycles[cycle];
    const through = shown.indices.length === level.matrix.length ? "through every die" : `through ${countWord(shown.indices.length)} dice`;
    const others = level.cycles.length > 1 ? ` (${countWord(level.cycles.length)} cycles in all)` : "";
    cycleText = `The dice beat each other round a cycle ${through}: ${cycleWords(shown)}, weakest link ${probabilityText(shown.weakestWin)}${others}.`;
  } else cycleText = "There is no cycle: the dice can be ranked from strongest to weakest.";
  return { lead, rest: `${beaten} ${cycleText}` };
}

function capitalised(text: string): string {
  return text.charAt(0).toUpperCase() + text.slice(1);
}

function reversalText(reversal: MatchupReversal): string {
  const later = modeLabel(reversal.toDicePerPlayer);
  const describe = (relation: string, mode: string) =>
    relation === "beats"
      ? `beats ${reversal.second} with ${mode}`
      : relation === "loses"
        ? `loses to ${reversal.second} with ${mode}`
        : `is even with ${reversal.second} with ${mode}`;
  return `${reversal.first} ${describe(reversal.before, "one die each")} but ${describe(reversal.after, later)}`;
}

/** Sentences about matchups that reverse (or change) from one die each to `dicePerPlayer` dice each. */
function reversalSentence(reversals: MatchupReversal[], dicePerPlayer: number): string | null {
  const reversed = reversals.filter((reversal) => reversal.toDicePerPlayer === dicePerPlayer && reversal.kind === "reversed");
  const changed = reversals.filter((reversal) => reversal.toDicePerPlayer === dicePerPlayer && reversal.kind === "changed");
  const mode = modeLabel(dicePerPlayer);
  const parts: string[] = [];
  if (reversed.length === 1) parts.push(`This matchup reverses with ${mode}: ${reversalText(reversed[0])}.`);
  else if (reversed.length > 1) {
    parts.push(`These ${countWord(reversed.length)} matchups reverse with ${mode}: ${reversed.map(reversalText).join("; ")}.`);
  }
  if (changed.length > 0) {
    const lead = changed.length === 1 ? "One matchup changes" : `${capitalised(countWord(changed.length))} matchups change`;
    parts.push(`${lead} with ${mode}: ${changed.map(reversalText).join("; ")}.`);
  }
  return parts.length > 0 ? parts.join(" ") : null;
}

/** The set's analysis in plain sentences a teacher could read out. */
export function SetSummary({ analysis }: { analysis: SetAnalysis }) {
  const levels = analysis.levels.map(levelSentences);
  const twoDice = reversalSentence(analysis.reversals, 2);
  const threeDice = reversalSentence(analysis.reversals, 3);
  return (
    <section aria-labelledby="set-summary-heading" className="rounded-xl border-2 border-tide bg-tide-light/50 p-4">
      <h3 id="set-summary-heading" className="text-xl">
        In plain words
      </h3>
      <ul className="mt-2 flex list-disc flex-col gap-1 pl-5" data-testid="set-summary">
        {levels.map((level) => (
          <li key={level.lead}>
            <strong>{level.lead}</strong>
            {level.rest}
          </li>
        ))}
        <li>{twoDice ?? "No matchup reverses with two dice each."}</li>
        {threeDice && <li>{threeDice}</li>}
      </ul>
    </section>
  );
}
