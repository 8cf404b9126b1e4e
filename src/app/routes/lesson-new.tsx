import { emptyLessonInput } from "@shared/schemas/lessons";
import { LessonEditor } from "@/features/lessons/components/lesson-editor";

export function LessonNewRoute() {
  return <LessonEditor initial={{ ...emptyLessonInput(), objectives: [{ text: "" }] }} />;
}
