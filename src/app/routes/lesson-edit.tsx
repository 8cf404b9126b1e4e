import { useLocation, useParams } from "react-router-dom";
import { Alert } from "@/components/ui/alert";
import { LinkButton } from "@/components/ui/link-button";
import { useLesson } from "@/features/lessons/api/get-lesson";
import { LessonEditor, lessonInputOf } from "@/features/lessons/components/lesson-editor";

/** One lesson: its owner edits it; the head of department reads it. */
export function LessonEditRoute() {
  const { id = "" } = useParams();
  const location = useLocation();
  const lesson = useLesson(id);
  const notice = (location.state as { notice?: string } | null)?.notice;
  if (lesson.isPending) return <p role="status">Loading the lesson…</p>;
  if (lesson.isError) {
    return (
      <div className="flex max-w-2xl flex-col gap-4">
        <Alert tone="error" title="This lesson could not be opened">
          {lesson.error.message}
        </Alert>
        <LinkButton to="/app/lessons">Back to your lessons</LinkButton>
      </div>
    );
  }
  // Keyed on the id, so opening another lesson starts the form afresh.
  return <LessonEditor key={lesson.data.lesson.id} initial={lessonInputOf(lesson.data.lesson)} detail={lesson.data} notice={notice} />;
}
