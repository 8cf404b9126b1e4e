import { useState } from "react";
import type { FinderFaceValues } from "@shared/schemas/set-finder";
import { ChoiceGroup } from "@/components/ui/choice-group";
import { TextField } from "@/components/ui/text-field";

type FaceValuesErrors =
  | {
      message?: string;
      min?: { message?: string };
      max?: { message?: string };
      values?: { message?: string; root?: { message?: string }; [index: number]: { message?: string } | undefined };
    }
  | undefined;

function numberOrNaN(text: string) {
  const trimmed = text.trim();
  return /^[+-]?\d+(\.\d+)?$/.test(trimmed) ? Number(trimmed) : Number.NaN;
}

/** The face values the dice may carry: a range (smallest to largest) or a typed list; both drafts are kept while switching. */
export function FaceValuesField({
  value,
  onChange,
  error,
}: {
  value: FinderFaceValues;
  onChange: (value: FinderFaceValues) => void;
  error: FaceValuesErrors;
}) {
  const [rangeText, setRangeText] = useState(() =>
    value.kind === "range" ? { min: String(value.min), max: String(value.max) } : { min: "1", max: "9" },
  );
  const [listText, setListText] = useState(() => (value.kind === "list" ? value.values.join(", ") : "1, 2, 3, 4, 5, 6, 7, 8, 9"));
  const fromList = (text: string): FinderFaceValues => ({
    kind: "list",
    values: text
      .split(/[\s,;]+/)
      .filter(Boolean)
      .map(numberOrNaN),
  });
  const fromRange = (text: { min: string; max: string }): FinderFaceValues => ({
    kind: "range",
    min: numberOrNaN(text.min),
    max: numberOrNaN(text.max),
  });
  const listErrors =
    value.kind === "list" && error?.values
      ? [
          error.values.message ?? error.values.root?.message,
          ...value.values.map((_, index) =>
            error.values?.[index]?.message ? `Value ${index + 1}: ${error.values[index]!.message}` : undefined,
          ),
        ].filter((message): message is string => Boolean(message))
      : [];

  return (
    <fieldset className="flex min-w-0 flex-col gap-3">
      <legend className="sr-only">Allowed face values</legend>
      <ChoiceGroup
        legend="Allowed face values"
        value={value.kind}
        onChange={(kind) => onChange(kind === "range" ? fromRange(rangeText) : fromList(listText))}
        options={[
          { value: "range", label: "every whole number in a range" },
          { value: "list", label: "only the values I list" },
        ]}
      />
      {value.kind === "range" ? (
        <div className="grid grid-cols-2 gap-3">
          <TextField
            label="Smallest value"
            inputMode="numeric"
            value={rangeText.min}
            onChange={(event) => {
              const next = { ...rangeText, min: event.target.value };
              setRangeText(next);
              onChange(fromRange(next));
            }}
            error={error?.min?.message}
          />
          <TextField
            label="Largest value"
            inputMode="numeric"
            value={rangeText.max}
            onChange={(event) => {
              const next = { ...rangeText, max: event.target.value };
              setRangeText(next);
              onChange(fromRange(next));
            }}
            error={error?.max?.message}
          />
        </div>
      ) : (
        <TextField
          label="Values allowed"
          hint="Whole numbers separated by commas or spaces, e.g. 0, 2, 3, 5, 7."
          value={listText}
          onChange={(event) => {
            setListText(event.target.value);
            onChange(fromList(event.target.value));
          }}
          error={listErrors.length > 0 ? listErrors.join(" ") : undefined}
        />
      )}
      {error?.message && <p className="text-sm font-bold text-alarm">{error.message}</p>}
    </fieldset>
  );
}
