import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { lessonStatusLabels, type LessonSummary } from "@shared/schemas/lessons";
import { publishTemplateSchema, type PublishTemplateInput } from "@shared/schemas/shelf";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { SelectField } from "@/components/ui/select-field";
import { TextArea } from "@/components/ui/text-area";
import { useOwnLessons } from "../api/list-own-lessons";

type PublishLessonFormProps = {
  title: string;
  submitLabel: string;
  notePlaceholder: string;
  busy: boolean;
  error: Error | null;
  onSubmit: (values: PublishTemplateInput) => void;
};

function PublishFields({
  lessons,
  title,
  submitLabel,
  notePlaceholder,
  busy,
  error,
  onSubmit,
}: PublishLessonFormProps & { lessons: LessonSummary[] }) {
  const { register, handleSubmit, formState } = useForm<PublishTemplateInput>({
    resolver: zodResolver(publishTemplateSchema),
    defaultValues: { lessonId: lessons[0]?.id ?? "", changeNote: "" },
  });
  const options = lessons.map((lesson) => ({
    value: lesson.id,
    label: `${lesson.title}${lesson.classGroup ? ` · ${lesson.classGroup}` : ""} (${lessonStatusLabels[lesson.status]})`,
  }));
  return (
    <form onSubmit={handleSubmit(onSubmit)} noValidate aria-label={title} className="flex flex-col gap-4">
      {error && (
        <Alert tone="error" title="Not published">
          {error.message}
        </Alert>
      )}
      <SelectField
        label="Lesson to publish"
        hint="A frozen copy goes on the shelf; later edits to your lesson change nothing there until you publish again."
        options={options}
        {...register("lessonId")}
        error={formState.errors.lessonId?.message}
      />
      <TextArea
        label="Change note"
        rows={2}
        placeholder={notePlaceholder}
        {...register("changeNote")}
        error={formState.errors.changeNote?.message}
      />
      <div>
        <Button type="submit" busy={busy}>
          {submitLabel}
        </Button>
      </div>
    </form>
  );
}

/**
 * Picks one of the head's own lessons and a change note: used both to publish a new template and to publish a template's
 * next version (the same schema checks both).
 */
export function PublishLessonForm(props: PublishLessonFormProps) {
  const lessons = useOwnLessons();
  if (lessons.isPending) return <p role="status">Loading your lessons…</p>;
  if (lessons.isError) {
    return (
      <Alert tone="error" title="Your lessons could not be loaded">
        {lessons.error.message}
      </Alert>
    );
  }
  if (lessons.data.lessons.length === 0) {
    return <p className="text-ink-soft">You have no lessons yet. Plan one under Lessons first, then publish it here.</p>;
  }
  return <PublishFields lessons={lessons.data.lessons} {...props} />;
}
