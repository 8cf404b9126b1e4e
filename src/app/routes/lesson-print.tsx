import { useParams } from "react-router-dom";
import { Alert } from "@/components/ui/alert";
import { useLesson } from "@/features/lessons/api/get-lesson";
import { LessonPrintView } from "@/features/lessons/components/lesson-print-view";

/** /app/lessons/:id/print */
export function LessonPrintRoute() {
  const { id = "" } = useParams();
  const lesson = useLesson(id);
  if (lesson.isPending) return <p role="status">Loading the lesson…</p>;
  if (lesson.isError) {
    return (
      <Alert tone="error" title="This lesson could not be opened">
        {lesson.error.message}
      </Alert>
    );
  }
  return <LessonPrintView detail={lesson.data} />;
}
