import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { lessonStatusLabels, type LessonSummary } from "@shared/schemas/lessons";
import { proposeLessonSchema, type ProposeLessonInput } from "@shared/schemas/shelf";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { SelectField } from "@/components/ui/select-field";
import { TextArea } from "@/components/ui/text-area";
import { useOwnLessons } from "../api/list-own-lessons";
import { useProposeLesson } from "../api/propose-lesson";

function ProposeFields({ lessons }: { lessons: LessonSummary[] }) {
  const propose = useProposeLesson();
  const { register, handleSubmit, formState, reset } = useForm<ProposeLessonInput>({
    resolver: zodResolver(proposeLessonSchema),
    defaultValues: { lessonId: lessons[0]?.id ?? "", note: "" },
  });
  const options = lessons.map((lesson) => ({
    value: lesson.id,
    label: `${lesson.title}${lesson.classGroup ? ` · ${lesson.classGroup}` : ""} (${lessonStatusLabels[lesson.status]})`,
  }));
  const submit = handleSubmit((values) => propose.mutate(values, { onSuccess: () => reset({ lessonId: values.lessonId, note: "" }) }));
  return (
    <form onSubmit={submit} noValidate aria-label="Propose a lesson for the shelf" className="flex flex-col gap-4">
      {propose.error && (
        <Alert tone="error" title="Not proposed">
          {propose.error.message}
        </Alert>
      )}
      {propose.isSuccess && (
        <Alert tone="info" title="Proposed">
          Your head of department will see it in their queue. You can follow it below.
        </Alert>
      )}
      <SelectField label="Lesson to propose" options={options} {...register("lessonId")} error={formState.errors.lessonId?.message} />
      <TextArea
        label="Note for your head of department"
        hint="Optional: what worked, which class it suits."
        rows={2}
        {...register("note")}
        error={formState.errors.note?.message}
      />
      <div>
        <Button type="submit" busy={propose.isPending}>
          Propose for the shelf
        </Button>
      </div>
    </form>
  );
}

/** "Propose for the shelf": a teacher offers one of their lessons to the head of department, with a note. */
export function ProposeLessonForm() {
  const lessons = useOwnLessons();
  if (lessons.isPending) return <p role="status">Loading your lessons…</p>;
  if (lessons.isError) {
    return (
      <Alert tone="error" title="Your lessons could not be loaded">
        {lessons.error.message}
      </Alert>
    );
  }
  if (lessons.data.lessons.length === 0) return <p className="text-ink-soft">You have no lessons yet. Plan one under Lessons first.</p>;
  return <ProposeFields lessons={lessons.data.lessons} />;
}
