import { SelectField } from "@/components/ui/select-field";
import { modeLabel } from "@/lib/probability-text";
import type { BenchDie } from "../hooks/use-set-analysis";

export type MatchupChoice = { first: number; second: number; dicePerPlayer: number };

/** Keeps a chosen matchup valid when dice are added or removed: two different dice that exist. */
export function validMatchup(choice: MatchupChoice, diceCount: number): MatchupChoice {
  const first = Math.min(choice.first, diceCount - 1);
  let second = Math.min(choice.second, diceCount - 1);
  if (second === first) second = first === 0 ? 1 : 0;
  return { first, second, dicePerPlayer: choice.dicePerPlayer };
}

/** Pick the two dice of a matchup and the mode. */
export function MatchupChooser({
  dice,
  value,
  onChange,
  modes,
}: {
  dice: BenchDie[];
  value: MatchupChoice;
  onChange: (choice: MatchupChoice) => void;
  modes: number[];
}) {
  const options = dice.map((die, index) => ({ value: String(index), label: die.name }));
  const pick = (part: "first" | "second", index: number) => {
    const next = { ...value, [part]: index };
    // Choosing the die already on the other side swaps the two, so the matchup stays between two dice.
    if (next.first === next.second) {
      if (part === "first") next.second = value.first;
      else next.first = value.second;
    }
    onChange(next);
  };
  return (
    <div className="grid gap-3 sm:grid-cols-3">
      <SelectField
        label="First die"
        options={options}
        value={String(value.first)}
        onChange={(event) => pick("first", Number(event.target.value))}
      />
      <SelectField
        label="Against"
        options={options}
        value={String(value.second)}
        onChange={(event) => pick("second", Number(event.target.value))}
      />
      <SelectField
        label="Mode"
        options={modes.map((mode) => ({ value: String(mode), label: modeLabel(mode) }))}
        value={String(value.dicePerPlayer)}
        onChange={(event) => onChange({ ...value, dicePerPlayer: Number(event.target.value) })}
      />
    </div>
  );
}
