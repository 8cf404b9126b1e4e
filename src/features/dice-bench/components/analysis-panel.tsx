import { useState } from "react";
import { Alert } from "@/components/ui/alert";
import { ChoiceGroup } from "@/components/ui/choice-group";
import { Tabs } from "@/components/ui/tabs";
import { modeLabel } from "@/lib/probability-text";
import type { SetAnalysisState } from "../hooks/use-set-analysis";
import { BeatsGraph } from "./beats-graph";
import { MatchupChooser, type MatchupChoice, validMatchup } from "./matchup-chooser";
import { MatchupMatrix } from "./matchup-matrix";
import { PickAdvisor } from "./pick-advisor";
import { SeriesPlanner } from "./series-planner";
import { SetSummary } from "./set-summary";
import { MatchupTree, type TreeGrouping } from "@/components/tree-diagram";
import { MatchupTable } from "./two-way-table-figure";

type AnalysisTab = "matchups" | "tree" | "pick" | "series";

/** The exact analysis of the set as it stands: summary sentences, then the matchups, tree diagram, Pick advisor and Series planner. */
export function AnalysisPanel({ state }: { state: SetAnalysisState }) {
  const [tab, setTab] = useState<AnalysisTab>("matchups");
  const [level, setLevel] = useState("1");
  const [treeChoice, setTreeChoice] = useState<MatchupChoice>({ first: 0, second: 1, dicePerPlayer: 1 });
  const [seriesChoice, setSeriesChoice] = useState<MatchupChoice>({ first: 0, second: 1, dicePerPlayer: 1 });
  const [grouping, setGrouping] = useState<TreeGrouping>("total");
  const { analysis, dice, leftOut } = state;

  if (analysis === null) {
    return (
      <Alert tone="info" title="Nothing to analyse yet">
        Give at least two dice a name and at least two valid faces each; the analysis appears here as you type.
      </Alert>
    );
  }
  const shownLevel = analysis.levels.find((each) => String(each.dicePerPlayer) === level) ?? analysis.levels[0];
  const tree = validMatchup(treeChoice, dice.length);
  const series = validMatchup(seriesChoice, dice.length);
  const treeFirst = dice[tree.first];
  const treeSecond = dice[tree.second];

  return (
    <div className="flex min-w-0 flex-col gap-4" aria-busy={state.isStale || undefined}>
      {leftOut > 0 && (
        <Alert tone="caution" title={leftOut === 1 ? "One die is left out" : `${leftOut} dice are left out`}>
          The analysis covers the {dice.length} dice whose names and faces are valid; fix the marked fields to bring the rest in.
        </Alert>
      )}
      <SetSummary analysis={analysis} />
      <Tabs
        label="Views of the analysis"
        selected={tab}
        onSelect={(id) => setTab(id as AnalysisTab)}
        items={[
          { id: "matchups", label: "Matchups" },
          { id: "tree", label: "Tree diagram" },
          { id: "pick", label: "Pick advisor" },
          { id: "series", label: "Series planner" },
        ]}
      >
        {tab === "matchups" && (
          <div className="flex flex-col gap-4">
            <ChoiceGroup
              legend="Each player rolls"
              value={level}
              onChange={setLevel}
              options={analysis.levels.map((each) => ({ value: String(each.dicePerPlayer), label: modeLabel(each.dicePerPlayer) }))}
            />
            <MatchupMatrix level={shownLevel} dice={dice} />
            <h3 className="text-xl">Beats graph, {modeLabel(shownLevel.dicePerPlayer)}</h3>
            <BeatsGraph key={`${shownLevel.dicePerPlayer}-${dice.map((die) => die.name).join("|")}`} level={shownLevel} dice={dice} />
          </div>
        )}
        {tab === "tree" && (
          <div className="flex flex-col gap-4">
            <MatchupChooser dice={dice} value={tree} onChange={setTreeChoice} modes={[1, 2]} />
            <h3 className="text-xl">
              Tree diagram: {treeFirst.name} against {treeSecond.name}, {modeLabel(tree.dicePerPlayer)}
            </h3>
            <ChoiceGroup
              legend="Group a large tree by"
              value={grouping}
              onChange={setGrouping}
              options={[
                { value: "total", label: `${treeFirst.name}'s total` },
                { value: "outcome", label: "outcome" },
              ]}
              hint="Used when the tree has too many paths to draw one by one."
            />
            <MatchupTree first={treeFirst} second={treeSecond} dicePerPlayer={tree.dicePerPlayer} grouping={grouping} />
            <h3 className="text-xl">Two-way table of {tree.dicePerPlayer === 1 ? "faces" : "sums"}</h3>
            <MatchupTable first={treeFirst} second={treeSecond} dicePerPlayer={tree.dicePerPlayer} />
          </div>
        )}
        {tab === "pick" && <PickAdvisor analysis={analysis} dice={dice} />}
        {tab === "series" && <SeriesPlanner dice={dice} choice={series} onChoice={setSeriesChoice} />}
      </Tabs>
    </div>
  );
}
