import { useRef } from "react";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { Link, useNavigate } from "react-router-dom";
import { paperRunInputSchema, type PaperRunInput } from "@shared/schemas/results";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { PageHeader } from "@/components/ui/page-header";
import { SelectField } from "@/components/ui/select-field";
import { TextField } from "@/components/ui/text-field";
import { useCreatePaperRun } from "../api/create-paper-run";
import { usePaperRunLessons } from "../api/list-paper-run-lessons";
import { PupilDataNote } from "./pupil-data-note";

/** For a lesson taught without phones: makes a closed run from one of the teacher's lessons, then opens its Paper import. */
export function NewPaperRunPage() {
  const navigate = useNavigate();
  const lessons = usePaperRunLessons();
  const create = useCreatePaperRun();
  const { register, handleSubmit, formState, watch } = useForm<PaperRunInput>({
    resolver: zodResolver(paperRunInputSchema),
    defaultValues: { lessonId: "" },
  });
  const chosen = lessons.data?.lessons.find((lesson) => lesson.id === watch("lessonId"));
  // Which button sent the form: the tally grid (type the sheets in) or Paper import (upload a CSV file).
  const next = useRef<"tally-grid" | "paper-import">("tally-grid");
  const submit = handleSubmit((values) =>
    create.mutate(values, { onSuccess: (run) => navigate(`/app/results/${run.id}/${next.current}`) }),
  );

  return (
    <>
      <p className="mb-2">
        <Link to="/app/results" className="font-bold text-tide-dark underline underline-offset-2">
          ← Results
        </Link>
      </p>
      <PageHeader
        title="Paper import for a lesson"
        lead="Taught a lesson with the printed recording sheets instead of phones? Choose the lesson, the class and the day; Outroll makes a closed run with the lesson's dice and mode. Then type each group's sheet into the tally grid, or upload the sheets typed up as a CSV file. To add paper sheets to a run pupils recorded on phones, open that run's results instead."
      />
      {lessons.isPending && <p role="status">Loading your lessons…</p>}
      {lessons.isError && (
        <Alert tone="error" title="Your lessons could not be loaded">
          {lessons.error.message}
        </Alert>
      )}
      {lessons.data && lessons.data.lessons.length === 0 && (
        <Alert tone="info" title="No lessons yet">
          Plan a lesson in Lessons first; its dice set and mode decide what the sheets may hold.
        </Alert>
      )}
      {lessons.data && lessons.data.lessons.length > 0 && (
        <form
          onSubmit={submit}
          noValidate
          className="flex max-w-xl flex-col gap-4 rounded-2xl border-2 border-line bg-shell p-4"
          aria-label="New paper run"
        >
          {create.error && (
            <Alert tone="error" title="The run was not made">
              {create.error.message}
            </Alert>
          )}
          <SelectField
            label="Lesson"
            {...register("lessonId")}
            error={formState.errors.lessonId?.message}
            options={[
              { value: "", label: "Choose a lesson" },
              ...lessons.data.lessons.map((lesson) => ({
                value: lesson.id,
                label: `${lesson.title}${lesson.classGroup ? ` (${lesson.classGroup})` : ""}${lesson.ready ? "" : " — not ready"}`,
              })),
            ]}
          />
          {chosen && !chosen.ready && <p className="font-bold text-alarm">{chosen.reason}</p>}
          {chosen?.ready && <p className="text-ink-soft">Dice set: {chosen.diceSetName}</p>}
          <TextField
            label="Class"
            hint={
              chosen?.classGroup
                ? `Leave empty for the lesson's class, ${chosen.classGroup}; type another to record a second class under its own name.`
                : "The class that was taught, e.g. 9M."
            }
            maxLength={40}
            {...register("classGroup", { setValueAs: (value: string) => (value.trim() === "" ? undefined : value) })}
            error={formState.errors.classGroup?.message}
          />
          <TextField
            label="Day the lesson was taught"
            type="date"
            hint="Leave empty for today."
            {...register("taughtOn", { setValueAs: (value: string) => (value === "" ? undefined : value) })}
            error={formState.errors.taughtOn?.message}
          />
          <div className="flex flex-wrap gap-3">
            <Button
              type="submit"
              busy={create.isPending}
              disabled={chosen !== undefined && !chosen.ready}
              onClick={() => (next.current = "tally-grid")}
            >
              Make the run and open the tally grid
            </Button>
            <Button
              type="submit"
              variant="secondary"
              busy={create.isPending}
              disabled={chosen !== undefined && !chosen.ready}
              onClick={() => (next.current = "paper-import")}
            >
              Make the run and go to Paper import
            </Button>
          </div>
        </form>
      )}
      <div className="mt-8 max-w-3xl">
        <PupilDataNote />
      </div>
    </>
  );
}
