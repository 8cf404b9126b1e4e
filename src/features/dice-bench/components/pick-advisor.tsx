import type { SetAnalysis } from "@shared/probability/index";
import { DieSwatch } from "@/components/dice/die-swatch";
import { modeLabel, probabilityText } from "@/lib/probability-text";
import type { BenchDie } from "../hooks/use-set-analysis";

/**
 * The Pick advisor: against one opponent, the die that beats theirs (one and two dice each);
 * with three players, for each pair of opponents' dice, the die and mode most likely to beat both at once.
 */
export function PickAdvisor({ analysis, dice }: { analysis: SetAnalysis; dice: BenchDie[] }) {
  const [oneEach, twoEach] = [
    analysis.levels.find((level) => level.dicePerPlayer === 1)!,
    analysis.levels.find((level) => level.dicePerPlayer === 2)!,
  ];
  const dieLabel = (index: number) => (
    <span className="inline-flex items-center gap-1.5">
      <DieSwatch colour={dice[index].colour} pattern={dice[index].pattern} className="h-5 w-5" />
      {dice[index].name}
    </span>
  );
  return (
    <div className="flex flex-col gap-6" data-testid="pick-advisor">
      <section aria-labelledby="pick-two-heading" className="flex flex-col gap-2">
        <h3 id="pick-two-heading" className="text-xl">
          Two players: your opponent has chosen
        </h3>
        <p className="text-ink-soft">
          The die to take against each choice, and the chance it wins a single roll. The better mode is marked ★ best.
        </p>
        <div
          className="relative max-w-full overflow-x-auto rounded-xl border-2 border-line bg-shell"
          tabIndex={0}
          role="region"
          aria-label="Pick advisor, two players"
        >
          <table className="w-full border-collapse text-sm">
            <thead>
              <tr>
                <th scope="col" className="border-b-2 border-line p-2 text-left">
                  Opponent&rsquo;s die
                </th>
                <th scope="col" className="border-b-2 border-line p-2 text-left">
                  Take, one die each
                </th>
                <th scope="col" className="border-b-2 border-line p-2 text-left">
                  Take, two dice each
                </th>
              </tr>
            </thead>
            <tbody>
              {dice.map((die, index) => {
                const one = oneEach.bestCounters[index];
                const two = twoEach.bestCounters[index];
                const oneBetter = one.counter !== null && (two.counter === null || one.win.gte(two.win));
                const cell = (counter: typeof one, best: boolean) =>
                  counter.counter === null || counter.counterIndex === null ? (
                    <span className="text-ink-soft">no die beats it</span>
                  ) : (
                    <span className="flex flex-wrap items-center gap-x-2">
                      {dieLabel(counter.counterIndex)}
                      <span className="whitespace-nowrap">wins {probabilityText(counter.win)}</span>
                      {best && <strong className="whitespace-nowrap">★ best</strong>}
                    </span>
                  );
                return (
                  <tr key={die.name} className="border-b border-line/60">
                    <th scope="row" className="p-2 text-left">
                      {dieLabel(index)}
                    </th>
                    <td className="p-2">{cell(one, oneBetter)}</td>
                    <td className="p-2">{cell(two, !oneBetter && two.counter !== null)}</td>
                  </tr>
                );
              })}
            </tbody>
          </table>
        </div>
      </section>
      <section aria-labelledby="pick-three-heading" className="flex flex-col gap-2">
        <h3 id="pick-three-heading" className="text-xl">
          Three players: your two opponents have chosen
        </h3>
        {analysis.pickAdvice.length === 0 ? (
          <p className="text-ink-soft">With three players the set needs at least three dice.</p>
        ) : (
          <>
            <p className="text-ink-soft">
              Everyone rolls the same number of dice; you win when your total is higher than both opponents&rsquo; totals in the same roll.
            </p>
            <div
              className="relative max-w-full overflow-x-auto rounded-xl border-2 border-line bg-shell"
              tabIndex={0}
              role="region"
              aria-label="Pick advisor, three players"
            >
              <table className="w-full border-collapse text-sm">
                <thead>
                  <tr>
                    <th scope="col" className="border-b-2 border-line p-2 text-left">
                      Opponents&rsquo; dice
                    </th>
                    <th scope="col" className="border-b-2 border-line p-2 text-left">
                      Take
                    </th>
                    <th scope="col" className="border-b-2 border-line p-2 text-left">
                      Mode
                    </th>
                    <th scope="col" className="border-b-2 border-line p-2 text-left">
                      Beats both at once
                    </th>
                    <th scope="col" className="border-b-2 border-line p-2 text-left">
                      Other choices
                    </th>
                  </tr>
                </thead>
                <tbody>
                  {analysis.pickAdvice.map((advice) => (
                    <tr key={advice.opponentIndices.join("-")} className="border-b border-line/60 align-top">
                      <th scope="row" className="p-2 text-left font-normal">
                        <span className="flex flex-col gap-1">
                          {dieLabel(advice.opponentIndices[0])}
                          {dieLabel(advice.opponentIndices[1])}
                        </span>
                      </th>
                      <td className="p-2 font-bold">{dieLabel(advice.best.pickIndex)}</td>
                      <td className="whitespace-nowrap p-2">{modeLabel(advice.best.dicePerPlayer)}</td>
                      <td className="whitespace-nowrap p-2 font-bold">{probabilityText(advice.best.probability)}</td>
                      <td className="p-2">
                        {advice.candidates.length > 1 ? (
                          <details>
                            <summary className="cursor-pointer">{advice.candidates.length - 1} more</summary>
                            <ul className="mt-1">
                              {advice.candidates.slice(1).map((candidate) => (
                                <li key={`${candidate.pickIndex}-${candidate.dicePerPlayer}`} className="whitespace-nowrap">
                                  {candidate.pick}, {modeLabel(candidate.dicePerPlayer)}: {probabilityText(candidate.probability)}
                                </li>
                              ))}
                            </ul>
                          </details>
                        ) : (
                          <span className="text-ink-soft">none</span>
                        )}
                      </td>
                    </tr>
                  ))}
                </tbody>
              </table>
            </div>
          </>
        )}
      </section>
    </div>
  );
}
