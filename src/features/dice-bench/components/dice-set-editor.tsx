import { memo, useRef, useState } from "react";
import { type Control, Controller, type UseFormSetValue, useFieldArray, useForm, useWatch } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { useQueryClient } from "@tanstack/react-query";
import { useNavigate } from "react-router-dom";
import type { z } from "zod";
import { SET_SIZE_MAX, SET_SIZE_MIN } from "@shared/probability/index";
import { diePalette, diceSetInputSchema, type DiceSet, type DiceSetInput, paletteEntryForName } from "@shared/schemas/dice-sets";
import { DieSwatch } from "@/components/dice/die-swatch";
import { Alert } from "@/components/ui/alert";
import { DraftOffer } from "@/components/ui/draft-offer";
import { formProblems } from "@/components/ui/form-problems";
import { LeavePageDialog } from "@/components/ui/leave-page-dialog";
import { SavedToast } from "@/components/ui/saved-toast";
import { Button } from "@/components/ui/button";
import { ChoiceGroup } from "@/components/ui/choice-group";
import { AnchorButton, LinkButton } from "@/components/ui/link-button";
import { PageHeader } from "@/components/ui/page-header";
import { TextField } from "@/components/ui/text-field";
import { ApiRequestError } from "@/lib/api-client";
import { useCreateDiceSet } from "../api/create-dice-set";
import { diceSetFileUrl } from "../api/export-dice-set";
import { diceSetQueryOptions } from "../api/get-dice-set";
import { useUpdateDiceSet } from "../api/update-dice-set";
import { useSetAnalysis } from "../hooks/use-set-analysis";
import { AnalysisPanel } from "./analysis-panel";
import { FacesField, type FacesEntry } from "./faces-field";
import { PalettePicker } from "./palette-picker";
import { draftKey, useBrowserDraft, useDraftWriter } from "@/lib/browser-draft";
import { formatTime } from "@/lib/format";
import { useUnsavedChangesGuard } from "@/lib/unsaved-changes";

type FormValues = z.input<typeof diceSetInputSchema>;

/** A set to start from scratch: three plain dice the teacher renames and re-faces. */
export function blankDiceSet(): DiceSetInput {
  return {
    name: "",
    description: "",
    visibility: "private",
    dice: ["First die", "Second die", "Third die"].map((name, index) => ({
      name,
      faces: [1, 2, 3, 4, 5, 6],
      colour: diePalette[index].colour,
      pattern: diePalette[index].pattern,
    })),
  };
}

/** The editable part of a stored set. */
export function diceSetInputOf(set: DiceSet): DiceSetInput {
  return {
    name: set.name,
    description: set.description,
    visibility: set.visibility,
    dice: set.dice.map((die) => ({ name: die.name, faces: [...die.faces], colour: die.colour, pattern: die.pattern })),
  };
}

function nextDie(existing: { name?: string; colour?: string }[]) {
  const usedColours = new Set(existing.map((die) => die.colour));
  const entry = diePalette.find((each) => !usedColours.has(each.colour)) ?? diePalette[existing.length % diePalette.length];
  const names = new Set(existing.map((die) => (die.name ?? "").trim().toLowerCase()));
  let number = existing.length + 1;
  while (names.has(`die ${number}`)) number += 1;
  return { name: `Die ${number}`, faces: [1, 2, 3, 4, 5, 6], colour: entry.colour, pattern: entry.pattern };
}

/**
 * The Dice bench editor: the set's name, sharing and dice, with the exact analysis beside it, recomputed as the teacher types.
 * `saved` is the stored set it edits (null for a new, unsaved set); saving sends the version it started from.
 */
export function DiceSetEditor({ initial, saved, notice }: { initial: DiceSetInput; saved: DiceSet | null; notice?: string }) {
  const navigate = useNavigate();
  const queryClient = useQueryClient();
  const create = useCreateDiceSet();
  const update = useUpdateDiceSet();
  const [baseVersion, setBaseVersion] = useState(saved?.version ?? null);
  const [entry, setEntry] = useState<FacesEntry>("list");
  const [savedNote, setSavedNote] = useState<string | null>(notice ?? null);
  const form = useForm<FormValues, unknown, DiceSetInput>({
    resolver: zodResolver(diceSetInputSchema),
    mode: "onChange",
    defaultValues: initial,
  });
  const { control, register, handleSubmit, reset, setValue, formState } = form;
  const { errors, isDirty } = formState;
  const dice = useFieldArray({ control, name: "dice" });

  // Set just before moving on after a save, so the guard lets that one navigation through.
  const leavingAfterSave = useRef(false);
  const blocker = useUnsavedChangesGuard(isDirty, leavingAfterSave);
  const keyOfDraft = draftKey("dice-set", saved?.id ?? null);
  const draft = useBrowserDraft<FormValues>({
    key: keyOfDraft,
    parse: (value) =>
      value !== null && typeof value === "object" && Array.isArray((value as FormValues).dice) ? (value as FormValues) : null,
  });
  const draftDiffers = draft.found !== null && JSON.stringify(draft.found.values) !== JSON.stringify(initial);
  // A first save moves to the new page, whose status line at the top (where the page opens) confirms it.
  const [toast, setToast] = useState<{ message: string | null; stamp: number }>({ message: null, stamp: 0 });
  const problems = formState.submitCount > 0 ? formProblems(errors) : [];

  const moveOn = (to: string, options: { replace?: boolean; state: { notice: string } }) => {
    leavingAfterSave.current = true;
    navigate(to, options);
  };
  const openSaved = (set: DiceSet) => {
    draft.saved();
    moveOn(`/app/bench/${set.id}`, { replace: saved === null, state: { notice: `Saved at ${formatTime(set.updatedAt)}.` } });
  };
  const submit = handleSubmit((values) => {
    setSavedNote(null);
    if (saved === null || baseVersion === null) {
      create.mutate(values, { onSuccess: openSaved });
      return;
    }
    update.mutate(
      { id: saved.id, update: { ...values, version: baseVersion } },
      {
        onSuccess: (set) => {
          draft.saved();
          setBaseVersion(set.version);
          reset(diceSetInputOf(set));
          const note = `Saved at ${formatTime(set.updatedAt)}.`;
          setSavedNote(note);
          setToast({ message: note, stamp: Date.now() });
        },
      },
    );
  });
  const saveAsNew = handleSubmit((values) =>
    create.mutate(
      { ...values, name: `${values.name} (my edits)`.slice(0, 80) },
      {
        onSuccess: (set) => {
          draft.saved();
          moveOn(`/app/bench/${set.id}`, { state: { notice: "Saved as a new set." } });
        },
      },
    ),
  );
  const duplicate = () => {
    // The copy carries any unsaved edits with it, so nothing is lost by leaving.
    const values = form.getValues();
    leavingAfterSave.current = true;
    navigate("/app/bench/new", { state: { draft: { ...values, name: `${values.name} (copy)`.slice(0, 80), visibility: "private" } } });
  };
  const restoreDraft = () => {
    if (draft.found === null) return;
    reset(draft.found.values, { keepDefaultValues: true });
    if (saved !== null && draft.found.baseVersion !== null) setBaseVersion(draft.found.baseVersion);
    draft.dismiss();
  };
  const reloadSaved = async () => {
    if (saved === null) return;
    const fresh = await queryClient.fetchQuery({ ...diceSetQueryOptions(saved.id), staleTime: 0 });
    reset(diceSetInputOf(fresh));
    setBaseVersion(fresh.version);
    update.reset();
    setSavedNote(`Reloaded the saved set (version ${fresh.version}).`);
  };

  const saveError = update.error ?? create.error;
  const stale = update.error instanceof ApiRequestError && update.error.status === 409;
  const diceError = errors.dice?.root?.message ?? errors.dice?.message;
  const title = useWatch({ control, name: "name" });

  return (
    <>
      <PageHeader
        title="Dice bench"
        lead={
          saved ? (
            <>
              Editing &ldquo;{title || saved.name}&rdquo;{isDirty ? " · unsaved changes" : ""}
            </>
          ) : (
            "A new dice set, not saved yet."
          )
        }
        actions={
          <>
            <Button type="submit" form="dice-set-form" busy={create.isPending || update.isPending}>
              {saved ? "Save changes" : "Save dice set"}
            </Button>
            {saved && (
              <>
                <Button type="button" variant="secondary" onClick={duplicate}>
                  Duplicate
                </Button>
                <LinkButton to={`/app/bench/${saved.id}/print?kind=nets&paper=a4`}>Print dice</LinkButton>
                <LinkButton to={`/app/bench/${saved.id}/print?kind=sheet&paper=a4`}>Print recording sheet</LinkButton>
                <AnchorButton href={diceSetFileUrl(saved.id)} download>
                  Download set file
                </AnchorButton>
              </>
            )}
          </>
        }
      />
      <DraftWriter control={control} draftKey={keyOfDraft} dirty={isDirty} baseVersion={baseVersion} paused={draftDiffers} />
      <LeavePageDialog blocker={blocker} what="This dice set" onLeave={draft.discard} />
      <SavedToast message={toast.message} stamp={toast.stamp} />
      <div className="mb-4 flex flex-col gap-3">
        {draftDiffers && draft.found && (
          <DraftOffer keptAt={draft.found.keptAt} what="this dice set" onRestore={restoreDraft} onDiscard={draft.discard} />
        )}
        {problems.length > 0 && <SaveProblems problems={problems} />}
        {savedNote && !isDirty && (
          <p role="status" className="rounded-lg border-l-8 border-tide bg-tide-light px-4 py-2 font-bold">
            ✓ {savedNote}
          </p>
        )}
        {saved && isDirty && (
          <p className="text-sm text-ink-soft">Printing and the set file use the saved version; save first to include your changes.</p>
        )}
        {stale && saveError && (
          <Alert tone="error" title="Not saved: this set changed since you opened it">
            <p>{saveError.message}</p>
            <p className="mt-1">
              Your edits are still here. Reload the saved set (your edits here are dropped), or keep your edits as a new set.
            </p>
            <div className="mt-3 flex flex-wrap gap-2">
              <Button variant="secondary" onClick={reloadSaved}>
                Reload the saved set
              </Button>
              <Button variant="secondary" onClick={saveAsNew}>
                Save my edits as a new set
              </Button>
            </div>
          </Alert>
        )}
        {!stale && saveError && (
          <Alert tone="error" title="Not saved">
            <p>{saveError.message}</p>
            {saveError instanceof ApiRequestError && Object.keys(saveError.fields).length > 0 && (
              <ul className="mt-1 list-disc pl-5">
                {Object.entries(saveError.fields).map(([field, messages]) => (
                  <li key={field}>
                    {field}: {messages.join(" ")}
                  </li>
                ))}
              </ul>
            )}
          </Alert>
        )}
      </div>
      <div className="grid min-w-0 gap-6 lg:grid-cols-[minmax(0,25rem)_minmax(0,1fr)]">
        <form id="dice-set-form" onSubmit={submit} noValidate aria-label="Dice set" className="flex min-w-0 flex-col gap-4">
          <TextField label="Set name" {...register("name")} error={errors.name?.message} placeholder="e.g. Gannet ladder" />
          <div className="flex flex-col gap-1">
            <label htmlFor="set-description" className="font-bold">
              Description (optional)
            </label>
            <textarea
              id="set-description"
              rows={2}
              {...register("description")}
              className="rounded-lg border-2 border-line bg-white px-3 py-2 text-base focus:border-tide"
              aria-invalid={errors.description ? true : undefined}
            />
            {errors.description && <p className="text-sm font-bold text-alarm">{errors.description.message}</p>}
          </div>
          <Controller
            control={control}
            name="visibility"
            render={({ field }) => (
              <ChoiceGroup
                legend="Who can see it"
                value={field.value ?? "private"}
                onChange={field.onChange}
                options={[
                  { value: "private", label: "Only me" },
                  { value: "department", label: "My department" },
                ]}
                hint="Colleagues can open and duplicate a shared set; only you edit it."
              />
            )}
          />
          <ChoiceGroup
            legend="Type faces as"
            value={entry}
            onChange={setEntry}
            options={[
              { value: "list", label: "a list" },
              { value: "boxes", label: "one box per face" },
            ]}
          />
          <h2 className="text-2xl">
            Dice{" "}
            <span className="text-base font-normal text-ink-soft">
              ({dice.fields.length} of at most {SET_SIZE_MAX})
            </span>
          </h2>
          {diceError && (
            <p role="alert" className="font-bold text-alarm">
              {diceError}
            </p>
          )}
          <ol className="flex flex-col gap-4">
            {dice.fields.map((field, index) => (
              <li
                key={field.id}
                className="flex min-w-0 flex-col gap-3 rounded-xl border-2 border-line bg-shell p-3 sm:p-4"
                data-testid={`die-card-${index}`}
              >
                <div className="flex flex-wrap items-center justify-between gap-2">
                  <DieHeading control={control} index={index} />
                  <Button
                    type="button"
                    variant="quiet"
                    className="text-alarm!"
                    disabled={dice.fields.length <= SET_SIZE_MIN}
                    onClick={() => dice.remove(index)}
                    aria-label={`Remove die ${index + 1}`}
                  >
                    Remove die
                  </Button>
                </div>
                <TextField
                  label={`Die ${index + 1} name`}
                  {...register(`dice.${index}.name`)}
                  error={errors.dice?.[index]?.name?.message}
                />
                <Controller
                  control={control}
                  name={`dice.${index}.faces`}
                  render={({ field: faces, fieldState }) => (
                    <FacesField
                      dieLabel={`die ${index + 1}`}
                      faces={faces.value}
                      onChange={faces.onChange}
                      onBlur={faces.onBlur}
                      entry={entry}
                      error={fieldState.error as Parameters<typeof FacesField>[0]["error"]}
                    />
                  )}
                />
                <PaletteField control={control} index={index} setValue={setValue} />
              </li>
            ))}
          </ol>
          <Button
            type="button"
            variant="secondary"
            disabled={dice.fields.length >= SET_SIZE_MAX}
            onClick={() => dice.append(nextDie(form.getValues("dice")))}
          >
            + Add a die
          </Button>
          <div className="flex flex-col gap-2">
            <Button type="submit" busy={create.isPending || update.isPending}>
              {saved ? "Save changes" : "Save dice set"}
            </Button>
            {problems.length > 0 && <SaveProblems problems={problems} />}
          </div>
        </form>
        <section aria-labelledby="analysis-heading" className="min-w-0">
          <h2 id="analysis-heading" className="mb-3 text-2xl">
            Exact analysis
          </h2>
          <LiveAnalysis control={control} />
        </section>
      </div>
    </>
  );
}

/** Where a field path points, in the editor's words: "Die 2, face 4", "Set name". */
function problemPlace(path: string[]): string {
  const [first, index, field, faceIndex] = path;
  if (first === "name") return "Set name";
  if (first === "description") return "Description";
  if (first !== "dice") return path.join(".");
  if (index === undefined || !/^\d+$/.test(index)) return "Dice";
  const die = `Die ${Number(index) + 1}`;
  if (field === "faces" && faceIndex !== undefined && /^\d+$/.test(faceIndex)) return `${die}, face ${Number(faceIndex) + 1}`;
  if (field === "faces") return `${die}, faces`;
  if (field === "name") return `${die}, name`;
  return die;
}

/** Why Save did nothing, beside the button: each problem with the place it is. */
function SaveProblems({ problems }: { problems: { path: string[]; message: string }[] }) {
  return (
    <div role="alert" className="rounded-lg border-l-8 border-alarm bg-white px-3 py-2 text-sm" data-testid="save-problems">
      <p className="font-bold text-alarm">Not saved yet: fix {problems.length === 1 ? "this" : "these"} first.</p>
      <ul className="list-disc pl-5">
        {problems.map((problem) => (
          <li key={problem.path.join(".")}>
            {problemPlace(problem.path)}: {problem.message}
          </li>
        ))}
      </ul>
    </div>
  );
}

/** Keeps the form's values as the browser draft; it alone watches every field, so the editor does not re-render on each keystroke. */
function DraftWriter({
  control,
  draftKey: key,
  dirty,
  baseVersion,
  paused,
}: {
  control: Control<FormValues, unknown, DiceSetInput>;
  draftKey: string;
  dirty: boolean;
  baseVersion: number | null;
  paused: boolean;
}) {
  const values = useWatch({ control });
  useDraftWriter({ key, values, dirty, baseVersion, paused });
  return null;
}

/** The analysis, fed from the form as the teacher types; it alone re-renders on every keystroke. */
function LiveAnalysis({ control }: { control: Control<FormValues, unknown, DiceSetInput> }) {
  const draft = useWatch({ control, name: "dice" });
  return <AnalysisPanel state={useSetAnalysis(draft)} />;
}

/** A die card's heading: its number, swatch and name as typed so far. */
function DieHeading({ control, index }: { control: Control<FormValues, unknown, DiceSetInput>; index: number }) {
  const die = useWatch({ control, name: `dice.${index}` });
  return (
    <h3 className="flex min-w-0 items-center gap-2 text-lg">
      <DieSwatch colour={die?.colour ?? "teal"} pattern={die?.pattern ?? "dots"} className="h-7 w-7" />
      <span className="truncate">
        Die {index + 1}
        {die?.name ? `: ${die.name}` : ""}
      </span>
    </h3>
  );
}

/** A die's colour and pattern, set together; other dice's choices are marked "in use". */
function PaletteField({
  control,
  index,
  setValue,
}: {
  control: Control<FormValues, unknown, DiceSetInput>;
  index: number;
  setValue: UseFormSetValue<FormValues>;
}) {
  const dice = useWatch({ control, name: "dice" });
  const colour = dice?.[index]?.colour ?? "teal";
  const usedByOthers = (dice ?? [])
    .filter((_, other) => other !== index)
    .map((die) => die.colour)
    .join(",");
  const choose = (choice: { colour: string; pattern: string }) => {
    setValue(`dice.${index}.colour`, choice.colour, { shouldDirty: true, shouldValidate: true });
    setValue(`dice.${index}.pattern`, choice.pattern, { shouldDirty: true, shouldValidate: true });
  };
  const asked = paletteEntryForName(dice?.[index]?.name ?? "");
  return (
    <>
      {asked !== null && asked.colour !== colour && (
        <div
          className="flex flex-wrap items-center gap-2 rounded-lg border-2 border-dashed border-line bg-white px-3 py-2 text-sm"
          data-testid={`colour-suggestion-${index}`}
        >
          <DieSwatch colour={asked.colour} pattern={asked.pattern} className="h-6 w-6" />
          <span>
            The name asks for {asked.colour}: use {asked.colour}, {asked.pattern}?
          </span>
          <Button type="button" variant="secondary" onClick={() => choose(asked)}>
            Use {asked.colour}
            <span className="sr-only"> for die {index + 1}</span>
          </Button>
        </div>
      )}
      <MemoPalettePicker dieLabel={`die ${index + 1}`} colour={colour} usedByOthers={usedByOthers} onChange={choose} />
    </>
  );
}

// Typing faces re-renders PaletteField, but the palette's swatches only redraw when a colour choice changes.
const MemoPalettePicker = memo(
  function MemoPalettePicker(props: {
    dieLabel: string;
    colour: string;
    usedByOthers: string;
    onChange: (choice: { colour: string; pattern: string }) => void;
  }) {
    return <PalettePicker {...props} usedByOthers={new Set(props.usedByOthers.split(","))} />;
  },
  (before, after) => before.colour === after.colour && before.usedByOthers === after.usedByOthers && before.dieLabel === after.dieLabel,
);
