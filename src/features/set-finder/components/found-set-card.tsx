import { diePalette } from "@shared/schemas/dice-sets";
import type { FoundSet, SetFinderRequest } from "@shared/schemas/set-finder";
import { DieSwatch } from "@/components/dice/die-swatch";
import { Button } from "@/components/ui/button";

/** A found set as a Dice bench draft: palette colours in order, a plain name and a description of how it was found. */
export function draftFromFoundSet(found: FoundSet, rank: number, request: SetFinderRequest) {
  const values =
    request.faceValues.kind === "range"
      ? `values ${request.faceValues.min} to ${request.faceValues.max}`
      : `values ${request.faceValues.values.join(", ")}`;
  return {
    name: `Set finder result ${rank}`,
    description: `Found by the Set finder: ${found.dice.length} dice with ${request.facesPerDie} faces, ${values}; weakest win in the cycle ${found.figures.weakestCycleWin}.`,
    visibility: "private" as const,
    dice: found.dice.map((die, index) => ({
      name: die.name,
      faces: [...die.faces],
      colour: diePalette[index % diePalette.length].colour,
      pattern: diePalette[index % diePalette.length].pattern,
    })),
  };
}

function yesNo(value: boolean) {
  return value ? "yes" : "no";
}

/** One ranked result with its key figures, and the way into the Dice bench. */
export function FoundSetCard({ found, rank, onOpen }: { found: FoundSet; rank: number; onOpen: () => void }) {
  const { figures } = found;
  const cycle = figures.cycleOrder.map((index) => found.dice[index].name);
  const headingId = `found-${rank}`;
  return (
    <li
      className="flex min-w-0 flex-col gap-3 rounded-2xl border-2 border-line bg-shell p-4"
      aria-labelledby={headingId}
      data-testid="found-set"
    >
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h3 id={headingId} className="text-xl">
          <span className="mr-2 inline-flex h-8 min-w-8 items-center justify-center rounded-full bg-ink px-2 text-base text-white">
            {rank}
          </span>
          Weakest win {figures.weakestCycleWin} ({figures.weakestCycleWinDecimal.toFixed(3)})
        </h3>
        <Button variant="secondary" onClick={onOpen}>
          Open in the Dice bench<span className="sr-only"> (result {rank})</span>
        </Button>
      </div>
      <ul className="flex flex-col gap-1">
        {found.dice.map((die, index) => (
          <li key={die.name} className="flex flex-wrap items-center gap-2">
            <DieSwatch
              colour={diePalette[index % diePalette.length].colour}
              pattern={diePalette[index % diePalette.length].pattern}
              className="h-5 w-5"
            />
            <strong>{die.name}</strong>
            <span className="break-all font-mono">{die.faces.join(", ")}</span>
          </li>
        ))}
      </ul>
      {(found.variants ?? 0) > 0 && (
        <p className="text-sm">
          and {found.variants} {found.variants === 1 ? "variant" : "variants"}: other sets found that play every matchup asked about with
          the same chances
        </p>
      )}
      <dl className="grid gap-x-4 gap-y-1 text-sm sm:grid-cols-2">
        <div>
          <dt className="inline font-bold">Cycle, one die each: </dt>
          <dd className="inline">
            {cycle.join(" → ")} → {cycle[0]} ({figures.cycleWins.join(", ")})
          </dd>
        </div>
        <div>
          <dt className="inline font-bold">Reverses with two dice each: </dt>
          <dd className="inline">{yesNo(figures.reversesWithTwoDice)}</dd>
        </div>
        {figures.weakestTwoDiceWin !== null && (
          <div>
            <dt className="inline font-bold">Weakest win, two dice each: </dt>
            <dd className="inline">
              {figures.weakestTwoDiceWin}
              {figures.weakestTwoDiceWinDecimal !== null ? ` (${figures.weakestTwoDiceWinDecimal.toFixed(3)})` : ""}
            </dd>
          </div>
        )}
        {figures.secondCycleOrder && (
          <div>
            <dt className="inline font-bold">Second cycle: </dt>
            <dd className="inline">{figures.secondCycleOrder.map((index) => found.dice[index].name).join(" → ")}</dd>
          </div>
        )}
        <div>
          <dt className="inline font-bold">A die beats any two opponents: </dt>
          <dd className="inline">{yesNo(figures.beatsAnyTwoOpponents)}</dd>
        </div>
        <div>
          <dt className="inline font-bold">Ties possible: </dt>
          <dd className="inline">{yesNo(figures.hasTies)}</dd>
        </div>
        <div>
          <dt className="inline font-bold">Faces: </dt>
          <dd className="inline">
            {figures.smallestFace} to {figures.largestFace}, total {figures.faceTotal}
          </dd>
        </div>
      </dl>
    </li>
  );
}
