import { useId } from "react";
import { diePalette } from "@shared/schemas/dice-sets";
import { DieSwatch } from "@/components/dice/die-swatch";

/** Chooses a die's colour and pattern as one palette entry, each shown as a patterned swatch with its words. */
export function PalettePicker({
  dieLabel,
  colour,
  onChange,
  usedByOthers,
}: {
  dieLabel: string;
  colour: string;
  onChange: (entry: { colour: string; pattern: string }) => void;
  usedByOthers: ReadonlySet<string>;
}) {
  const name = useId();
  const current = diePalette.find((entry) => entry.colour === colour);
  return (
    <details className="group min-w-0 rounded-lg border-2 border-line bg-white">
      <summary className="flex min-h-11 cursor-pointer items-center gap-2 px-3 py-1 font-bold">
        {current && <DieSwatch colour={current.colour} pattern={current.pattern} className="h-7 w-7" />}
        <span>
          Colour and pattern of {dieLabel}: {current ? `${current.colour}, ${current.pattern}` : colour}
        </span>
        <span className="ml-auto text-sm font-normal text-tide-dark underline group-open:hidden">change</span>
      </summary>
      <fieldset className="min-w-0 px-2 pb-2">
        <legend className="sr-only">Colour and pattern of {dieLabel}</legend>
        <div className="mt-1 grid grid-cols-[repeat(auto-fill,minmax(8.5rem,1fr))] gap-1.5">
          {diePalette.map((entry) => {
            const checked = entry.colour === colour;
            return (
              <label
                key={entry.colour}
                className={`flex min-h-11 cursor-pointer items-center gap-2 rounded-lg border-2 px-2 py-1 text-sm has-[:focus-visible]:outline has-[:focus-visible]:outline-3 has-[:focus-visible]:outline-beacon ${
                  checked ? "border-ink bg-sand font-bold" : "border-line bg-white hover:border-ink/40"
                }`}
              >
                <input
                  type="radio"
                  name={name}
                  className="sr-only"
                  checked={checked}
                  onChange={() => onChange({ colour: entry.colour, pattern: entry.pattern })}
                />
                <DieSwatch colour={entry.colour} pattern={entry.pattern} className="h-7 w-7" />
                <span className="leading-tight">
                  {entry.colour}, {entry.pattern}
                  {checked ? (
                    <span aria-hidden="true"> ✓</span>
                  ) : usedByOthers.has(entry.colour) ? (
                    <span className="block text-xs font-normal text-ink-soft">in use</span>
                  ) : null}
                </span>
              </label>
            );
          })}
        </div>
      </fieldset>
    </details>
  );
}
