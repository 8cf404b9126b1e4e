import { useId, useState } from "react";
import {
  compareDice,
  expectedPoints,
  expectedWins,
  fractionToDecimal,
  rollsNeededToExcludeHalf,
  SERIES_GAMES_MAX,
  seriesOutcome,
  TIE_RULES,
  type TieRule,
  winProbabilityUnderTieRule,
} from "@shared/probability/index";
import { classTimePlan, rollPhaseBudget, type RollPhaseBudget } from "@shared/lessons/roll-pace";
import { LESSON_LIMITS } from "@shared/schemas/lessons";
import { ChoiceGroup } from "@/components/ui/choice-group";
import { SelectField } from "@/components/ui/select-field";
import { TextField } from "@/components/ui/text-field";
import { modeLabel, probabilityText } from "@/lib/probability-text";
import type { BenchDie } from "../hooks/use-set-analysis";
import { MatchupChooser, type MatchupChoice } from "./matchup-chooser";

export const tieRuleLabels: Record<TieRule, string> = {
  "re-roll-ties": "re-roll ties",
  "ties-score-half": "ties score half",
  "ties-score-nothing": "ties score nothing",
};

const seriesLengths = Array.from({ length: (SERIES_GAMES_MAX + 1) / 2 }, (_, index) => 2 * index + 1);
const overviewLengths = [1, 3, 5, 7, 9, 11, 15, 21];

/** A whole number typed into a box, or null while it is not one in range. */
function wholeNumber(text: string, min: number, max: number): number | null {
  const value = Number(text);
  return text.trim() !== "" && Number.isInteger(value) && value >= min && value <= max ? value : null;
}

/**
 * The Series planner: for a chosen matchup and tie rule, the chance of winning a best-of-N series, the expected wins
 * in a number of rolls, and how many pooled rolls the class needs before a 95% interval is expected to leave out 1/2.
 */
export function SeriesPlanner({
  dice,
  choice,
  onChoice,
}: {
  dice: BenchDie[];
  choice: MatchupChoice;
  onChoice: (choice: MatchupChoice) => void;
}) {
  const [tieRule, setTieRule] = useState<TieRule>("re-roll-ties");
  const [games, setGames] = useState(5);
  const [rollsText, setRollsText] = useState("30");
  const [groupsText, setGroupsText] = useState("8");
  const [minutesText, setMinutesText] = useState("15");
  const rollsId = useId();
  const first = dice[choice.first];
  const second = dice[choice.second];
  const result = compareDice(first.faces, second.faces, { dicePerPlayer: choice.dicePerPlayer });
  const everyRollTies = result.win.add(result.loss).equals(0);
  const rolls = wholeNumber(rollsText, 1, 100_000);
  const groups = wholeNumber(groupsText, 1, 60);
  const minutes = wholeNumber(minutesText, 1, LESSON_LIMITS.phaseMinutesMax);
  const budget = minutes === null ? null : rollPhaseBudget(minutes, { dicePerPlayer: choice.dicePerPlayer, players: 2 });
  const underRule = winProbabilityUnderTieRule(result, tieRule);
  const pooled = underRule === null ? null : rollsNeededToExcludeHalf(underRule);
  const leader = underRule !== null && underRule.compare(0.5) < 0 ? second.name : first.name;

  return (
    <div className="flex flex-col gap-5" data-testid="series-planner">
      <MatchupChooser dice={dice} value={choice} onChange={onChoice} modes={[1, 2, 3]} />
      <ChoiceGroup
        legend="Tie rule"
        value={tieRule}
        onChange={setTieRule}
        options={TIE_RULES.map((rule) => ({ value: rule, label: tieRuleLabels[rule] }))}
      />
      <p>
        One roll, {modeLabel(choice.dicePerPlayer)}: {first.name} wins {probabilityText(result.win)}, ties {probabilityText(result.tie)},
        loses {probabilityText(result.loss)}.
      </p>
      {everyRollTies && tieRule === "re-roll-ties" ? (
        <p className="rounded-lg border-2 border-beacon bg-beacon-light p-3">
          Every roll of this matchup ties, so with re-rolled ties a series never ends.
        </p>
      ) : (
        <>
          <section aria-labelledby="series-heading" className="flex flex-col gap-2">
            <h3 id="series-heading" className="text-xl">
              Best-of-N series
            </h3>
            <div className="max-w-56">
              <SelectField
                label="Series length"
                options={seriesLengths.map((length) => ({ value: String(length), label: `best of ${length}` }))}
                value={String(games)}
                onChange={(event) => setGames(Number(event.target.value))}
              />
            </div>
            <SeriesSentence
              first={first.name}
              second={second.name}
              outcome={seriesOutcome(result, games, tieRule)}
              games={games}
              tieRule={tieRule}
            />
            <div
              className="relative max-w-full overflow-x-auto rounded-xl border-2 border-line bg-shell"
              tabIndex={0}
              role="region"
              aria-label="Series chances by length"
            >
              <table className="w-full border-collapse text-sm">
                <caption className="px-3 py-2 text-left text-ink-soft">
                  {first.name}&rsquo;s chance of winning the series, by its length ({tieRuleLabels[tieRule]})
                </caption>
                <thead>
                  <tr>
                    <th scope="col" className="border-b-2 border-line p-2 text-left">
                      Series
                    </th>
                    <th scope="col" className="border-b-2 border-line p-2 text-left">
                      {first.name} wins
                    </th>
                    <th scope="col" className="border-b-2 border-line p-2 text-left">
                      Drawn
                    </th>
                    <th scope="col" className="border-b-2 border-line p-2 text-left">
                      {second.name} wins
                    </th>
                  </tr>
                </thead>
                <tbody>
                  {overviewLengths.map((length) => {
                    const outcome = seriesOutcome(result, length, tieRule);
                    return (
                      <tr key={length} className={`border-b border-line/60 ${length === games ? "bg-tide-light font-bold" : ""}`}>
                        <th scope="row" className="p-2 text-left">
                          best of {length}
                          {length === games && <span className="sr-only"> (chosen)</span>}
                        </th>
                        <td className="p-2">{fractionToDecimal(outcome.win)}</td>
                        <td className="p-2">{fractionToDecimal(outcome.draw)}</td>
                        <td className="p-2">{fractionToDecimal(outcome.loss)}</td>
                      </tr>
                    );
                  })}
                </tbody>
              </table>
            </div>
          </section>
          <section aria-labelledby="expected-heading" className="flex flex-col gap-2">
            <h3 id="expected-heading" className="text-xl">
              Expected wins
            </h3>
            <div className="max-w-56">
              <TextField
                id={rollsId}
                label="Rolls played"
                inputMode="numeric"
                value={rollsText}
                onChange={(event) => setRollsText(event.target.value)}
                error={rolls === null ? "Enter a whole number of rolls from 1 to 100000." : undefined}
              />
            </div>
            {rolls !== null && (
              <p data-testid="expected-wins">
                In {rolls} rolls {first.name} expects to win {fractionToDecimal(expectedWins(result, rolls), 2)} of them
                {tieRule !== "ties-score-nothing" && (
                  <>
                    {" "}
                    and score {expectedPointsText(result, rolls, tieRule)} points ({tieRuleLabels[tieRule]})
                  </>
                )}
                ; {second.name} expects {fractionToDecimal(expectedWins({ win: result.loss, tie: result.tie, loss: result.win }, rolls), 2)}{" "}
                wins.
              </p>
            )}
          </section>
          <section aria-labelledby="pooled-heading" className="flex flex-col gap-2">
            <h3 id="pooled-heading" className="text-xl">
              Rolls the class needs
            </h3>
            <div className="max-w-56">
              <TextField
                label="Groups in the class"
                inputMode="numeric"
                value={groupsText}
                onChange={(event) => setGroupsText(event.target.value)}
                error={groups === null ? "Enter a whole number of groups from 1 to 60." : undefined}
              />
              <TextField
                label="Roll phase (minutes)"
                inputMode="numeric"
                value={minutesText}
                onChange={(event) => setMinutesText(event.target.value)}
                error={minutes === null ? `Enter a whole number of minutes from 1 to ${LESSON_LIMITS.phaseMinutesMax}.` : undefined}
              />
            </div>
            <p data-testid="pooled-rolls">
              {pooled === null ? (
                "This matchup is even under this tie rule, so no number of rolls will show a better die."
              ) : (
                <>
                  Pool about <strong>{pooled}</strong> rolls of this matchup before a 95% confidence interval (Wilson score) for {leader}
                  &rsquo;s winning chance is expected to leave out 1/2, so the class can see {leader} is the better die
                  {groups !== null && (
                    <>
                      {" "}
                      — about <strong>{Math.ceil(pooled / groups)}</strong> rolls for each of {groups} groups
                    </>
                  )}
                  .
                </>
              )}
            </p>
            {pooled !== null && groups !== null && budget !== null && (
              <p data-testid="pooled-rolls-in-time">
                <TimeAdvice pooled={pooled} groups={groups} budget={budget} />
              </p>
            )}
          </section>
        </>
      )}
    </div>
  );
}

function expectedPointsText(result: ReturnType<typeof compareDice>, rolls: number, tieRule: TieRule): string {
  const points = expectedPoints(result, rolls, tieRule);
  return points === null ? "no" : fractionToDecimal(points, 2);
}

function SeriesSentence({
  first,
  second,
  outcome,
  games,
  tieRule,
}: {
  first: string;
  second: string;
  outcome: ReturnType<typeof seriesOutcome>;
  games: number;
  tieRule: TieRule;
}) {
  return (
    <p data-testid="series-outcome">
      In a best-of-{games} series ({tieRuleLabels[tieRule]}), {first} wins the series with probability{" "}
      <strong>{probabilityText(outcome.win)}</strong>, {second} with {probabilityText(outcome.loss)}
      {tieRule === "re-roll-ties" ? "." : `, and it ends level with ${probabilityText(outcome.draw)}.`}
    </p>
  );
}

/** Whether the class can make the pooled rolls in the Roll phase at the common-practice pace, and what to do if not. */
function TimeAdvice({ pooled, groups, budget }: { pooled: number; groups: number; budget: RollPhaseBudget }) {
  const pace = `At about ${budget.rollsPerMinute} rolls a minute (a common-practice pace, not a published rule) a group makes about ${budget.rollsPerGroup} rolls in ${budget.minutes} minutes`;
  const plan = classTimePlan(pooled, groups, budget, LESSON_LIMITS.groupsMax);
  if (plan.kind === "fits")
    return (
      <>
        {pace}, so {groups} groups have time for their {plan.perGroup} each.
      </>
    );
  if (plan.kind === "more-groups") {
    return (
      <>
        {pace}, not {plan.perGroup}: play this matchup with about <strong>{plan.groupsNeeded}</strong> groups, or top the class up with the
        Virtual class (simulated rolls, marked simulated).
      </>
    );
  }
  return (
    <>
      {pace}: this matchup is too close to show in one lesson ({LESSON_LIMITS.groupsMax} groups make about {plan.mostRolls}). Choose a
      stronger matchup, or pool several classes or the Virtual class.
    </>
  );
}
