import { useMemo, useRef, useState, type ReactNode } from "react";
import { Controller, useFieldArray, useForm, useWatch } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { useQueryClient } from "@tanstack/react-query";
import { useNavigate } from "react-router-dom";
import type { z } from "zod";
import type { SetDie } from "@shared/schemas/dice-sets";
import {
  LESSON_LIMITS,
  lessonInputSchema,
  lessonStatusLabels,
  matchupChoiceLabels,
  tieRuleLabels,
  type Lesson,
  type LessonAttachment,
  type LessonInput,
  type LessonStatus,
} from "@shared/schemas/lessons";
import { Alert } from "@/components/ui/alert";
import { DraftOffer } from "@/components/ui/draft-offer";
import { LeavePageDialog } from "@/components/ui/leave-page-dialog";
import { SavedToast } from "@/components/ui/saved-toast";
import { Button } from "@/components/ui/button";
import { ChoiceGroup } from "@/components/ui/choice-group";
import { LinkButton } from "@/components/ui/link-button";
import { PageHeader } from "@/components/ui/page-header";
import { SelectField } from "@/components/ui/select-field";
import { TextArea } from "@/components/ui/text-area";
import { TextField } from "@/components/ui/text-field";
import { ApiRequestError } from "@/lib/api-client";
import { draftKey, useBrowserDraft, useDraftWriter } from "@/lib/browser-draft";
import { formatDateTime, formatTime } from "@/lib/format";
import { useUnsavedChangesGuard } from "@/lib/unsaved-changes";
import { useCreateLesson } from "../api/create-lesson";
import { lessonQueryOptions, type LessonDetail } from "../api/get-lesson";
import { useUsableDiceSets } from "../api/list-usable-dice-sets";
import { useUpdateLesson } from "../api/update-lesson";
import { useLessonMaterials } from "../hooks/use-lesson-materials";
import { AttachmentsPanel } from "./attachments-panel";
import { CurriculumPicker } from "./curriculum-picker";
import { LiveMaterialsPanel } from "./materials-panel";
import { StatusBadge } from "./status-badge";

type FormValues = z.input<typeof lessonInputSchema>;

/** The editable part of a stored lesson. */
export function lessonInputOf(lesson: Lesson): LessonInput {
  return lessonInputSchema.parse({ ...lesson });
}

const phaseHints: Record<string, string> = {
  Guess: "Pupils predict the best die.",
  Roll: "Groups play their matchups.",
  Pool: "Class results combined.",
  Prove: "Tree diagram and exact fractions.",
  Twist: "Two dice each, or three players.",
  Reflect: "Discussion and exit ticket.",
};

const numberField = { valueAsNumber: true } as const;

/**
 * The lesson plan form: a new lesson, the owner's lesson (saved with its version), or a read-only view for the head.
 * Beside it, the materials list and the rolls verdict follow every change.
 */
export function LessonEditor({ initial, detail, notice }: { initial: LessonInput; detail?: LessonDetail; notice?: string }) {
  const navigate = useNavigate();
  const queryClient = useQueryClient();
  const create = useCreateLesson();
  const update = useUpdateLesson();
  const sets = useUsableDiceSets();
  const saved = detail?.lesson;
  const readOnly = saved ? !saved.isOwner : false;
  const [savedMessage, setSavedMessage] = useState<string | null>(notice ?? null);
  // The version this form started from: a refetch in the background must not move it, or a colleague's save would be overwritten.
  const [baseVersion, setBaseVersion] = useState(saved?.version ?? 0);

  const form = useForm<FormValues, unknown, LessonInput>({
    resolver: zodResolver(lessonInputSchema),
    mode: "onChange",
    defaultValues: initial,
  });
  const { control, register, handleSubmit, formState, setValue, reset, setError } = form;
  const { errors, isDirty } = formState;
  const objectives = useFieldArray({ control, name: "objectives" });
  const phases = useFieldArray({ control, name: "phases" });
  const values = useWatch({ control });
  const prompts = useWatch({ control, name: "discussionPrompts" }) ?? [];

  // Set just before moving on after a save, so the guard lets that one navigation through.
  const leavingAfterSave = useRef(false);
  const blocker = useUnsavedChangesGuard(isDirty && !readOnly, leavingAfterSave);
  const keyOfDraft = draftKey("lesson", saved?.id ?? null);
  const draft = useBrowserDraft<FormValues>({
    key: keyOfDraft,
    parse: (value) =>
      value !== null && typeof value === "object" && Array.isArray((value as FormValues).phases) ? (value as FormValues) : null,
  });
  const draftDiffers = !readOnly && draft.found !== null && JSON.stringify(draft.found.values) !== JSON.stringify(initial);
  useDraftWriter({
    key: keyOfDraft,
    values,
    dirty: isDirty && !readOnly,
    baseVersion: saved ? baseVersion : null,
    paused: readOnly || draftDiffers,
  });
  const restoreDraft = () => {
    if (draft.found === null) return;
    reset(draft.found.values, { keepDefaultValues: true });
    if (saved && draft.found.baseVersion !== null) setBaseVersion(draft.found.baseVersion);
    draft.dismiss();
  };
  // A first save moves to the new page, whose status line at the top (where the page opens) confirms it.
  const [toast, setToast] = useState<{ message: string | null; stamp: number }>({ message: null, stamp: 0 });

  // A set can reach the list twice (e.g. the teacher's own set also shared with the department); list each once.
  const usable = [...new Map((sets.data?.sets ?? []).map((set) => [set.id, set])).values()];
  const ownSets = usable.filter((set) => set.isOwner);
  const sharedSets = usable.filter((set) => !set.isOwner);
  const chosenId = values.diceSetId ?? null;
  const chosenDice: SetDie[] | null = useMemo(() => {
    if (chosenId === null) return null;
    const listed = sets.data?.sets.find((set) => set.id === chosenId);
    if (listed) return listed.dice;
    return detail?.diceSet?.id === chosenId ? detail.diceSet.dice : null;
  }, [chosenId, sets.data, detail]);
  const materials = useLessonMaterials(values, chosenDice);

  const totalMinutes = (values.phases ?? []).reduce(
    (sum, entry) => sum + (entry?.included && Number.isFinite(entry.minutes) ? Number(entry.minutes) : 0),
    0,
  );
  const saving = create.isPending || update.isPending;
  const saveError = create.error ?? update.error;
  const stale = saveError instanceof ApiRequestError && saveError.code === "stale_version";

  const onSubmit = handleSubmit(async (input) => {
    setSavedMessage(null);
    try {
      if (!saved) {
        const { lesson } = await create.mutateAsync(input);
        draft.saved();
        leavingAfterSave.current = true;
        navigate(`/app/lessons/${lesson.id}`, { replace: true, state: { notice: `Lesson created at ${formatTime(lesson.updatedAt)}.` } });
        return;
      }
      const { lesson } = await update.mutateAsync({ id: saved.id, update: { ...input, version: baseVersion } });
      draft.saved();
      setBaseVersion(lesson.version);
      reset(lessonInputOf(lesson));
      const note = `Saved at ${formatTime(lesson.updatedAt)} (version ${lesson.version}).`;
      setSavedMessage(note);
      setToast({ message: note, stamp: Date.now() });
    } catch (error) {
      if (error instanceof ApiRequestError) {
        for (const [field, messages] of Object.entries(error.fields)) setError(field as keyof FormValues, { message: messages[0] });
      }
    }
  });

  const reloadSaved = async () => {
    if (!saved) return;
    const fresh = await queryClient.fetchQuery({ ...lessonQueryOptions(saved.id), staleTime: 0 });
    update.reset();
    setBaseVersion(fresh.lesson.version);
    reset(lessonInputOf(fresh.lesson));
    setSavedMessage(`Loaded the saved version ${fresh.lesson.version}.`);
  };

  const listed = [
    ...ownSets.map((set) => ({ set, label: `${set.name} (yours, ${set.dice.length} dice)` })),
    ...sharedSets.map((set) => ({ set, label: `${set.name} (shared by ${set.ownerName}, ${set.dice.length} dice)` })),
  ];
  // Two sets that would read the same (e.g. two saved Set finder results) are told apart by when they were last saved.
  const labelCount = new Map<string, number>();
  for (const entry of listed) labelCount.set(entry.label, (labelCount.get(entry.label) ?? 0) + 1);
  const dated = listed.map(({ set, label }) => ({
    value: set.id,
    label: (labelCount.get(label) ?? 0) > 1 ? `${label}, saved ${formatDateTime(set.updatedAt)}` : label,
  }));
  // Saved in the same minute as well: number them.
  const seen = new Map<string, number>();
  const setOptions = [
    { value: "", label: "No dice set yet" },
    ...dated.map((option) => {
      const nth = (seen.get(option.label) ?? 0) + 1;
      seen.set(option.label, nth);
      return nth === 1 ? option : { ...option, label: `${option.label} (${nth})` };
    }),
  ];
  if (chosenId && !setOptions.some((option) => option.value === chosenId)) {
    const name = saved?.diceSetName ?? detail?.diceSet?.name ?? "This lesson's set";
    setOptions.push({ value: chosenId, label: sets.data ? `${name} (not in your list)` : name });
  }

  const title = values.title?.trim() || (saved ? "Untitled lesson" : "New lesson");
  return (
    <>
      <PageHeader
        title={title}
        lead={
          saved ? (
            <span className="flex flex-wrap items-center gap-2">
              <StatusBadge status={saved.status} archived={saved.archivedAt !== null} />
              <span>
                {saved.isOwner ? "Your lesson" : `${saved.ownerName}'s lesson`} · version {baseVersion}
              </span>
            </span>
          ) : (
            "Plan the lesson phase by phase; the materials list and the rolls verdict update as you type."
          )
        }
        actions={
          <>
            <LinkButton to="/app/lessons">Back to lessons</LinkButton>
            {saved && <LinkButton to={`/app/lessons/${saved.id}/print`}>Print view</LinkButton>}
            {saved?.isOwner && <LinkButton to={`/app/runs?lesson=${saved.id}`}>Run it with a class</LinkButton>}
            {!readOnly && (
              <Button type="submit" form="lesson-form" busy={saving}>
                {saved ? "Save lesson" : "Create lesson"}
              </Button>
            )}
          </>
        }
      />
      <LeavePageDialog blocker={blocker} what="This lesson" onLeave={draft.discard} />
      <SavedToast message={toast.message} stamp={toast.stamp} />
      <div className="mb-4 flex flex-col gap-3" data-slot="lesson-header-notes">
        {draftDiffers && draft.found && (
          <DraftOffer keptAt={draft.found.keptAt} what="this lesson" onRestore={restoreDraft} onDiscard={draft.discard} />
        )}
        {saved?.fromTemplateId && (
          <Alert tone="info">Copied from a Department shelf template (version {saved.fromTemplateVersion ?? "?"}).</Alert>
        )}
        {readOnly && saved && (
          <Alert tone="info" title="Read only">
            You are reading {saved.ownerName}'s lesson as head of department; only {saved.ownerName} can change it.
          </Alert>
        )}
        {savedMessage && !isDirty && (
          <p role="status" className="rounded-lg border-l-8 border-tide bg-tide-light px-4 py-2 font-bold">
            ✓ {savedMessage}
          </p>
        )}
        {stale && (
          <Alert tone="caution" title="Saved elsewhere in the meantime">
            <p>{saveError.message}</p>
            <Button variant="secondary" className="mt-2" type="button" onClick={reloadSaved}>
              Load the saved version (drops your unsaved changes)
            </Button>
          </Alert>
        )}
        {saveError && !stale && (
          <Alert tone="error" title="The lesson was not saved">
            {saveError.message}
          </Alert>
        )}
      </div>

      <form id="lesson-form" onSubmit={onSubmit} noValidate>
        <fieldset disabled={readOnly} className="min-w-0">
          <legend className="sr-only">Lesson plan</legend>
          <div className="grid grid-cols-1 gap-6 [grid-template-areas:'top'_'panel'_'bottom'] lg:grid-cols-[minmax(0,1fr)_26rem] lg:[grid-template-areas:'top_panel'_'bottom_panel']">
            <div className="flex min-w-0 flex-col gap-6 [grid-area:top]">
              <Section title="The lesson">
                <div className="grid gap-4 sm:grid-cols-2">
                  <TextField label="Title" {...register("title")} error={errors.title?.message} className="sm:col-span-2" />
                  <TextField
                    label="Class or year group"
                    {...register("classGroup")}
                    error={errors.classGroup?.message}
                    placeholder="e.g. 8K"
                  />
                  <TextField
                    label="Duration (minutes)"
                    type="number"
                    inputMode="numeric"
                    min={LESSON_LIMITS.durationMinutesMin}
                    max={LESSON_LIMITS.durationMinutesMax}
                    {...register("durationMinutes", numberField)}
                    error={errors.durationMinutes?.message}
                  />
                  <Controller
                    control={control}
                    name="diceSetId"
                    render={({ field }) => (
                      <SelectField
                        label="Dice set"
                        hint={
                          sets.isError
                            ? "Your dice sets could not be loaded."
                            : "Your own sets, or sets colleagues share with the department."
                        }
                        value={field.value ?? ""}
                        onChange={(event) => field.onChange(event.target.value === "" ? null : event.target.value)}
                        onBlur={field.onBlur}
                        options={setOptions}
                        error={errors.diceSetId?.message}
                      />
                    )}
                  />
                  <SelectField
                    label="Status"
                    {...register("status")}
                    options={(Object.keys(lessonStatusLabels) as LessonStatus[]).map((value) => ({
                      value,
                      label: lessonStatusLabels[value],
                    }))}
                    error={errors.status?.message}
                  />
                </div>
              </Section>

              <Section title="Learning objectives">
                <ol className="flex flex-col gap-4">
                  {objectives.fields.map((field, index) => (
                    <li key={field.id} className="grid gap-3 rounded-xl border border-line bg-white p-3 md:grid-cols-2">
                      <TextField
                        label={`Objective ${index + 1}`}
                        {...register(`objectives.${index}.text`)}
                        error={errors.objectives?.[index]?.text?.message}
                      />
                      <Controller
                        control={control}
                        name={`objectives.${index}.curriculumCode`}
                        render={({ field: codeField }) => (
                          <CurriculumPicker
                            label={`Curriculum reference for objective ${index + 1}`}
                            value={codeField.value}
                            onChange={codeField.onChange}
                            error={errors.objectives?.[index]?.curriculumCode?.message}
                            disabled={readOnly}
                          />
                        )}
                      />
                      <div className="md:col-span-2">
                        <Button variant="quiet" type="button" className="text-alarm" onClick={() => objectives.remove(index)}>
                          Remove objective {index + 1}
                        </Button>
                      </div>
                    </li>
                  ))}
                </ol>
                {errors.objectives?.message && <p className="font-bold text-alarm">{errors.objectives.message}</p>}
                {objectives.fields.length < LESSON_LIMITS.objectivesMax && (
                  <Button variant="secondary" type="button" className="self-start" onClick={() => objectives.append({ text: "" })}>
                    + Add an objective
                  </Button>
                )}
              </Section>

              <Section title="How the class plays">
                <div className="grid gap-4 sm:grid-cols-2">
                  <Controller
                    control={control}
                    name="mode.dicePerPlayer"
                    render={({ field }) => (
                      <ChoiceGroup
                        legend="Dice per player"
                        value={String(field.value)}
                        options={[
                          { value: "1", label: "One die each" },
                          { value: "2", label: "Two dice each" },
                        ]}
                        onChange={(value) => field.onChange(Number(value))}
                      />
                    )}
                  />
                  <Controller
                    control={control}
                    name="mode.players"
                    render={({ field }) => (
                      <ChoiceGroup
                        legend="Players per game"
                        value={String(field.value)}
                        options={[
                          { value: "2", label: "Two players" },
                          { value: "3", label: "Three players" },
                        ]}
                        onChange={(value) => field.onChange(Number(value))}
                      />
                    )}
                  />
                  <Controller
                    control={control}
                    name="tieRule"
                    render={({ field }) => (
                      <ChoiceGroup
                        legend="Tie rule"
                        className="sm:col-span-2"
                        value={field.value}
                        options={(Object.keys(tieRuleLabels) as (keyof typeof tieRuleLabels)[]).map((value) => ({
                          value,
                          label: tieRuleLabels[value],
                        }))}
                        onChange={field.onChange}
                      />
                    )}
                  />
                  <TextField
                    label="Groups"
                    type="number"
                    inputMode="numeric"
                    min={1}
                    max={LESSON_LIMITS.groupsMax}
                    {...register("groups", numberField)}
                    error={errors.groups?.message}
                  />
                  <TextField
                    label="Pupils per group"
                    type="number"
                    inputMode="numeric"
                    min={LESSON_LIMITS.pupilsPerGroupMin}
                    max={LESSON_LIMITS.pupilsPerGroupMax}
                    {...register("pupilsPerGroup", numberField)}
                    error={errors.pupilsPerGroup?.message}
                  />
                  <TextField
                    label="Rolls per group"
                    hint="Rolls each group records in the Roll phase."
                    type="number"
                    inputMode="numeric"
                    min={1}
                    max={LESSON_LIMITS.rollsPerGroupMax}
                    {...register("rollsPerGroup", numberField)}
                    error={errors.rollsPerGroup?.message}
                  />
                  <Controller
                    control={control}
                    name="matchupChoice"
                    render={({ field }) => (
                      <ChoiceGroup
                        legend="Matchups"
                        value={field.value}
                        options={(Object.keys(matchupChoiceLabels) as (keyof typeof matchupChoiceLabels)[]).map((value) => ({
                          value,
                          label: matchupChoiceLabels[value],
                        }))}
                        onChange={field.onChange}
                      />
                    )}
                  />
                </div>
              </Section>
            </div>

            <aside
              aria-label="Materials and rolls verdict"
              className="flex min-w-0 flex-col gap-4 [grid-area:panel] lg:sticky lg:top-4 lg:self-start"
            >
              <h2 className="text-2xl">Materials and verdict</h2>
              <LiveMaterialsPanel
                state={materials}
                dice={chosenDice}
                tieRule={values.tieRule ?? "re-roll-ties"}
                onUseRolls={readOnly ? undefined : (rolls) => setValue("rollsPerGroup", rolls, { shouldDirty: true, shouldValidate: true })}
                onUseGroups={readOnly ? undefined : (groups) => setValue("groups", groups, { shouldDirty: true, shouldValidate: true })}
                sheetHref={
                  chosenId && values.mode
                    ? (rows) =>
                        `/app/bench/${chosenId}/print?kind=sheet&paper=a4&rolls=${rows}&players=${values.mode!.players}&dice=${values.mode!.dicePerPlayer}`
                    : undefined
                }
              />
            </aside>

            <div className="flex min-w-0 flex-col gap-6 [grid-area:bottom]">
              <Section title="Phases" lead={`Planned: ${totalMinutes} of ${Number(values.durationMinutes) || 0} minutes.`}>
                {totalMinutes > (Number(values.durationMinutes) || 0) && (
                  <Alert tone="caution">The phases add up to more minutes than the lesson lasts.</Alert>
                )}
                <ol className="flex flex-col gap-3">
                  {phases.fields.map((field, index) => {
                    const included = values.phases?.[index]?.included ?? true;
                    return (
                      <li
                        key={field.id}
                        className={`grid gap-3 rounded-xl border p-3 sm:grid-cols-[12rem_minmax(0,1fr)] ${included ? "border-line bg-white" : "border-dashed border-ink/30 bg-sand/50"}`}
                      >
                        <div className="flex flex-col gap-2">
                          <h3 className="text-lg">
                            {index + 1}. {field.phase}
                          </h3>
                          <p className="text-sm text-ink-soft">{phaseHints[field.phase]}</p>
                          <label className="flex min-h-11 items-center gap-2 font-bold">
                            <input type="checkbox" className="h-5 w-5 accent-tide" {...register(`phases.${index}.included`)} />
                            In this lesson
                          </label>
                          <TextField
                            label={`${field.phase} minutes`}
                            type="number"
                            inputMode="numeric"
                            min={0}
                            max={LESSON_LIMITS.phaseMinutesMax}
                            {...register(`phases.${index}.minutes`, numberField)}
                            error={errors.phases?.[index]?.minutes?.message}
                          />
                        </div>
                        <TextArea
                          label={`${field.phase} notes`}
                          rows={4}
                          {...register(`phases.${index}.notes`)}
                          error={errors.phases?.[index]?.notes?.message}
                        />
                      </li>
                    );
                  })}
                </ol>
                <div className="flex flex-col gap-1">
                  <label className="flex min-h-11 items-center gap-2 font-bold">
                    <input
                      type="checkbox"
                      className="h-5 w-5 accent-tide"
                      aria-describedby="hide-exact-hint"
                      {...register("hideExactUntilProve")}
                    />
                    Hide exact values on the Wall until Prove
                  </label>
                  <p id="hide-exact-hint" className="text-sm text-ink-soft">
                    In Guess, Roll and Pool the Wall view shows only the class’s own figures; the exact chances appear from the Prove phase
                    on. The Run board always shows them.
                  </p>
                </div>
              </Section>

              <Section title="Discussion prompts and exit ticket">
                <ol className="flex flex-col gap-3">
                  {prompts.map((_prompt, index) => (
                    <li key={index} className="flex flex-wrap items-end gap-2">
                      <TextField
                        label={`Prompt ${index + 1}`}
                        {...register(`discussionPrompts.${index}`)}
                        error={errors.discussionPrompts?.[index]?.message}
                        className="min-w-0 flex-1"
                      />
                      <Button
                        variant="quiet"
                        type="button"
                        className="text-alarm"
                        onClick={() =>
                          setValue(
                            "discussionPrompts",
                            prompts.filter((_entry, other) => other !== index),
                            { shouldDirty: true, shouldValidate: true },
                          )
                        }
                      >
                        Remove<span className="sr-only"> prompt {index + 1}</span>
                      </Button>
                    </li>
                  ))}
                </ol>
                {prompts.length < LESSON_LIMITS.promptsMax && (
                  <Button
                    variant="secondary"
                    type="button"
                    className="self-start"
                    onClick={() => setValue("discussionPrompts", [...prompts, ""], { shouldDirty: true })}
                  >
                    + Add a prompt
                  </Button>
                )}
                <TextArea
                  label="Exit ticket"
                  hint="One question each pupil answers before leaving. The Wall view shows the prompts and the exit ticket in Reflect."
                  {...register("exitTicket")}
                  error={errors.exitTicket?.message}
                />
              </Section>

              <Section title="Differentiation">
                <div className="grid gap-4 md:grid-cols-2">
                  <TextArea
                    label="Support"
                    rows={4}
                    {...register("differentiation.support")}
                    error={errors.differentiation?.support?.message}
                  />
                  <TextArea
                    label="Stretch"
                    rows={4}
                    {...register("differentiation.stretch")}
                    error={errors.differentiation?.stretch?.message}
                  />
                </div>
                <p className="text-sm text-ink-soft">
                  Write about approaches, not named pupils: notes are seen by colleagues and pupils' names do not belong here.
                </p>
              </Section>
            </div>
          </div>
        </fieldset>
        {!readOnly && (
          <div className="mt-6 flex flex-wrap items-center gap-3">
            <Button type="submit" busy={saving}>
              {saved ? "Save lesson" : "Create lesson"}
            </Button>
            {Object.keys(errors).length > 0 && (
              <p className="font-bold text-alarm">Some fields need attention before the lesson can be saved.</p>
            )}
          </div>
        )}
      </form>

      {saved && (
        <div className="mt-8">
          <AttachmentsPanel lessonId={saved.id} attachments={detail?.attachments ?? ([] as LessonAttachment[])} canEdit={saved.isOwner} />
        </div>
      )}
      {!saved && <p className="mt-8 text-ink-soft">Create the lesson first to attach worksheets and images.</p>}
    </>
  );
}

function Section({ title, lead, children }: { title: string; lead?: string; children: ReactNode }) {
  const id = `section-${title.toLowerCase().replace(/\W+/g, "-")}`;
  return (
    <section aria-labelledby={id} className="flex flex-col gap-4 rounded-2xl border-2 border-line bg-shell p-4 sm:p-5">
      <div>
        <h2 id={id} className="text-2xl">
          {title}
        </h2>
        {lead && <p className="text-ink-soft">{lead}</p>}
      </div>
      {children}
    </section>
  );
}
