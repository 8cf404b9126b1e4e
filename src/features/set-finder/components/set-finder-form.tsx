import { useId } from "react";
import { Controller, useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import {
  FINDER_DICE_MAX,
  FINDER_DICE_MIN,
  FINDER_FACES_MAX,
  FINDER_FACES_MIN,
  FINDER_RESULTS_MAX,
  FINDER_TIME_BUDGET_DEFAULT,
  FINDER_TIME_BUDGET_MAX,
  setFinderRequestSchema,
  type SetFinderRequest,
  type SetFinderRequestInput,
} from "@shared/schemas/set-finder";
import { Button } from "@/components/ui/button";
import { ChoiceGroup } from "@/components/ui/choice-group";
import { SelectField } from "@/components/ui/select-field";
import { TextField } from "@/components/ui/text-field";
import { FaceValuesField } from "./face-values-field";

const range = (from: number, to: number) => Array.from({ length: to - from + 1 }, (_, index) => from + index);

export const propertyLabels: Record<SetFinderRequest["property"], string> = {
  "one-cycle": "One cycle: each die beats the next, and the last die beats the first",
  "reversing-cycle": "A cycle that turns round with two dice each (every matchup in it reverses)",
  "two-cycles": "Two cycles: one keeps its direction and one reverses with two dice each, so a player can beat two opponents (5 or 6 dice)",
};

export const objectiveLabels: Record<SetFinderRequest["objective"], string> = {
  "strongest-cycle": "Make the weakest win in the cycle as strong as possible",
  "small-faces": "Prefer small face values (easy sums for pupils)",
};

const defaults: SetFinderRequestInput = {
  diceCount: 3,
  facesPerDie: 6,
  faceValues: { kind: "range", min: 1, max: 9 },
  property: "one-cycle",
  allowTies: false,
  refuseAllEqualFaces: true,
  objective: "strongest-cycle",
  maxResults: 10,
  timeBudgetSeconds: FINDER_TIME_BUDGET_DEFAULT,
};

/** What the teacher wants from the Set finder, in plain words; the shared schema checks it here and on the server. */
export function SetFinderForm({
  onSearch,
  busy,
  disabled,
}: {
  onSearch: (request: SetFinderRequest) => void;
  busy: boolean;
  disabled: boolean;
}) {
  const { control, register, handleSubmit, formState } = useForm<SetFinderRequestInput, unknown, SetFinderRequest>({
    // Fills in a plain message where the schema gives none (a box left empty or not a number).
    resolver: zodResolver(setFinderRequestSchema, {
      error: (issue) => (issue.code === "invalid_type" ? "Enter a whole number." : undefined),
    }),
    mode: "onChange",
    defaultValues: defaults,
  });
  const { errors } = formState;
  return (
    <form onSubmit={handleSubmit(onSearch)} noValidate aria-label="Set finder" className="flex min-w-0 flex-col gap-4">
      <div className="grid gap-3 sm:grid-cols-2">
        <SelectField
          label="Number of dice"
          options={range(FINDER_DICE_MIN, FINDER_DICE_MAX).map((count) => ({ value: String(count), label: `${count} dice` }))}
          {...register("diceCount", { valueAsNumber: true })}
          error={errors.diceCount?.message}
        />
        <SelectField
          label="Faces on each die"
          options={range(FINDER_FACES_MIN, FINDER_FACES_MAX).map((count) => ({ value: String(count), label: `${count} faces` }))}
          {...register("facesPerDie", { valueAsNumber: true })}
          error={errors.facesPerDie?.message}
        />
      </div>
      <Controller
        control={control}
        name="faceValues"
        render={({ field, fieldState }) => (
          <FaceValuesField
            value={field.value}
            onChange={field.onChange}
            error={fieldState.error as Parameters<typeof FaceValuesField>[0]["error"]}
          />
        )}
      />
      <Controller
        control={control}
        name="property"
        render={({ field }) => (
          <RadioList
            legend="What the set must do"
            value={field.value}
            onChange={field.onChange}
            options={Object.entries(propertyLabels).map(([value, label]) => ({ value: value as SetFinderRequest["property"], label }))}
          />
        )}
      />
      <div className="flex flex-col gap-1">
        <label className="flex min-h-11 cursor-pointer items-center gap-3 font-bold">
          <input type="checkbox" className="h-5 w-5 accent-tide" {...register("allowTies")} />
          Allow ties (dice may share face values, so a roll can be a draw)
        </label>
        {errors.allowTies && <p className="text-sm font-bold text-alarm">{errors.allowTies.message}</p>}
      </div>
      <label className="flex min-h-11 cursor-pointer items-center gap-3 font-bold">
        <input type="checkbox" className="h-5 w-5 accent-tide" {...register("refuseAllEqualFaces")} />
        Leave out dice whose faces all show the same number
      </label>
      <Controller
        control={control}
        name="objective"
        render={({ field }) => (
          <ChoiceGroup
            legend="Rank the sets by"
            value={field.value ?? "strongest-cycle"}
            onChange={field.onChange}
            options={Object.entries(objectiveLabels).map(([value, label]) => ({ value: value as SetFinderRequest["objective"], label }))}
          />
        )}
      />
      <div className="grid gap-3 sm:grid-cols-3">
        <TextField
          label="Sets to list"
          inputMode="numeric"
          hint={`1 to ${FINDER_RESULTS_MAX}`}
          {...register("maxResults", { valueAsNumber: true })}
          error={errors.maxResults?.message}
        />
        <TextField
          label="Stop after (seconds)"
          inputMode="numeric"
          hint={`at most ${FINDER_TIME_BUDGET_MAX}`}
          {...register("timeBudgetSeconds", { valueAsNumber: true })}
          error={errors.timeBudgetSeconds?.message}
        />
        <TextField
          label="Repeat code (optional)"
          inputMode="numeric"
          hint="Same code, same results on big searches"
          {...register("seed", { setValueAs: (text: string) => (text.trim() === "" ? undefined : Number(text)) })}
          error={errors.seed?.message}
        />
      </div>
      <Button type="submit" busy={busy} disabled={disabled}>
        Find dice sets
      </Button>
    </form>
  );
}

function RadioList<T extends string>({
  legend,
  value,
  onChange,
  options,
}: {
  legend: string;
  value: T;
  onChange: (value: T) => void;
  options: { value: T; label: string }[];
}) {
  const name = useId();
  return (
    <fieldset className="min-w-0">
      <legend className="mb-1 font-bold">{legend}</legend>
      <div className="flex flex-col gap-1.5">
        {options.map((option) => (
          <label
            key={option.value}
            className={`flex cursor-pointer items-start gap-3 rounded-xl border-2 px-3 py-2 ${option.value === value ? "border-tide bg-tide-light" : "border-line bg-white"}`}
          >
            <input
              type="radio"
              name={name}
              className="mt-1 h-4 w-4 shrink-0 accent-tide"
              checked={option.value === value}
              onChange={() => onChange(option.value)}
            />
            <span>{option.label}</span>
          </label>
        ))}
      </div>
    </fieldset>
  );
}
